import { Mail, RefreshCw } from 'lucide-react';
import { Tab, TabList, TabPanel, Tabs } from 'react-aria-components';
import type { CaughtMail } from '../../../../shared/schemas/dev-mail';
import { formatDateTime } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useMail } from '../api/get-mail';


const tabClass =
  'cursor-pointer rounded-t-md border border-b-0 border-transparent px-4 py-2 font-semibold text-cast outline-none data-[selected]:border-cast-line data-[selected]:bg-white data-[selected]:text-ink data-[focus-visible]:outline-3 data-[focus-visible]:outline-temper';

/** Links from the text part, so a developer can follow a reset or order link the sandboxed HTML cannot open. */
function linksIn(text: string | null): string[] {
  return [...new Set(text?.match(/https?:\/\/[^\s<>"]+/g) ?? [])];
}

function Reader({ message }: { message: CaughtMail }) {
  const links = linksIn(message.text);
  return (
    <article aria-labelledby="mail-subject" className="grid gap-3 rounded-md border border-cast-line bg-white p-4">
      <h2 id="mail-subject" className="text-xl font-bold">
        {message.subject || '(no subject)'}
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        <dt className="font-semibold text-cast">From</dt>
        <dd className="break-all">{message.from ?? '—'}</dd>
        <dt className="font-semibold text-cast">To</dt>
        <dd className="break-all">{message.to.join(', ')}</dd>
        <dt className="font-semibold text-cast">Date</dt>
        <dd>{formatDateTime(message.date)}</dd>
      </dl>
      {links.length > 0 && (
        <div className="text-sm">
          <p className="font-semibold text-cast">Links in this message</p>
          <ul className="grid gap-0.5">
            {links.map((href) => (
              <li key={href}>
                <a href={href} className="break-all text-temper underline underline-offset-2">
                  {href}
                </a>
              </li>
            ))}
          </ul>
        </div>
      )}
      <Tabs defaultSelectedKey={message.html ? 'html' : 'text'}>
        <TabList aria-label="Message parts" className="flex gap-1 border-b border-cast-line">
          <Tab id="html" className={tabClass}>
            HTML part
          </Tab>
          <Tab id="text" className={tabClass}>
            Text part
          </Tab>
        </TabList>
        <TabPanel id="html" className="pt-3 outline-none">
          {message.html ? (
            // sandbox="" runs no script, submits no form and treats the message as a foreign origin.
            <iframe title={`HTML part of “${message.subject}”`} sandbox="" srcDoc={message.html} className="h-[36rem] w-full rounded border border-cast-line bg-white" />
          ) : (
            <p className="text-cast">This message has no HTML part.</p>
          )}
        </TabPanel>
        <TabPanel id="text" className="pt-3 outline-none">
          {message.text ? (
            <pre className="max-h-[36rem] overflow-auto rounded bg-paper p-3 font-mono text-sm whitespace-pre-wrap break-words">{message.text}</pre>
          ) : (
            <p className="text-cast">This message has no text part.</p>
          )}
        </TabPanel>
      </Tabs>
    </article>
  );
}

/** The development mail catcher's messages, newest first, with a reader for the selected one. */
export function MailInbox({ selectedId, onSelect }: { selectedId: string | null; onSelect: (id: string | null) => void }) {
  const mail = useMail();
  const refresh = (
    <Button variant="secondary" onClick={() => void mail.refetch()} disabled={mail.isFetching}>
      <RefreshCw aria-hidden className={`size-4 ${mail.isFetching ? 'animate-spin' : ''}`} />
      {mail.isFetching ? 'Refreshing…' : 'Refresh'}
    </Button>
  );

  if (mail.isPending) return <LoadingState label="Loading caught mail…" />;
  if (mail.isError) {
    const off = mail.error instanceof ApiError && mail.error.isNotFound;
    const refused = mail.error instanceof ApiError && (mail.error.status === 401 || mail.error.status === 403);
    return (
      <ErrorState
        title={off ? 'The inbox is off on this server' : refused ? 'The inbox is for administrators' : 'The inbox did not load'}
        message={off ? 'Development tools are switched off here (production), so no mail is caught.' : refused ? 'Sign in with an administrator account to read caught mail.' : mail.error.message}
        onRetry={off ? undefined : () => void mail.refetch()}
      />
    );
  }
  const messages = mail.data;
  const selected = messages.find((m) => m.id === selectedId) ?? null;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-cast" role="status">
          <span className="tabular font-semibold text-ink">{messages.length}</span> {messages.length === 1 ? 'message' : 'messages'} caught
        </p>
        {refresh}
      </div>
      {messages.length === 0 ? (
        <EmptyState title="No mail caught yet">Sign up, ask for a password reset, apply for a trade account or place an order: the mail the app sends shows up here.</EmptyState>
      ) : (
        <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <ul aria-label="Caught messages, newest first" className="grid max-h-[44rem] overflow-auto rounded-md border border-cast-line bg-white">
            {messages.map((m) => {
              const current = m.id === selected?.id;
              return (
                <li key={m.id} className="border-b border-cast-line last:border-b-0">
                  <button
                    type="button"
                    aria-current={current ? 'true' : undefined}
                    onClick={() => onSelect(m.id)}
                    className={`grid w-full gap-0.5 px-3 py-2 text-left hover:bg-temper-tint ${current ? 'border-l-4 border-temper bg-temper-tint' : 'border-l-4 border-transparent'}`}
                  >
                    <span className="flex items-center gap-2 font-semibold">
                      <Mail aria-hidden className="size-4 shrink-0 text-temper" />
                      {m.subject || '(no subject)'}
                    </span>
                    <span className="text-sm break-all text-cast">To {m.to.join(', ')}</span>
                    <span className="text-sm text-cast">{formatDateTime(m.date)}</span>
                  </button>
                </li>
              );
            })}
          </ul>
          {selected ? (
            <Reader key={selected.id} message={selected} />
          ) : (
            <p className="rounded-md border border-dashed border-cast-line p-6 text-cast">Choose a message to read its text and HTML parts.</p>
          )}
        </div>
      )}
    </div>
  );
}
