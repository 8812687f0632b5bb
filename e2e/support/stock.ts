import { expect, type APIRequestContext } from '@playwright/test';
import { DEMO_EMAILS, DEMO_PASSWORD } from '../fixtures';

/**
 * Books units in, as the warehouse does at goods-in, so a journey that orders a part does not depend on how much of
 * the demo stock the journeys before it on the same database used. Into the part's first bin in walk order.
 */
export async function receiveStock(newContext: (options: { baseURL: string }) => Promise<APIRequestContext>, baseURL: string, partNumbers: string[], quantity = 20) {
  const origin = new URL(baseURL).origin;
  const floor = await newContext({ baseURL });
  try {
    expect((await floor.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS.warehouse, password: DEMO_PASSWORD }, headers: { origin } })).ok()).toBe(true);
    for (const partNumber of partNumbers) {
      const detail = (await (await floor.get(`/api/warehouse/stock/${encodeURIComponent(partNumber)}`)).json()) as { bins: Array<{ binCode: string }> };
      const binCode = detail.bins[0]?.binCode;
      expect(binCode, `a bin holds ${partNumber}`).toBeTruthy();
      const res = await floor.post('/api/warehouse/goods-in', { data: { partNumber, binCode, quantity, note: 'journey stock' }, headers: { origin } });
      expect(res.ok(), await res.text()).toBe(true);
    }
  } finally {
    await floor.dispose();
  }
}
