import { Link, useSearchParams } from 'react-router-dom';
import { Caution } from '../../components/ui/caution';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { signInHref } from '../../features/auth/next-path';
import { MailInbox } from '../../features/dev/components/mail-inbox';

/** The inbox holds every account's mail, reset links included, so the server opens it to an administrator only. */
function AdminsOnly({ signedIn }: { signedIn: boolean }) {
  return (
    <div role="alert" className="rounded-md border-2 border-oxide bg-oxide-tint p-5">
      <h2 className="text-xl font-bold">For administrators only</h2>
      <p className="mt-1">
        The caught mail holds every account's messages, password-reset links included, so even on a development machine only an administrator may read it.
        {signedIn ? ' Your account is not an administrator account.' : ' Sign in with an administrator account (the development ones are listed on the sign-in page).'}
      </p>
      {!signedIn && (
        <p className="mt-2">
          <Link to={signInHref('/dev/inbox')} className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>
        </p>
      )}
    </div>
  );
}

export function DevInboxRoute() {
  const [params, setParams] = useSearchParams();
  const me = useMe();
  const role = me.data?.user?.role;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <div>
        <h1 className="text-3xl font-bold">Development inbox</h1>
        <p className="mt-1 text-cast">Every e-mail the app sends on this machine, caught by the local mail server instead of being delivered.</p>
      </div>
      <Caution title="Development only">
        Nothing here leaves this machine, and only a signed-in administrator can read it. Production has no inbox page and no{' '}
        <code className="font-mono">/api/dev/mail</code>; mail goes to the real mail service there, and the Office's Mail screen shows what went.
      </Caution>
      {me.isPending ? (
        <LoadingState />
      ) : role === 'admin' ? (
        <MailInbox selectedId={params.get('id')} onSelect={(id) => setParams(id ? { id } : {}, { replace: true })} />
      ) : (
        <AdminsOnly signedIn={Boolean(role)} />
      )}
    </div>
  );
}
