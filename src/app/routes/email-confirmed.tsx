import { Link, Navigate, useSearchParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { ResendConfirmationForm } from '../../features/auth/components/resend-confirmation-form';
import { confirmLinkProblem } from '../../features/auth/confirm-link';
import { safeNextPath, signInHref } from '../../features/auth/next-path';

/** Where a mailed confirmation link lands: on to the page the buyer was headed for, or what went wrong and a new link. */
export function EmailConfirmedRoute() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  const error = params.get('error');
  const me = useMe();

  if (!error) {
    if (me.isPending) return <LoadingState label="Signing you in…" />;
    if (me.isError) return <ErrorState message={me.error.message} onRetry={() => me.refetch()} />;
    // The link signs the new account in; straight on to where the buyer was going.
    if (me.data.user) return <Navigate to={next} replace />;
    return (
      <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
        <h1 className="text-3xl font-bold">Address confirmed</h1>
        <Notice tone="done">This address was already confirmed. Sign in to carry on.</Notice>
        <p>
          <Link to={signInHref(next)} className={buttonClass('primary', 'lg')}>
            Sign in
          </Link>
        </p>
      </div>
    );
  }

  const problem = confirmLinkProblem(error);
  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <h1 className="text-3xl font-bold">{problem.title}</h1>
      <Notice tone="warning" live="off">
        {problem.why} Nothing has changed on your account. Ask for a new link below and use the newest e-mail.
      </Notice>
      <section aria-labelledby="resend-heading" className="grid gap-3">
        <h2 id="resend-heading" className="text-xl font-bold">
          Send a new link
        </h2>
        <ResendConfirmationForm next={next} />
      </section>
      <p className="text-cast">
        Already confirmed?{' '}
        <Link to={signInHref(next)} className="font-semibold text-temper underline underline-offset-2">
          Sign in
        </Link>
        .
      </p>
    </div>
  );
}
