import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, CreditCard, FileText, LoaderCircle, OctagonAlert, ShieldCheck } from 'lucide-react';
import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import { useForm, type FieldError, type FieldErrors, type Resolver } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { availableCreditCents, checkCredit } from '../../../../shared/credit';
import { DELIVERY_ZONES, zoneForPostcode, type DeliveryZone } from '../../../../shared/pricing';
import type { Me } from '../../../../shared/schemas/accounts';
import { CheckoutSchema, PURCHASE_ORDER_MAX, type CartView, type Checkout } from '../../../../shared/schemas/orders';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useAuthenticatePayment, usePlaceOrder } from '../api/checkout';
import { useCart } from '../api/get-cart';
import { useSetDeliveryZone } from '../api/set-delivery-zone';
import { CartTotals } from './cart-totals';
import { blockedLines } from '../lib/cart-lines';
import { ErrorSummary } from '../../../components/ui/form';
import { useErrorSummary, type SummaryField } from '../../../components/ui/error-summary';
import type { LiveCardHandle } from './live-card';
import { OrientationNote } from '../../../components/ui/orientation-note';

// Loaded only in live mode, so test mode never fetches the provider's script.
const LiveCard = lazy(() => import('./live-card'));

interface CheckoutFormValues {
  method: 'card' | 'account';
  paymentMethod: string;
  purchaseOrder: string;
  /** Dealers on account may ship to the address on their trade account. */
  useAccountAddress: boolean;
  delivery: { name: string; line1: string; city: string; postcode: string };
}

function toPayload(v: CheckoutFormValues): Checkout {
  if (v.method === 'account') return { method: 'account', purchaseOrder: v.purchaseOrder, ...(v.useAccountAddress ? {} : { delivery: v.delivery }) };
  return { method: 'card', paymentMethod: v.paymentMethod, delivery: v.delivery };
}

const payloadResolver = zodResolver(CheckoutSchema);
/** The shared CheckoutSchema checks what will be sent, so the form and the server agree on every rule. */
const resolver: Resolver<CheckoutFormValues> = async (values, context, options) => {
  const result = await payloadResolver(toPayload(values) as never, context, options as never);
  return Object.keys(result.errors).length > 0 ? { values: {}, errors: result.errors as FieldErrors<CheckoutFormValues> } : { values, errors: {} };
};

const fieldId = (path: string) => `checkout-${path.replace(/\./g, '-')}`;

/** The fields in the order they appear; the messages name what is missing, so they stand without a label. */
const SUMMARY_FIELDS: readonly SummaryField[] = ['method', 'paymentMethod', 'purchaseOrder', 'delivery.name', 'delivery.line1', 'delivery.city', 'delivery.postcode'].map((name) => ({
  name,
  // A card choice is a radio group: link to its first option.
  id: name === 'paymentMethod' ? `${fieldId(name)}-0` : fieldId(name),
}));

/** The heading of a refusal from the server that names no field. */
function refusalTitle(err: unknown): string {
  if (err instanceof ApiError && err.status === 402) return 'Payment declined';
  if (err instanceof ApiError && err.status === 409) return 'The order was not placed';
  return 'Something went wrong';
}

const inputClass = (invalid: boolean) =>
  `min-h-11 w-full rounded-md border bg-white px-3 ${invalid ? 'border-2 border-oxide' : 'border-cast-line'} focus:border-temper`;

function FieldMessage({ id, error }: { id: string; error?: FieldError }) {
  if (!error?.message) return null;
  return (
    <p id={`${id}-error`} className="inline-flex items-center gap-1 text-sm font-semibold text-oxide">
      <OctagonAlert aria-hidden className="size-4" />
      {error.message}
    </p>
  );
}

