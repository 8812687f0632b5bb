import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { ErrorState } from '../../components/ui/states';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

const askAgain = (
  <Link to="/forgot-password" className="font-semibold text-temper underline underline-offset-2">
    Ask for a new link
  </Link>
);

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const linkError = params.get('error');
  const [done, setDone] = useState(false);

  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <h1 className="text-3xl font-bold">Choose a new password</h1>
      {done ? (
        <Notice tone="done" title="Password changed">
          <p className="text-ink">Sign in with the new password. Anywhere you were still signed in has been signed out.</p>
          <Link to="/sign-in" className={`${buttonClass('primary')} mt-3`}>
            Sign in
          </Link>
        </Notice>
      ) : !token || linkError ? (
        <div>
          <ErrorState
            title={linkError ? 'This reset link does not work any more' : 'This page needs the link from the e-mail'}
            message={
              linkError
                ? 'Reset links work once and for one hour. Ask for a new one and use the newest e-mail.'
                : 'Open the link in the password-reset e-mail we sent you, or ask for a new one.'
            }
          />
          {askAgain}
        </div>
      ) : (
        <>
          <p className="text-cast">Pick a password you do not use anywhere else.</p>
          <ResetPasswordForm token={token} onDone={() => setDone(true)} expiredHelp={<p className="mt-1">{askAgain}</p>} />
        </>
      )}
    </div>
  );
}
