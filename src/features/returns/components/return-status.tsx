import { Ban, CircleCheck, Clock, ReceiptText } from 'lucide-react';
import type { ReturnView } from '../../../../shared/schemas/warehouse';

/** A return's state with a word and a shape, never colour alone. */
export function ReturnStatus({ status }: { status: ReturnView['status'] }) {
  switch (status) {
    case 'requested':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-amber">
          <Clock aria-hidden className="size-4" /> Requested
        </span>
      );
    case 'refunded':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-machined">
          <CircleCheck aria-hidden className="size-4" /> Refunded
        </span>
      );
    case 'credited':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-machined">
          <ReceiptText aria-hidden className="size-4" /> Credited
        </span>
      );
    default:
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-oxide">
          <Ban aria-hidden className="size-4" /> Rejected
        </span>
      );
  }
}