function CreditCheck({ dealer, orderCents }: { dealer: NonNullable<NonNullable<Me['user']>['dealer']>; orderCents: number }) {
  const open = dealer.openBalanceCents ?? 0;
  // The same rule the server applies when the order is placed.
  const check = checkCredit({ openBalanceCents: open, orderCents, creditLimitCents: dealer.creditLimitCents });
  const after = check.balanceAfterCents;
  const over = !check.fits;
  const pct = dealer.creditLimitCents > 0 ? Math.min(100, (after / dealer.creditLimitCents) * 100) : 100;
  return (
    <section aria-labelledby="credit-heading" className="grid gap-2 rounded-md bg-panel p-4">
      <h3 id="credit-heading" className="font-bold">
        Credit check
      </h3>
      <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm">
        <dt>Open balance</dt>
        <dd className="tabular text-right">{formatPrice(open)}</dd>
        <dt>This order</dt>
        <dd className="tabular text-right">{formatPrice(orderCents)}</dd>
        <dt className="font-semibold">Balance after this order</dt>
        <dd className="tabular text-right font-semibold">{formatPrice(after)}</dd>
        <dt>Credit limit</dt>
        <dd className="tabular text-right">{formatPrice(dealer.creditLimitCents)}</dd>
      </dl>
      <p className="text-sm">
        <Link to="/account/statement" className="font-semibold text-temper underline underline-offset-2">
          Your account statement
        </Link>{' '}
        lists the open invoices.
      </p>
      <div aria-hidden className="h-2 overflow-hidden rounded bg-white ring-1 ring-cast-line">
        <div className={`h-full ${over ? 'bg-oxide' : 'bg-machined'}`} style={{ width: `${pct}%` }} />
      </div>
      {over ? (
        <p id="credit-over" className="inline-flex items-start gap-1 text-sm font-semibold text-oxide">
          <OctagonAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
          Over your credit limit by {formatPrice(after - dealer.creditLimitCents)}. Pay an open invoice first, or pay this order by card.
        </p>
      ) : (
        <p className="inline-flex items-start gap-1 text-sm text-machined">
          <CircleCheck aria-hidden className="mt-0.5 size-4 shrink-0" />
          Within your credit limit ({formatPrice(availableCreditCents({ openBalanceCents: after, creditLimitCents: dealer.creditLimitCents }))} to spare).
        </p>
      )}
    </section>
  );
}

function AuthenticationStep({ paymentIntentId, orderNumber, totalCents, onDone }: { paymentIntentId: string; orderNumber: string; totalCents: number; onDone: () => void }) {
  const authenticate = useAuthenticatePayment();
  return (
    <section aria-labelledby="auth-heading" className="grid max-w-xl gap-3 rounded-lg bg-white p-6 shadow-sm ring-2 ring-temper">
      <h2 id="auth-heading" className="inline-flex items-center gap-2 text-2xl font-bold">
        <ShieldCheck aria-hidden className="size-6 text-temper" />
        Your card needs authentication
      </h2>
      <p>
        The card issuer asks you to confirm the payment of <span className="tabular font-semibold">{formatPrice(totalCents)}</span> for order{' '}
        <span className="part-no">{orderNumber}</span>.
      </p>
      <p className="text-sm text-cast">Test mode: this step stands in for the issuer's check, which the payment provider's script would show.</p>
      <div className="flex flex-wrap gap-3">
        <Button disabled={authenticate.isPending} onClick={() => authenticate.mutate({ paymentIntentId, outcome: 'succeed' }, { onSuccess: onDone })}>
          Complete authentication
        </Button>
        <Button variant="secondary" disabled={authenticate.isPending} onClick={() => authenticate.mutate({ paymentIntentId, outcome: 'fail' }, { onSuccess: onDone })}>
          Fail authentication
        </Button>
      </div>
      {authenticate.isError && (
        <p role="alert" className="font-semibold text-oxide">
          {authenticate.error.message}
        </p>
      )}
    </section>
  );
}

/**
 * The card provider has not said whether the card was charged. The order is kept and its stock held; the buyer is
 * told plainly not to pay again, and nothing here offers another payment.
 */
function ConfirmingPayment({ orderNumber, totalCents, message }: { orderNumber: string; totalCents: number; message: string }) {
  return (
    <section aria-labelledby="confirming-heading" role="status" className="grid max-w-xl gap-3 rounded-lg bg-white p-6 shadow-sm ring-2 ring-amber">
      <h2 id="confirming-heading" className="inline-flex items-center gap-2 text-2xl font-bold">
        <LoaderCircle aria-hidden className="size-6 text-amber" />
        We are confirming your payment
      </h2>
      <p>
        Order <span className="part-no">{orderNumber}</span> for <span className="tabular font-semibold">{formatPrice(totalCents)}</span> is kept for
        you, with its parts set aside.
      </p>
      <p className="font-semibold">{message}</p>
      <p className="text-sm text-cast">
        If the payment did not go through, the parts go back into your cart and we tell you by e-mail.{' '}
        <Link to={`/orders/${encodeURIComponent(orderNumber)}`} className="font-semibold text-temper underline">
          See the order
        </Link>
      </p>
    </section>
  );
}

