import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { PASSWORD_MIN } from '../../../../shared/schemas/accounts';
import { SignUpSchema, type SignUp } from '../../../../shared/schemas/sign-up';
import { buttonClass } from '../../../components/ui/button';
import { useSignUp } from '../api/sign-up';
import { authErrorMessage } from '../auth-errors';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, TextField } from '../../../components/ui/form';

const FIELDS = [
  { name: 'name', id: 'sign-up-name', label: 'Your name' },
  { name: 'email', id: 'sign-up-email', label: 'E-mail address' },
  { name: 'password', id: 'sign-up-password', label: 'Password' },
] as const;

export function SignUpForm({ onSignedUp, signInHref, next }: { onSignedUp: (email: string, message: string) => void; signInHref: string; next: string }) {
  const form = useForm<SignUp>({ shouldFocusError: false, resolver: zodResolver(SignUpSchema), defaultValues: { name: '', email: '', password: '' } });
  const signUp = useSignUp();
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  const onSubmit = summary.handleSubmit(
    (values) => {
      signUp.mutate({ ...values, callbackURL: next }, { onSuccess: (reply) => onSignedUp(values.email, reply.message), onError: (error) => summary.showServerError(error, authErrorMessage(error, 'sign-up')) });
    },
    () => signUp.reset(),
  );

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4" aria-label="Create an account">
      {summary.shown && <ErrorSummary {...summary.props} />}
      <TextField id="sign-up-name" label="Your name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
      <TextField
        id="sign-up-email"
        label="E-mail address"
        type="email"
        autoComplete="email"
        hint="Order confirmations and password-reset links go here."
        error={errors.email?.message}
        {...form.register('email')}
      />
      <TextField
        id="sign-up-password"
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters, and not a common password. A few unusual words are easier to remember than a jumble.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" className={buttonClass('primary', 'lg')} disabled={signUp.isPending}>
          {signUp.isPending ? 'Creating your account…' : 'Create account'}
        </button>
        <p className="text-cast">
          Already have one?{' '}
          <Link to={signInHref} className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>
        </p>
      </div>
    </form>
  );
}
