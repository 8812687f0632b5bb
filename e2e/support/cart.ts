import { expect, type APIRequestContext } from '@playwright/test';

/** Empties the signed-in buyer's cart, so an order a journey places holds only what the journey added. */
export async function emptyCart(request: APIRequestContext, origin: string) {
  const cart = (await (await request.get('/api/cart')).json()) as { lines: Array<{ id: number }> };
  for (const line of cart.lines) expect((await request.delete(`/api/cart/lines/${line.id}`, { headers: { origin } })).ok()).toBe(true);
}