function OrderLinesSummary({ cart }: { cart: CartView }) {
  return (
    <ul className="grid gap-2 text-sm">
      {cart.lines.map((l) => (
        <li key={l.id} className="flex justify-between gap-3">
          <span className="min-w-0">
            <span className="tabular">{l.quantity}</span> × <span className="part-no">{l.partNumber}</span>
            <span className="block text-cast">{l.title}</span>
            <OrientationNote orientation={l.orientation} />
            {l.backorderQuantity > 0 && l.allowBackorder && <span className="block text-amber">{l.backorderQuantity} on back-order</span>}
          </span>
          <span className="tabular shrink-0">{formatPrice(l.lineCents)}</span>
        </li>
      ))}
    </ul>
  );
}

export function CheckoutForm({ me, onPlaced }: { me: Me; onPlaced: (orderNumber: string) => void }) {
  const cart = useCart();
  const place = usePlaceOrder();
  if (place.data?.nextAction) {
    const { order, nextAction } = place.data;
    return <AuthenticationStep paymentIntentId={nextAction.paymentIntentId} orderNumber={order.number} totalCents={order.totalCents} onDone={() => onPlaced(order.number)} />;
  }
  if (place.data?.outcome === 'confirming') {
    const { order, message } = place.data;
    return <ConfirmingPayment orderNumber={order.number} totalCents={order.totalCents} message={message ?? 'We are confirming your payment with the card provider. Do not pay again.'} />;
  }
  if (place.isSuccess) return <LoadingState label={`Order ${place.data.order.number} placed. Opening it…`} />;
  if (cart.isPending) return <LoadingState label="Loading your cart…" />;
  if (cart.isError) return <ErrorState title="Your cart did not load" message={cart.error.message} onRetry={() => cart.refetch()} />;
  if (cart.data.lines.length === 0) {
    return (
      <EmptyState title="Your cart is empty">
        <p>
          Nothing to check out yet.{' '}
          <Link to="/catalogue" className="font-semibold text-temper underline">
            Browse the catalogue
          </Link>
          {' or '}
          <Link to="/orders" className="font-semibold text-temper underline">
            see your orders
          </Link>
          .
        </p>
      </EmptyState>
    );
  }
  return <CheckoutFields me={me} cart={cart.data} place={place} onPlaced={onPlaced} />;
}

