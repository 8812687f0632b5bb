import { ListPlus } from 'lucide-react';
import { useId, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import type { AddToList as AddToListInput } from '../../../../shared/schemas/parts-lists';
import { QUANTITY_MAX } from '../../../../shared/order-limits';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/notice';
import { useAddToList } from '../api/add-to-list';
import { useLists } from '../api/get-lists';

const NEW = 'new';

type Source = { kind: 'part'; partNumber: string } | { kind: 'cart' } | { kind: 'order'; orderNumber: string };

/**
 * "Save to a list": a part (with a quantity), the cart or a past order goes onto one of the trade account's lists,
 * or onto a new one named here. Opens in place, so the page stays where it was.
 */
export function AddToList({ source, label = 'Save to a list' }: { source: Source; label?: string }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const lists = useLists(open);
  const add = useAddToList();
  const [choice, setChoice] = useState<string>('');
  const [name, setName] = useState('');
  const [quantity, setQuantity] = useState('1');
  const [error, setError] = useState<{ field: 'name' | 'quantity'; message: string } | null>(null);
  const items = lists.data?.items ?? [];
  const selected = choice || (items[0] ? String(items[0].id) : NEW);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    let src: AddToListInput['source'];
    if (source.kind === 'part') {
      const n = Number(quantity);
      if (!Number.isInteger(n) || n < 1 || n > QUANTITY_MAX) return setError({ field: 'quantity', message: `enter a whole number from 1 to ${QUANTITY_MAX}` });
      src = { kind: 'part', partNumber: source.partNumber, quantity: n };
    } else src = source;
    if (selected === NEW && !name.trim()) return setError({ field: 'name', message: 'give the new list a name' });
    add.mutate(selected === NEW ? { newListName: name.trim(), source: src } : { listId: Number(selected), source: src }, {
      onSuccess: (r) => {
        setChoice(String(r.list.id));
        setName('');
      },
    });
  };

  if (!open) {
    return (
      <div className="grid justify-items-start gap-2">
        <Button variant="secondary" onClick={() => setOpen(true)} aria-expanded={false} aria-controls={`${id}-panel`}>
          <ListPlus aria-hidden className="size-4" />
          {label}
        </Button>
        {add.isSuccess && (
          <Notice tone="done" title={`Saved to “${add.data.list.name}”`}>
            <Link to={`/trade/lists/${add.data.list.id}`} className="font-semibold text-temper underline">
              Open the list
            </Link>
          </Notice>
        )}
      </div>
    );
  }
  return (
    <form id={`${id}-panel`} onSubmit={submit} noValidate className="grid w-full max-w-md gap-3 rounded-md border border-cast-line bg-white p-4" aria-label={label}>
      <p className="font-semibold">{label}</p>
      {lists.isError && <Notice tone="problem" live="alert">{lists.error.message}</Notice>}
      <SelectField
        id={`${id}-list`}
        label="List"
        value={selected}
        onChange={(e) => setChoice(e.target.value)}
        disabled={lists.isPending}
        hint="Everyone at your trade account sees and edits its lists."
      >
        {items.map((l) => (
          <option key={l.id} value={l.id}>
            {l.name} ({l.lineCount} {l.lineCount === 1 ? 'line' : 'lines'})
          </option>
        ))}
        <option value={NEW}>New list…</option>
      </SelectField>
      {selected === NEW && (
        <TextField id={`${id}-name`} label="New list name" value={name} onChange={(e) => setName(e.target.value)} maxLength={60} placeholder="e.g. van stock" error={error?.field === 'name' ? error.message : undefined} />
      )}
      {source.kind === 'part' && (
        <TextField
          id={`${id}-qty`}
          label="Quantity"
          inputMode="numeric"
          value={quantity}
          onChange={(e) => setQuantity(e.target.value)}
          className="max-w-28"
          error={error?.field === 'quantity' ? error.message : undefined}
          hint="Added to what the list already holds of this part."
        />
      )}
      {add.isError && (
        <Notice tone="problem" live="alert">
          {add.error.message}
        </Notice>
      )}
      {add.isSuccess && (
        <Notice tone="done" title={`Saved to “${add.data.list.name}”`}>
          <p>
            {add.data.added} {add.data.added === 1 ? 'line' : 'lines'} added; the list now has {add.data.list.lineCount}.{' '}
            <Link to={`/trade/lists/${add.data.list.id}`} className="font-semibold text-temper underline">
              Open the list
            </Link>
          </p>
          {add.data.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
        </Notice>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={add.isPending}>
          {add.isPending ? 'Saving…' : 'Add to list'}
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Close
        </Button>
      </div>
    </form>
  );
}
