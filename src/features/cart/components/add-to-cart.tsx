import { CircleCheck, Clock, ShoppingCart } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { DEALER_TIERS, dealerUnitPriceCents, type DealerTier } from '../../../../shared/pricing';
import { Button } from '../../../components/ui/button';
import { useAddCartLine } from '../api/add-cart-line';
import { OrientationPicker, type OrientationChoice } from './orientation-picker';
import { QuantityStepper } from './quantity-stepper';

export interface AddToCartProps {
  partNumber: string;
  retailCents: number;
  available: number;
  discontinued: boolean;
  /** The buyer's trade tier when they have an approved trade account. */
  tier: DealerTier | null;
  fitmentId?: number;
  /** A complete unit: the housing positions it is built in. */
  orientation?: OrientationChoice;
}

/** The buying part of a part page: quantity, add, and for dealers their trade price and a back-order choice. */
export function AddToCart({ partNumber, retailCents, available, discontinued, tier, fitmentId, orientation }: AddToCartProps) {
  const [quantity, setQuantity] = useState(1);
  const [backorder, setBackorder] = useState(false);
  const add = useAddCartLine();
  const short = Math.max(0, quantity - available);
  const dealer = tier !== null;
  const blocked = discontinued ? short > 0 : short > 0 && !(dealer && backorder);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (blocked) return;
    add.mutate({
      partNumber,
      quantity,
      ...(fitmentId ? { fitmentId } : {}),
      ...(dealer && short > 0 ? { allowBackorder: true } : {}),
      ...(orientation ? { orientation: orientation.value } : {}),
    });
  };

  return (
    <form onSubmit={submit} className="grid gap-3 border-t border-cast-line pt-3" aria-label="Add to cart">
      {tier && (
        <p className="grid">
          <span className="text-sm text-cast">Your trade price ({DEALER_TIERS[tier].label}, −{DEALER_TIERS[tier].discountPct}%)</span>
          <span className="tabular text-2xl font-bold text-machined">{formatPrice(dealerUnitPriceCents(retailCents, tier))}</span>
        </p>
      )}
      {orientation && <OrientationPicker {...orientation} disabled={add.isPending} />}
      <div className="flex flex-wrap items-end gap-3">
        <div className="grid gap-1">
          <span className="text-sm font-semibold">
            Quantity
          </span>
          <QuantityStepper id="add-quantity" label="Quantity" value={quantity} onChange={setQuantity} disabled={add.isPending} />
        </div>
        <Button type="submit" size="lg" disabled={add.isPending || blocked}>
          <ShoppingCart aria-hidden className="size-5" />
          {add.isPending ? 'Adding…' : 'Add to cart'}
        </Button>
      </div>
      {short > 0 && dealer && !discontinued && (
        <div className="grid gap-1 rounded-md bg-amber-tint p-3 text-sm">
          <label htmlFor="add-backorder" className="inline-flex items-center gap-2 font-semibold">
            <input id="add-backorder" type="checkbox" className="size-5 accent-temper" checked={backorder} onChange={(e) => setBackorder(e.target.checked)} />
            Back-order the rest (<span className="tabular">{short}</span>)
          </label>
          <p className="inline-flex items-center gap-1 text-amber">
            <Clock aria-hidden className="size-4" />
            <span className="tabular">
              {available} ship now, {short} wait for stock.
            </span>
          </p>
        </div>
      )}
      {short > 0 && (!dealer || discontinued) && (
        <p className="text-sm font-semibold text-oxide">
          {available === 0 ? 'None available to order.' : `Only ${available} available: lower the quantity.`}
        </p>
      )}
      {add.isSuccess && (
        <div role="status" className="grid gap-1 rounded-md bg-machined-tint p-3 text-sm">
          <p className="inline-flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-4" />
            Added to your cart.
          </p>
          {add.data.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
          <Link to="/cart" className="font-semibold text-temper underline">
            View cart and check out
          </Link>
        </div>
      )}
      {add.isError && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {add.error.message}
        </p>
      )}
    </form>
  );
}
