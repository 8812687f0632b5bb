import { Link } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export function ForgotPasswordRoute() {
  const me = useMe();
  const devTools = Boolean(me.data?.payments.testMethods || me.data?.demoAccounts);
  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <div>
        <h1 className="text-3xl font-bold">Forgot your password</h1>
        <p className="mt-1 text-cast">Tell us the e-mail address on your account and we send a link to choose a new password.</p>
      </div>
      <ForgotPasswordForm
        inboxHint={
          devTools && (
            <p className="mt-2 text-sm">
              Development: an administrator can read the message in the{' '}
              <Link to="/dev/inbox" className="font-semibold text-temper underline underline-offset-2">
                caught-mail inbox
              </Link>
              .
            </p>
          )
        }
      />
      <p>
        <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
          Back to sign in
        </Link>
      </p>
    </div>
  );
}
