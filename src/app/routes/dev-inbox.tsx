import { useSearchParams } from 'react-router-dom';
import { Caution } from '../../components/ui/caution';
import { MailInbox } from '../../features/dev/components/mail-inbox';

export function DevInboxRoute() {
  const [params, setParams] = useSearchParams();
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <div>
        <h1 className="text-3xl font-bold">Development inbox</h1>
        <p className="mt-1 text-cast">Every e-mail the app sends on this machine, caught by the local mail server instead of being delivered.</p>
      </div>
      <Caution title="Development only">
        Nothing here leaves this machine. Production has no inbox page and no <code className="font-mono">/api/dev/mail</code>; mail goes to the real mail
        service there.
      </Caution>
      <MailInbox selectedId={params.get('id')} onSelect={(id) => setParams(id ? { id } : {}, { replace: true })} />
    </div>
  );
}
