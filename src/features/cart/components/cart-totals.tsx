import { formatPrice } from '../../../../shared/catalog';
import { DEALER_TIERS, DELIVERY_ZONES, type DeliveryZone } from '../../../../shared/pricing';
import type { CartView } from '../../../../shared/schemas/orders';

/** The money summary the server computed; nothing here is calculated in the browser. */
export function CartTotals({ cart, heading = 'Order total' }: { cart: CartView; heading?: string }) {
  const t = cart.totals;
  const tier = cart.buyer.tier ? DEALER_TIERS[cart.buyer.tier] : null;
  const kg = (t.weightGrams / 1000).toFixed(1);
  const row = 'flex items-baseline justify-between gap-4 py-1';
  return (
    <section aria-labelledby="totals-heading" className="rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line">
      <h2 id="totals-heading" className="text-xl font-bold">
        {heading}
      </h2>
      <dl className="mt-2 divide-y divide-cast-line/60">
        <div className={row}>
          <dt>Goods{tier ? ' at retail' : ''}</dt>
          <dd className="tabular">{formatPrice(tier ? t.retailGoodsCents : t.goodsCents)}</dd>
        </div>
        {tier && (
          <div className={row}>
            <dt>
              Trade discount <span className="text-cast">({tier.label}, {cart.buyer.discountPct}%)</span>
            </dt>
            <dd className="tabular whitespace-nowrap text-machined">−{formatPrice(t.discountCents)}</dd>
          </div>
        )}
        {t.coreDepositCents > 0 && (
          <div className={row}>
            <dt>
              Core deposits <span className="block text-sm text-cast">refunded when the old units come back</span>
            </dt>
            <dd className="tabular">{formatPrice(t.coreDepositCents)}</dd>
          </div>
        )}
        <div className={row}>
          <dt>
            Freight{' '}
            <span className="text-cast">
              ({DELIVERY_ZONES[cart.deliveryZone as DeliveryZone] ?? cart.deliveryZone}, {kg} kg)
            </span>
          </dt>
          <dd className="tabular">{formatPrice(t.freightCents)}</dd>
        </div>
        <div className={row}>
          <dt>
            Tax <span className="text-cast">({cart.taxRatePct}% on goods and freight)</span>
          </dt>
          <dd className="tabular">{formatPrice(t.taxCents)}</dd>
        </div>
        <div className={`${row} pt-2 text-xl font-bold`}>
          <dt>Total</dt>
          <dd className="tabular">{formatPrice(t.totalCents)}</dd>
        </div>
      </dl>
    </section>
  );
}
