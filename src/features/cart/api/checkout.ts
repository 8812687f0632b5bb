import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { CheckoutResponseSchema, type Checkout } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { cartKeys } from './keys';

export const placeOrder = (input: Checkout) => api('/checkout', CheckoutResponseSchema, { method: 'POST', body: input });

/**
 * Places the order. Success empties the cart; a declined card restores it on the server, so either way the
 * cached cart is stale afterwards.
 */
export function usePlaceOrder(options: { onSettled?: () => void } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: placeOrder,
    // Not awaited: the page moves on (or shows the authentication step) while the cart refetches.
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: cartKeys.all });
      void qc.invalidateQueries({ queryKey: orderKeys.list() });
      options.onSettled?.();
    },
  });
}

const AuthenticateResponseSchema = z.object({ order: z.object({ number: z.string() }), outcome: z.enum(['succeed', 'fail']) });

/** Development only: finishes the card issuer's authentication step that the provider's browser script would show. */
export const authenticatePayment = (input: { paymentIntentId: string; outcome: 'succeed' | 'fail' }) =>
  api(`/dev/payments/${encodeURIComponent(input.paymentIntentId)}/authenticate`, AuthenticateResponseSchema, { method: 'POST', body: { outcome: input.outcome } });

export function useAuthenticatePayment() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: authenticatePayment,
    onSettled: (reply) =>
      Promise.all([qc.invalidateQueries({ queryKey: cartKeys.all }), reply ? qc.invalidateQueries({ queryKey: orderKeys.detail(reply.order.number) }) : undefined]),
  });
}
