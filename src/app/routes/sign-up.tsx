import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { safeNextPath, signInHref } from '../../features/auth/next-path';
import { Notice } from '../../components/ui/notice';

export function SignUpRoute() {
  const [params] = useSearchParams();
  const nextParam = params.get('next');
  const next = safeNextPath(nextParam, '/account');
  // The account is used once its address is confirmed: the mailed link signs it in and opens `next`, where a
  // guest cart joins it as at sign-in. The answer says the same for an address that already has an account.
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);

  if (sent) {
    return (
      <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-4">
        <h1 className="text-3xl font-bold">Check your e-mail</h1>
        <Notice tone="done" title={`We have sent a message to ${sent.email}.`}>
          <p className="mt-1 text-ink">{sent.message}</p>
        </Notice>
        <p className="text-cast">The link in it works for 24 hours. You can close this page.</p>
      </div>
    );
  }

  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <div>
        <h1 className="text-3xl font-bold">Create an account</h1>
        <p className="mt-1 text-cast">
          A retail account keeps your orders and saved fitment checks. Workshops and resellers can apply for a trade account once signed in.
        </p>
      </div>
      <SignUpForm onSignedUp={(email, message) => setSent({ email, message })} signInHref={nextParam ? signInHref(next) : '/sign-in'} next={next} />
    </div>
  );
}
