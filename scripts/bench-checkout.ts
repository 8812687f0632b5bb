import { section, summarize } from './bench-harness';
import type { BenchEnv } from './bench-catalogues';
import { signIn, type Client } from '../tests/support/session';
import { setAvailable } from '../tests/support/stock';
import { startTestApp } from '../tests/support/test-app';

const BUYERS = 16;
const DELIVERY = { name: 'Bench Buyer', line1: '1 Load Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' };

/**
 * Checkout throughput through the real app and the payments fake on 127.0.0.1, bounded in time, and a stampede
 * of buyers on a part with little stock to show the last unit is sold once.
 */
export const checkoutSection = section<BenchEnv>('checkout', async (ctx, env) => {
  const t = await startTestApp({ fakes: true, accounts: false });
  try {
    const buyers: Client[] = [];
    for (let i = 0; i < BUYERS; i++) {
      const email = `bench-buyer-${i}@spoolyard.test`;
      const res = await t.send('POST', '/api/auth/sign-up/email', { name: `Bench Buyer ${i}`, email, password: 'bench-password-1' }, { origin: t.url });
      if (res.status !== 200) throw new Error(`sign-up failed: ${res.status}`);
      buyers.push(await signIn(t, email, 'bench-password-1'));
    }
    const sqlite = t.db.$client;
    const plenty = sqlite
      .prepare("SELECT p.part_number FROM parts p JOIN stock s ON s.part_id = p.id WHERE p.category = 'gaskets-fittings' AND p.status = 'active' GROUP BY p.id ORDER BY SUM(s.on_hand) DESC LIMIT 1")
      .pluck()
      .get() as string;
    setAvailable(t, plenty, 100_000);

    const checkout = async (c: Client, partNumber: string) => {
      const started = performance.now();
      const add = await c.send('POST', '/api/cart/lines', { partNumber, quantity: 1 });
      if (add.status !== 201) return { ok: false, ms: performance.now() - started, status: add.status };
      const res = await c.send('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY });
      return { ok: res.status === 201, ms: performance.now() - started, status: res.status };
    };

    // Throughput: every buyer checks out in a loop until the time is up.
    const seconds = Math.min(env.httpDurationS, 10);
    const until = performance.now() + seconds * 1000;
    const latencies: number[] = [];
    let failed = 0;
    await Promise.all(
      buyers.map(async (c) => {
        while (performance.now() < until) {
          const r = await checkout(c, plenty);
          if (r.ok) latencies.push(r.ms);
          else failed++;
        }
      }),
    );
    await t.payments!.waitForWebhooks(10_000);
    const paid = sqlite.prepare("SELECT count(*) FROM orders WHERE status = 'paid'").pluck().get() as number;
    const lat = summarize(latencies.sort((a, b) => a - b));
    ctx.record('checkouts/s (card, through the payments fake)', latencies.length / seconds, 'orders/s', { detail: `${BUYERS} buyers, ${seconds} s, ${failed} failed` });
    ctx.record('checkout p95 (add line + pay)', lat.p95, 'ms');
    ctx.record('orders paid by webhook', paid, 'orders', { target: { op: '>=', value: latencies.length } });

    // Oversell: the same part, 5 in stock, every buyer at once.
    const scarce = sqlite
      .prepare("SELECT p.id, p.part_number AS partNumber FROM parts p WHERE p.category = 'cartridges' AND p.status = 'active' ORDER BY p.id LIMIT 1")
      .get() as { id: number; partNumber: string };
    const target = 5;
    setAvailable(t, scarce.partNumber, target);
    for (const c of buyers) await c.send('POST', '/api/cart/lines', { partNumber: scarce.partNumber, quantity: 1 });
    const results = await Promise.all(buyers.map((c) => c.send('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY })));
    const sold = results.filter((r) => r.status === 201).length;
    const stock = sqlite.prepare('SELECT SUM(on_hand) AS onHand, SUM(reserved) AS reserved FROM stock WHERE part_id = ?').get(scarce.id) as { onHand: number; reserved: number };
    ctx.record(`concurrent checkouts for ${target} units sold`, sold, 'orders', { target: { op: '<=', value: target }, detail: `${BUYERS} buyers at once; the others got 409` });
    ctx.record('units oversold', Math.max(0, stock.reserved - stock.onHand), 'units', { target: { op: '<=', value: 0 } });
  } finally {
    await t.close();
  }
});
