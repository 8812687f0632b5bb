import { CardElement, Elements, useElements, useStripe } from '@stripe/react-stripe-js';
import { loadStripe, type Stripe } from '@stripe/stripe-js';
import { useImperativeHandle, useMemo, type Ref } from 'react';

/** What the checkout asks of the provider's card form in live mode. */
export interface LiveCardHandle {
  createPaymentMethod(): Promise<{ id: string } | { error: string }>;
  handleNextAction(clientSecret: string): Promise<{ error?: string }>;
}

const loaded = new Map<string, Promise<Stripe | null>>();

function CardForm({ handle }: { handle: Ref<LiveCardHandle> }) {
  const stripe = useStripe();
  const elements = useElements();
  useImperativeHandle(handle, () => ({
    async createPaymentMethod() {
      const card = elements?.getElement(CardElement);
      if (!stripe || !card) return { error: 'The card form is still loading; try again in a moment.' };
      const result = await stripe.createPaymentMethod({ type: 'card', card });
      return result.error ? { error: result.error.message ?? 'The card was not accepted.' } : { id: result.paymentMethod.id };
    },
    async handleNextAction(clientSecret: string) {
      if (!stripe) return { error: 'The card form is not ready.' };
      const result = await stripe.handleNextAction({ clientSecret });
      return result.error ? { error: result.error.message ?? 'The card check was not completed.' } : {};
    },
  }));
  return (
    <div className="rounded-md border border-cast-line bg-white px-3 py-3">
      <CardElement options={{ hidePostalCode: true, style: { base: { fontSize: '16px', fontFamily: 'Source Sans 3, sans-serif', color: '#23211e' } } }} />
    </div>
  );
}

/**
 * Live mode only: the payment provider's own card form, from its browser script, so card numbers never touch our
 * server. In test mode the checkout offers the provider's test cards instead, because the script cannot load here.
 */
export default function LiveCard({ publishableKey, handle }: { publishableKey: string; handle: Ref<LiveCardHandle> }) {
  const stripe = useMemo(() => {
    let p = loaded.get(publishableKey);
    if (!p) {
      p = loadStripe(publishableKey);
      loaded.set(publishableKey, p);
    }
    return p;
  }, [publishableKey]);
  return (
    <Elements stripe={stripe}>
      <CardForm handle={handle} />
    </Elements>
  );
}
