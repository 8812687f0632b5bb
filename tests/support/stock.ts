import type { TestApp } from './test-app';

/** Test setup through the stock service (so the ledger and the parts' totals stay true): leaves exactly `n` free. */
export function setAvailable(t: Pick<TestApp, 'db' | 'app'>, partNumber: string, n: number) {
  const sqlite = t.db.$client;
  const id = sqlite.prepare('SELECT id FROM parts WHERE part_number = ?').pluck().get(partNumber) as number;
  const bins = sqlite.prepare('SELECT bin_code AS bin, on_hand - reserved AS free FROM stock WHERE part_id = ? ORDER BY bin_code').all(id) as Array<{ bin: string; free: number }>;
  for (const b of bins) if (b.free > 0) t.app.stock.adjust(id, b.bin, -b.free, 'test setup');
  const bin = bins[0]?.bin ?? (sqlite.prepare('SELECT code FROM bins ORDER BY walk_order LIMIT 1').pluck().get() as string);
  if (n > 0) t.app.stock.goodsIn(id, bin, n, 'test setup');
}
