import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { RotateCcw } from 'lucide-react';
import { formatDateTime } from '../../../../shared/format';
import { MAIL_KIND_LABELS, type OutboxMessage } from '../../../../shared/schemas/mail-outbox';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { DataTable } from '../../../components/ui/table';

/** Breaks a long address after the @ rather than anywhere. */
function Address({ email }: { email: string }) {
  const at = email.indexOf('@');
  if (at < 0) return <span className="break-all">{email || '—'}</span>;
  return (
    <span>
      {email.slice(0, at)}
      <wbr />
      {email.slice(at)}
    </span>
  );
}

function When({ message }: { message: OutboxMessage }) {
  return (
    <span className="block text-sm">
      <span className="block whitespace-nowrap">Written {formatDateTime(message.createdAt)}</span>
      {message.sentAt && <span className="block whitespace-nowrap text-machined">Sent {formatDateTime(message.sentAt)}</span>}
      {message.nextAttemptAt && message.attempts > 0 && <span className="block whitespace-nowrap text-amber">Next try {formatDateTime(message.nextAttemptAt)}</span>}
    </span>
  );
}

const col = createColumnHelper<OutboxMessage>();
const columns = [
  col.accessor('state', { header: 'State', enableSorting: false, cell: (c) => <StatusBadge kind="mail" status={c.getValue()} /> }),
  col.accessor('subject', {
    header: 'Message',
    enableSorting: false,
    cell: (c) => (
      <span className="block min-w-48">
        <span className="block font-semibold">{c.getValue()}</span>
        <span className="block text-sm text-cast">{MAIL_KIND_LABELS[c.row.original.kind]}</span>
      </span>
    ),
  }),
  col.accessor('recipient', { header: 'To', enableSorting: false, cell: (c) => <Address email={c.getValue()} /> }),
  col.accessor('attempts', { header: 'Attempts', enableSorting: false, meta: { numeric: true } }),
  col.accessor('lastError', {
    header: 'Last error',
    enableSorting: false,
    cell: (c) => {
      const error = c.getValue();
      return error ? <span className="block max-w-64 text-sm break-words text-oxide">{error}</span> : <span className="text-cast">—</span>;
    },
  }),
  col.accessor('createdAt', { header: 'Times', enableSorting: false, cell: (c) => <When message={c.row.original} /> }),
];

export function MailOutboxTable({ messages, onResend, pendingId }: { messages: OutboxMessage[]; onResend: (m: OutboxMessage) => void; pendingId: number | null }) {
  const table = useReactTable({ data: messages, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => String(r.id) });
  return (
    <DataTable
      table={table}
      caption="Outgoing e-mail, newest first"
      maxHeight="max-h-[70vh]"
      unsortedAsNone
      actions={{
        label: 'Actions',
        cell: (row) =>
          row.original.resendable ? (
            <Button
              variant="secondary"
              className="whitespace-nowrap"
              onClick={() => onResend(row.original)}
              disabled={pendingId === row.original.id}
              aria-label={`${row.original.state === 'queued' ? 'Send now' : 'Send again'}: ${row.original.subject} to ${row.original.recipient}`}
            >
              <RotateCcw aria-hidden className="size-4" />
              {/* A waiting message is not sent twice: it only stops waiting for its next try. */}
              {row.original.state === 'queued' ? 'Send now' : 'Send again'}
            </Button>
          ) : (row.original.kind === 'password-reset' || row.original.kind === 'account-confirm') && row.original.state === 'sent' ? (
            <span className="block max-w-40 text-sm text-cast">{row.original.kind === 'password-reset' ? 'Reset' : 'Confirmation'} links are not kept once sent</span>
          ) : null,
      }}
    />
  );
}
