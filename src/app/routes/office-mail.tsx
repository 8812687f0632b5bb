import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { MAIL_STATES, type MailState } from '../../../shared/allowed-values';
import { MAIL_OUTBOX_PAGE_SIZE, MAIL_STATE_LABELS, type OutboxMessage } from '../../../shared/schemas/mail-outbox';
import { Button } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useMailOutbox } from '../../features/office/api/get-mail-outbox';
import { useResendMail } from '../../features/office/api/resend-mail';
import { MailOutboxTable } from '../../features/office/components/mail-outbox-table';
import { OfficeGate, OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { officeAccess } from '../../features/office/lib/office-access';

const isState = (v: string | null): v is MailState => (MAIL_STATES as readonly string[]).includes(v ?? '');

const chip = (active: boolean) =>
  `inline-flex min-h-10 items-center gap-2 rounded-full border px-3 font-semibold ${active ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white text-ink hover:border-temper'}`;

function Outbox() {
  // The filter and page live in the address, so a reload or a shared link shows the same list.
  const [params, setParams] = useSearchParams();
  const stateParam = params.get('state');
  const state = isState(stateParam) ? stateParam : null;
  const page = Math.max(0, Number(params.get('page')) || 0);
  const list = useMailOutbox(state, page);
  const resend = useResendMail();
  const [done, setDone] = useState<string | null>(null);
  const [pendingId, setPendingId] = useState<number | null>(null);

  const go = (next: { state?: MailState | null; page?: number }) => {
    const s = next.state === undefined ? state : next.state;
    const p = next.page ?? 0;
    setParams({ ...(s ? { state: s } : {}), ...(p > 0 ? { page: String(p) } : {}) });
  };
  const onResend = (m: OutboxMessage) => {
    setPendingId(m.id);
    setDone(null);
    resend.mutate(m.id, {
      onSuccess: () => setDone(`"${m.subject}" to ${m.recipient} is queued and goes with the next round.`),
      onSettled: () => setPendingId(null),
    });
  };

  if (list.isPending) return <LoadingState label="Loading the outbox…" />;
  if (list.isError) return <ErrorState title="The outbox did not load" message={list.error.message} onRetry={() => list.refetch()} />;
  const { messages, counts, total } = list.data;
  const all = counts.queued + counts.sending + counts.sent + counts.failed;
  const pages = Math.max(1, Math.ceil(total / MAIL_OUTBOX_PAGE_SIZE));

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <div role="group" aria-label="Show messages" className="flex flex-wrap gap-2">
        <button type="button" className={chip(state === null)} aria-pressed={state === null} onClick={() => go({ state: null })}>
          All <span className="tabular text-cast">{all}</span>
        </button>
        {MAIL_STATES.map((s) => (
          <button key={s} type="button" className={chip(state === s)} aria-pressed={state === s} onClick={() => go({ state: s })}>
            {MAIL_STATE_LABELS[s]} <span className="tabular text-cast">{counts[s]}</span>
          </button>
        ))}
      </div>
      <div role="status">
        {done && (
          <Notice tone="done" live="off">
            <span className="font-semibold">Queued again. </span>
            {done}
          </Notice>
        )}
      </div>
      {resend.isError && <ErrorState title="Not queued" message={resend.error.message} />}
      {messages.length === 0 ? (
        <EmptyState title={state ? `No messages ${MAIL_STATE_LABELS[state].toLowerCase()}` : 'No mail yet'}>
          {state === 'failed' ? 'Every message has gone or is still being tried.' : 'Order confirmations, dispatch notices, reset links and the rest appear here as they are written.'}
        </EmptyState>
      ) : (
        <MailOutboxTable messages={messages} onResend={onResend} pendingId={pendingId} />
      )}
      {pages > 1 && (
        <nav aria-label="Pages" className="flex items-center gap-3">
          <Button variant="secondary" disabled={page === 0} onClick={() => go({ page: page - 1 })}>
            Newer
          </Button>
          <span className="tabular text-cast">
            Page {page + 1} of {pages}
          </span>
          <Button variant="secondary" disabled={page + 1 >= pages} onClick={() => go({ page: page + 1 })}>
            Older
          </Button>
        </nav>
      )}
    </div>
  );
}

export function OfficeMailRoute() {
  const me = useMe();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
        <OfficeNav />
        <OfficePageHeader title="Mail">
          Every e-mail the shop sends waits here until the mail server takes it. One that cannot go is tried
          again, further apart each time, and after the last try shows as gave up with the reason. Send again
          queues it once more.
        </OfficePageHeader>
        <Outbox />
      </div>
    </OfficeGate>
  );
}
