import { CircleCheck, RotateCcw } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useReorder } from '../api/reorder-order';

/** "Reorder" with what happened: lines added, superseded numbers replaced, parts left out. */
export function ReorderButton({ number, onAdded, compact = false }: { number: string; onAdded?: () => void; compact?: boolean }) {
  const reorder = useReorder({ onAdded });
  return (
    <div className="grid justify-items-start gap-2">
      <Button variant="secondary" disabled={reorder.isPending} onClick={() => reorder.mutate(number)} aria-label={compact ? `Reorder ${number}` : undefined}>
        <RotateCcw aria-hidden className="size-4" />
        {reorder.isPending ? 'Adding…' : 'Reorder'}
      </Button>
      {reorder.isSuccess && (
        <div role="status" className="grid gap-1 rounded-md bg-machined-tint p-3 text-sm">
          <p className="inline-flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-4" />
            {reorder.data.added} {reorder.data.added === 1 ? 'line' : 'lines'} added to your cart.
          </p>
          {reorder.data.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
          <Link to="/cart" className="font-semibold text-temper underline">
            View cart
          </Link>
        </div>
      )}
      {reorder.isError && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {reorder.error.message}
        </p>
      )}
    </div>
  );
}
