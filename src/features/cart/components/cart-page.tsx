import type { ReactNode } from 'react';
import { ArrowRight, Gauge, Info, Trash2 } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { DEALER_TIERS, DELIVERY_ZONE_KEYS, DELIVERY_ZONES, type DeliveryZone } from '../../../../shared/pricing';
import type { CartLineView, CartView } from '../../../../shared/schemas/orders';
import { buttonClass } from '../../../components/ui/button';
import { PartPicture } from '../../../components/illustrations/part-picture';
import { Caution } from '../../../components/ui/caution';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useCart } from '../api/get-cart';
import { useRemoveCartLine } from '../api/remove-cart-line';
import { useSetDeliveryZone } from '../api/set-delivery-zone';
import { useUpdateCartLine } from '../api/update-cart-line';
import { CartTotals } from './cart-totals';
import { LineAvailability } from './line-availability';
import { QuantityStepper } from './quantity-stepper';
import { blockedLines } from '../lib/cart-lines';
import { OrientationNote } from '../../../components/ui/orientation-note';


export function UnitPrice({ line, cart }: { line: CartLineView; cart: CartView }) {
  const tier = cart.buyer.tier ? DEALER_TIERS[cart.buyer.tier] : null;
  if (!tier || line.unitCents === line.retailUnitCents) return <span className="tabular">{formatPrice(line.unitCents)}</span>;
  return (
    <span className="grid justify-items-end">
      <span className="tabular font-semibold">{formatPrice(line.unitCents)}</span>
      <span className="tabular text-sm text-cast">
        <span className="sr-only">retail price </span>
        <s>{formatPrice(line.retailUnitCents)}</s>
      </span>
      <span className="text-sm text-machined">
        {tier.label} −{cart.buyer.discountPct}%
      </span>
    </span>
  );
}

function CartLine({ line, cart }: { line: CartLineView; cart: CartView }) {
  const update = useUpdateCartLine();
  const remove = useRemoveCartLine();
  const busy = update.isPending || remove.isPending;
  const dealer = cart.buyer.kind === 'dealer';
  const warnings = cart.warnings.filter((w) => w.lineId === line.id);
  const unitDeposit = line.quantity > 0 ? line.coreDepositCents / line.quantity : 0;
  const error = update.error ?? remove.error;
  return (
    <li className="grid gap-3 border-b border-cast-line py-4 md:grid-cols-[minmax(0,1fr)_auto_7.5rem_6.5rem_auto] md:items-start md:gap-x-3" aria-label={`${line.partNumber} ${line.title}`}>
      <div className="flex min-w-0 items-start gap-3">
        <PartPicture part={line} photo={line.photo} className="size-14 md:size-16" />
        <div className="grid min-w-0 gap-1">
          <Link to={`/parts/${encodeURIComponent(line.partNumber)}`} className="part-no text-temper hover:underline">
            {line.partNumber}
          </Link>
          <p className="font-semibold leading-snug">{line.title}</p>
          <OrientationNote orientation={line.orientation} />
          <LineAvailability line={line} dealer={dealer} busy={busy} onBackorder={(allow) => update.mutate({ id: line.id, allowBackorder: allow })} />
          {line.fitment ? (
            <p className="inline-flex items-start gap-1 text-sm">
              <Gauge aria-hidden className="mt-0.5 size-4 shrink-0 text-temper" />
              <span>
                Chosen for fitment check <span className="font-semibold">{line.fitment.name}</span>
                {line.fitment.summary && <span className="text-cast"> · {line.fitment.summary}</span>}
              </span>
            </p>
          ) : null}
        </div>
      </div>
      <div>
        <p className="text-sm text-cast md:sr-only">Quantity</p>
        <QuantityStepper id={`qty-${line.id}`} label={`Quantity of ${line.partNumber}`} value={line.quantity} disabled={busy} onChange={(q) => update.mutate({ id: line.id, quantity: q })} />
      </div>
      <div className="flex justify-between md:block md:text-right">
        <p className="text-sm text-cast md:sr-only">Unit price</p>
        <UnitPrice line={line} cart={cart} />
      </div>
      <div className="flex justify-between md:block md:text-right">
        <p className="text-sm text-cast md:sr-only">Line total</p>
        <p className="tabular font-bold">{formatPrice(line.lineCents)}</p>
      </div>
      <div>
        <button
          type="button"
          onClick={() => remove.mutate(line.id)}
          disabled={busy}
          className={`${buttonClass('quiet')} text-oxide hover:bg-oxide-tint`}
          aria-label={`Remove ${line.partNumber}`}
        >
          <Trash2 aria-hidden className="size-4" />
          <span className="md:sr-only">Remove</span>
        </button>
      </div>
      {(line.coreDepositCents > 0 || warnings.length > 0 || error) && (
        <div className="grid gap-2 md:col-span-5">
          {line.coreDepositCents > 0 && (
            <p className="inline-flex items-start gap-1 text-sm">
              <Info aria-hidden className="mt-0.5 size-4 shrink-0 text-cast" />
              <span>
                Exchange unit: core deposit <span className="tabular font-semibold">{formatPrice(unitDeposit)}</span> each
                {line.quantity > 1 && (
                  <>
                    {' '}
                    (<span className="tabular">{formatPrice(line.coreDepositCents)}</span> in all)
                  </>
                )}
                , refunded when your old unit comes back in rebuildable condition.
              </span>
            </p>
          )}
          {warnings.map((w) => (
            <Caution key={w.message} title="Check these parts go together">
              <p>{w.message}</p>
            </Caution>
          ))}
          {error && (
            <p role="alert" className="text-sm font-semibold text-oxide">
              {error.message}
            </p>
          )}
        </div>
      )}
    </li>
  );
}

