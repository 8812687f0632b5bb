import { ListChecks } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useCreateList } from '../api/create-list';
import { useLists } from '../api/get-lists';

/** The trade account's lists with a form to start one. */
export function ListsIndex({ companyName }: { companyName: string }) {
  const lists = useLists(true);
  const create = useCreateList();
  const [name, setName] = useState('');
  const [error, setError] = useState<string | undefined>();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!name.trim()) return setError('give the list a name');
    setError(undefined);
    create.mutate(name.trim(), { onSuccess: () => setName('') });
  };
  return (
    <div className="grid gap-6">
      <p className="max-w-2xl text-cast">
        Lists you keep for re-buying: van stock, a season rebuild kit, a customer’s job. Everyone at <span className="font-semibold text-ink">{companyName}</span> sees and
        edits the same lists. Add to them from a part page, your cart or a past order, and order all of a list or part of it.
      </p>
      <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-3" aria-label="Start a list">
        <div className="w-full max-w-xs">
          <TextField id="new-list-name" label="New list" placeholder="e.g. van stock" maxLength={60} value={name} onChange={(e) => setName(e.target.value)} error={error} />
        </div>
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Starting…' : 'Start list'}
        </Button>
      </form>
      {create.isError && (
        <Notice tone="problem" live="alert">
          {create.error.message}
        </Notice>
      )}
      {lists.isPending ? (
        <LoadingState label="Loading your lists…" />
      ) : lists.isError ? (
        <ErrorState title="Your lists did not load" message={lists.error.message} onRetry={() => lists.refetch()} />
      ) : lists.data.items.length === 0 ? (
        <EmptyState title="No lists yet">Start one above, or use “Save to a list” on a part page, in your cart or on a past order.</EmptyState>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" aria-label="Lists">
          {lists.data.items.map((l) => (
            <li key={l.id} className="rounded-lg bg-white p-4 shadow-sm ring-1 ring-cast-line">
              <Link to={`/trade/lists/${l.id}`} className="inline-flex items-center gap-2 text-lg font-bold text-temper hover:underline">
                <ListChecks aria-hidden className="size-5" />
                {l.name}
              </Link>
              <p className="tabular">
                {l.lineCount} {l.lineCount === 1 ? 'line' : 'lines'} · {l.unitCount} {l.unitCount === 1 ? 'unit' : 'units'}
              </p>
              <p className="text-sm text-cast">
                Changed <time dateTime={l.updatedAt}>{formatDateTime(l.updatedAt)}</time>
                {l.updatedByName && <> by {l.updatedByName}</>}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
