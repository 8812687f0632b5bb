import { CircleCheck, Clock, OctagonAlert } from 'lucide-react';
import type { CartLineView } from '../../../../shared/schemas/orders';
import { shortBy } from '../lib/cart-lines';

/** Stock for one line, with a word and a shape; dealers may back-order what is short. */
export function LineAvailability({
  line,
  dealer,
  onBackorder,
  busy,
}: {
  line: CartLineView;
  dealer: boolean;
  onBackorder: (allow: boolean) => void;
  busy: boolean;
}) {
  const short = shortBy(line);
  if (short <= 0) {
    return (
      <p className="inline-flex items-center gap-1 text-sm text-machined">
        <CircleCheck aria-hidden className="size-4" />
        <span className="tabular">In stock: {line.available} available</span>
      </p>
    );
  }
  const checkboxId = `backorder-${line.id}`;
  return (
    <div className="grid gap-1 text-sm">
      {line.allowBackorder && dealer ? (
        <p className="inline-flex items-center gap-1 font-semibold text-amber">
          <Clock aria-hidden className="size-4" />
          <span className="tabular">
            {line.available} ship now · {short} on back-order, awaiting stock
          </span>
        </p>
      ) : (
        <p className="inline-flex items-center gap-1 font-semibold text-oxide">
          <OctagonAlert aria-hidden className="size-4" />
          <span className="tabular">
            {line.available === 0 ? 'Out of stock' : `Only ${line.available} available`}
            {dealer ? ': lower the quantity or back-order the rest' : ': lower the quantity to order'}
          </span>
        </p>
      )}
      {dealer && (
        <label htmlFor={checkboxId} className="inline-flex items-center gap-2">
          <input
            id={checkboxId}
            type="checkbox"
            className="size-5 accent-temper"
            checked={line.allowBackorder}
            disabled={busy}
            onChange={(e) => onBackorder(e.target.checked)}
          />
          <span>
            Back-order the rest (<span className="tabular">{short}</span>)
          </span>
        </label>
      )}
    </div>
  );
}