function CheckoutFields({ me, cart: c, place, onPlaced }: { me: Me; cart: CartView; place: ReturnType<typeof usePlaceOrder>; onPlaced: (orderNumber: string) => void }) {
  const user = me.user!;
  const dealer = user.role === 'dealer' && user.dealer?.status === 'approved' ? user.dealer : null;
  const testMethods = me.payments.testMethods ?? [];
  const live = me.payments.mode === 'live';
  const liveCard = useRef<LiveCardHandle | null>(null);
  const [liveError, setLiveError] = useState<string | null>(null);
  const setZone = useSetDeliveryZone();

  const form = useForm<CheckoutFormValues>({
    resolver,
    defaultValues: {
      method: dealer ? 'account' : 'card',
      paymentMethod: '',
      purchaseOrder: '',
      useAccountAddress: true,
      delivery: { name: dealer ? dealer.companyName : user.name, line1: '', city: '', postcode: '' },
    },
  });
  const { register, watch, formState } = form;
  const method = watch('method');
  const useAccountAddress = watch('useAccountAddress');
  const errors = formState.errors;

  const blocked = blockedLines(c);
  // The server refuses an order on account over the limit; the button says so first instead of failing on a click.
  const overLimit =
    method === 'account' && dealer !== null && !checkCredit({ openBalanceCents: dealer.openBalanceCents ?? 0, orderCents: c.totals.totalCents, creditLimitCents: dealer.creditLimitCents }).fits;
  const showDelivery = method === 'card' || !useAccountAddress;
  const summary = useErrorSummary(form, SUMMARY_FIELDS);

  const submitForm = summary.handleSubmit(
    (values) => {
      place.mutate(toPayload(values), {
        onSuccess: async (res) => {
          if (live && res.nextAction?.clientSecret && liveCard.current) {
            // Live mode: the provider's script runs the card issuer's check; the webhook then settles the order.
            const done = await liveCard.current.handleNextAction(res.nextAction.clientSecret);
            if (done.error) setLiveError(done.error);
            onPlaced(res.order.number);
            return;
          }
          if (!res.nextAction && res.outcome !== 'confirming') onPlaced(res.order.number);
        },
        onError: (err) => summary.showServerError(err, undefined, refusalTitle(err)),
      });
    },
  );

  // In live mode the card becomes a payment method in the provider's form first; its id is what we send.
  const onSubmit = async (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    setLiveError(null);
    if (live && form.getValues('method') === 'card' && liveCard.current) {
      const pm = await liveCard.current.createPaymentMethod();
      if ('error' in pm) {
        setLiveError(pm.error);
        return;
      }
      form.setValue('paymentMethod', pm.id);
    }
    await submitForm(e);
  };

  // Freight goes by the postcode's zone (the server prices the order the same way); the cart is priced to it as the
  // buyer types, so the summary beside the form is what will be charged. A trade account's zone is set by staff.
  const postcode = watch('delivery.postcode');
  const postcodeZone: DeliveryZone | null = !dealer && postcode.trim().length >= 3 ? zoneForPostcode(postcode) : null;
  const { mutate: priceToZone } = setZone;
  useEffect(() => {
    if (postcodeZone && postcodeZone !== c.deliveryZone) priceToZone(postcodeZone);
  }, [postcodeZone, c.deliveryZone, priceToZone]);

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <form onSubmit={onSubmit} noValidate className="grid content-start gap-6" aria-label="Checkout">
        {summary.shown && <ErrorSummary variant="banner" title="Please fix these before you continue" {...summary.props} />}

        <fieldset className="grid gap-3">
          <legend className="mb-2 text-xl font-bold">How to pay</legend>
          {errors.method && <FieldMessage id={fieldId('method')} error={errors.method} />}
          <div className="grid gap-2 sm:grid-cols-2">
            {dealer && (
              <label className="flex cursor-pointer items-start gap-3 rounded-md border border-cast-line bg-white p-4 has-[:checked]:border-2 has-[:checked]:border-temper">
                <input type="radio" value="account" id={fieldId('method')} {...register('method')} className="mt-1 size-5 accent-temper" />
                <span>
                  <span className="inline-flex items-center gap-2 font-semibold">
                    <FileText aria-hidden className="size-5" /> On account
                  </span>
                  <span className="block text-sm text-cast">Invoice to {dealer.companyName}, payment due in {dealer.paymentTermsDays} days</span>
                </span>
              </label>
            )}
            <label className="flex cursor-pointer items-start gap-3 rounded-md border border-cast-line bg-white p-4 has-[:checked]:border-2 has-[:checked]:border-temper">
              <input type="radio" value="card" {...register('method')} {...(dealer ? {} : { id: fieldId('method') })} className="mt-1 size-5 accent-temper" />
              <span>
                <span className="inline-flex items-center gap-2 font-semibold">
                  <CreditCard aria-hidden className="size-5" /> Card
                </span>
                <span className="block text-sm text-cast">Paid now; we start picking once the payment is confirmed</span>
              </span>
            </label>
          </div>
        </fieldset>

        {method === 'card' && (
          <fieldset className="grid gap-2" aria-describedby="test-card-hint">
            <legend className="mb-1 text-lg font-bold">{live ? 'Card' : 'Test card'}</legend>
            {live ? (
              <Suspense fallback={<p className="text-sm text-cast">Loading the secure card form…</p>}>
                <LiveCard publishableKey={me.payments.publishableKey} handle={liveCard} />
                {liveError && (
                  <p role="alert" className="text-sm font-semibold text-oxide">
                    {liveError}
                  </p>
                )}
              </Suspense>
            ) : testMethods.length > 0 ? (
              <>
                <p id="test-card-hint" className="text-sm text-cast">
                  Test mode: the payment provider's card form cannot load here, so choose one of its test cards. No money moves.
                </p>
                {testMethods.map((m, i) => (
                  <label key={m.id} className="flex cursor-pointer items-center gap-3 rounded-md border border-cast-line bg-white px-4 py-3 has-[:checked]:border-2 has-[:checked]:border-temper">
                    <input
                      type="radio"
                      value={m.id}
                      id={`${fieldId('paymentMethod')}-${i}`}
                      {...register('paymentMethod')}
                      aria-invalid={!!errors.paymentMethod}
                      className="size-5 accent-temper"
                    />
                    <span>{m.label}</span>
                  </label>
                ))}
                <FieldMessage id={fieldId('paymentMethod')} error={errors.paymentMethod} />
              </>
            ) : (
              <p id="test-card-hint" className="text-sm">
                Card payments use the payment provider's secure card form.
              </p>
            )}
          </fieldset>
        )}

        {method === 'account' && dealer && (
          <div className="grid gap-4">
            <div className="grid max-w-md gap-1">
              <label htmlFor={fieldId('purchaseOrder')} className="font-semibold">
                Purchase-order number
              </label>
              <input
                id={fieldId('purchaseOrder')}
                maxLength={PURCHASE_ORDER_MAX}
                autoComplete="off"
                aria-invalid={!!errors.purchaseOrder}
                aria-describedby={`${fieldId('purchaseOrder')}-hint${errors.purchaseOrder ? ` ${fieldId('purchaseOrder')}-error` : ''}`}
                className={inputClass(!!errors.purchaseOrder)}
                {...register('purchaseOrder')}
              />
              <p id={`${fieldId('purchaseOrder')}-hint`} className="text-sm text-cast">
                Your own reference; it is printed on the invoice. Up to {PURCHASE_ORDER_MAX} letters, digits, spaces and - / . #
              </p>
              <FieldMessage id={fieldId('purchaseOrder')} error={errors.purchaseOrder} />
            </div>
            <p>
              Payment terms: <span className="font-semibold">{dealer.paymentTermsDays} days</span> from the invoice date.
            </p>
            <CreditCheck dealer={dealer} orderCents={c.totals.totalCents} />
          </div>
        )}

        <fieldset className="grid gap-3">
          <legend className="mb-1 text-xl font-bold">Delivery address</legend>
          {dealer && method === 'account' && (
            <label className="inline-flex items-center gap-2">
              <input type="checkbox" className="size-5 accent-temper" {...register('useAccountAddress')} />
              Deliver to the address on {dealer.companyName}'s trade account
            </label>
          )}
          {showDelivery && (
            <div className="grid gap-4 sm:grid-cols-2">
              {(
                [
                  ['delivery.name', 'Name or company', 'name', 'organization'],
                  ['delivery.line1', 'Street address', 'line1', 'street-address'],
                  ['delivery.city', 'Town or city', 'city', 'address-level2'],
                  ['delivery.postcode', 'Postcode', 'postcode', 'postal-code'],
                ] as const
              ).map(([path, label, key, auto]) => {
                const err = errors.delivery?.[key];
                const id = fieldId(path);
                return (
                  <div key={path} className={`grid content-start gap-1 ${key === 'line1' ? 'sm:col-span-2' : ''}`}>
                    <label htmlFor={id} className="font-semibold">
                      {label}
                    </label>
                    <input
                      id={id}
                      autoComplete={auto}
                      aria-invalid={!!err}
                      aria-describedby={err ? `${id}-error` : undefined}
                      className={inputClass(!!err)}
                      {...register(path)}
                    />
                    <FieldMessage id={id} error={err} />
                  </div>
                );
              })}
              <div className="grid content-start gap-1" role="status">
                <span className="font-semibold">Delivery zone</span>
                <span>{dealer ? DELIVERY_ZONES[c.deliveryZone as DeliveryZone] : postcodeZone ? DELIVERY_ZONES[postcodeZone] : 'From the postcode'}</span>
                <p className="text-sm text-cast">{dealer ? "Set on your trade account; freight is priced to it." : 'Freight is priced to the postcode’s zone.'}</p>
              </div>
            </div>
          )}
        </fieldset>

        {blocked.length > 0 && (
          <p role="status" className="rounded-md border border-oxide/40 bg-oxide-tint p-3">
            Not enough stock for {blocked.map((l) => l.partNumber).join(', ')}.{' '}
            <Link to="/cart" className="font-semibold text-temper underline">
              Change the cart
            </Link>{' '}
            first.
          </p>
        )}
        <div className="flex flex-wrap items-center gap-4">
          <Button
            type="submit"
            size="lg"
            disabled={place.isPending || blocked.length > 0 || overLimit || (method === 'card' && testMethods.length === 0)}
            aria-describedby={overLimit ? 'credit-over place-over' : undefined}
          >
            {place.isPending && <LoaderCircle aria-hidden className="size-5 animate-spin" />}
            {method === 'account' ? `Place order on account (${formatPrice(c.totals.totalCents)})` : `Pay ${formatPrice(c.totals.totalCents)} by card`}
          </Button>
          <Link to="/cart" className="font-semibold text-temper underline">
            Back to cart
          </Link>
          {overLimit && (
            <p id="place-over" className="w-full text-sm font-semibold text-oxide">
              Placing this order on account is off: it is over your credit limit (see the credit check above). Choose card to pay now.
            </p>
          )}
        </div>
      </form>
      <aside className="grid min-w-0 content-start gap-4" aria-label="Order summary">
        <section aria-labelledby="summary-lines" className="min-w-0 rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line">
          <h2 id="summary-lines" className="mb-2 text-xl font-bold">
            In this order
          </h2>
          <OrderLinesSummary cart={c} />
        </section>
        <CartTotals cart={c} />
      </aside>
    </div>
  );
}