function ZoneSelect({ cart }: { cart: CartView }) {
  const setZone = useSetDeliveryZone();
  if (cart.buyer.kind === 'dealer') {
    return (
      <p className="text-sm">
        Freight is priced to your trade account's delivery zone: <span className="font-semibold">{DELIVERY_ZONES[cart.deliveryZone as DeliveryZone] ?? cart.deliveryZone}</span>.
      </p>
    );
  }
  return (
    <div className="grid gap-1">
      <label htmlFor="delivery-zone" className="font-semibold">
        Delivery zone
      </label>
      <select
        id="delivery-zone"
        value={cart.deliveryZone}
        disabled={setZone.isPending}
        onChange={(e) => setZone.mutate(e.target.value as DeliveryZone)}
        aria-describedby="delivery-zone-hint"
        className="min-h-10 rounded-md border border-cast-line bg-white px-2"
      >
        {DELIVERY_ZONE_KEYS.map((z) => (
          <option key={z} value={z}>
            {DELIVERY_ZONES[z]}
          </option>
        ))}
      </select>
      <p id="delivery-zone-hint" className="text-sm text-cast">
        An estimate: at checkout, freight goes by weight and the delivery postcode's zone.
      </p>
      {setZone.error && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {setZone.error.message}
        </p>
      )}
    </div>
  );
}

/** `saveToList` is the page's "save the cart to a list" tool for trade accounts (another feature owns lists). */
export function CartPage({ tradeTools, saveToList }: { tradeTools: boolean; saveToList?: ReactNode }) {
  const cart = useCart();
  if (cart.isPending) return <LoadingState label="Loading your cart…" />;
  if (cart.isError) return <ErrorState title="Your cart did not load" message={cart.error.message} onRetry={() => cart.refetch()} />;
  const c = cart.data;
  const generalWarnings = c.warnings.filter((w) => w.lineId === null || !c.lines.some((l) => l.id === w.lineId));
  const blocked = blockedLines(c);

  return (
    <div className="grid gap-6">
      <h1 className="text-3xl font-bold">Your cart</h1>
      {c.notices.length > 0 && (
        <div role="status" className="grid gap-1 rounded-md border border-temper bg-temper-tint p-4">
          {c.notices.map((n) => (
            <p key={n} className="inline-flex items-start gap-2">
              <Info aria-hidden className="mt-0.5 size-4 shrink-0 text-temper" />
              {n}
            </p>
          ))}
        </div>
      )}
      {c.lines.length === 0 ? (
        <EmptyState title="Your cart is empty">
          <p>
            Find parts in the{' '}
            <Link to="/catalogue" className="font-semibold text-temper underline">
              catalogue
            </Link>{' '}
            or start from a{' '}
            <Link to="/fitment" className="font-semibold text-temper underline">
              fitment check
            </Link>
            .
            {tradeTools && (
              <>
                {' '}
                Trade accounts can type a{' '}
                <Link to="/trade/quick-order" className="font-semibold text-temper underline">
                  quick order
                </Link>{' '}
                or{' '}
                <Link to="/trade/stock-list" className="font-semibold text-temper underline">
                  upload a stock list
                </Link>
                .
              </>
            )}
          </p>
        </EmptyState>
      ) : (
        <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
          <section aria-labelledby="lines-heading" className="min-w-0">
            <h2 id="lines-heading" className="sr-only">
              Lines
            </h2>
            <div aria-hidden className="hidden border-b-2 border-ink pb-1 text-sm font-semibold text-cast md:grid md:grid-cols-[minmax(0,1fr)_auto_7.5rem_6.5rem_auto] md:gap-x-3">
              <span>Part</span>
              <span className="w-34">Quantity</span>
              <span className="text-right">Unit price</span>
              <span className="text-right">Line total</span>
              <span className="w-10" />
            </div>
            {generalWarnings.map((w) => (
              <Caution key={w.message} title="Check these parts go together">
                <p>{w.message}</p>
              </Caution>
            ))}
            <ul>
              {c.lines.map((l) => (
                <CartLine key={l.id} line={l} cart={c} />
              ))}
            </ul>
            <p className="mt-3 text-sm text-cast">
              <span className="tabular">{c.lines.length}</span> {c.lines.length === 1 ? 'line' : 'lines'} · prices and stock are checked again when you place the order.
            </p>
          </section>
          <aside className="grid content-start gap-4" aria-label="Summary and checkout">
            <ZoneSelect cart={c} />
            <CartTotals cart={c} />
            {blocked.length > 0 && (
              <p role="status" className="rounded-md border border-oxide/40 bg-oxide-tint p-3 text-sm">
                <span className="font-semibold">Not enough stock for {blocked.map((l) => l.partNumber).join(', ')}.</span>{' '}
                {c.buyer.kind === 'dealer' ? 'Lower the quantity or back-order the rest before checking out.' : 'Lower the quantity before checking out.'}
              </p>
            )}
            {blocked.length > 0 ? (
              <span aria-disabled="true" className={`${buttonClass('primary', 'lg')} cursor-not-allowed bg-cast/60 hover:bg-cast/60`}>
                Go to checkout
              </span>
            ) : (
              <Link to="/checkout" className={buttonClass('primary', 'lg')}>
                Go to checkout
                <ArrowRight aria-hidden className="size-5" />
              </Link>
            )}
            {saveToList}
          </aside>
        </div>
      )}
    </div>
  );
}
