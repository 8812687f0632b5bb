import { describe, expect, it } from 'vitest';
import { MAIL_STATES } from '../../shared/allowed-values';
import { DealerAccountRowSchema } from '../../shared/schemas/accounts';
import { ORDER_STATUS_KEYS, ORDER_STATUS_LABELS } from '../../shared/schemas/orders';
import { StockStateSchema } from '../../shared/schemas/parts';
import { PickQueueItemSchema, ReturnViewSchema } from '../../shared/schemas/warehouse';
import { STATUS_LOOKS, statusLook, TONE_PILL, TONE_TEXT, type StatusKind } from '../../src/components/ui/status-looks';

/** The allowed values as the shared schemas define them, per kind of badge. */
const SHARED_VALUES: Record<StatusKind, readonly string[]> = {
  order: ORDER_STATUS_KEYS,
  return: ReturnViewSchema.shape.status.options,
  dealer: DealerAccountRowSchema.shape.status.options,
  stock: StockStateSchema.options,
  queue: [...PickQueueItemSchema.shape.ready.options, 'released'],
  mail: MAIL_STATES,
};

describe('status badges: one word, shape and colour per shared status value', () => {
  it.each(Object.keys(SHARED_VALUES) as StatusKind[])('%s statuses are exactly the shared values, each with a word, an icon and a design colour', (kind) => {
    expect(Object.keys(STATUS_LOOKS[kind]).sort()).toEqual([...SHARED_VALUES[kind]].sort());
    const words = new Set<string>();
    for (const value of SHARED_VALUES[kind]) {
      const look = statusLook(kind, value);
      expect(look.label.trim(), value).not.toBe('');
      expect(typeof look.Icon === 'function' || typeof look.Icon === 'object', value).toBe(true);
      expect(Object.keys(TONE_PILL)).toContain(look.tone);
      expect(Object.keys(TONE_TEXT)).toContain(look.tone);
      words.add(look.label);
    }
    // Never colour alone: two states never share a word.
    expect(words.size).toBe(SHARED_VALUES[kind].length);
  });

  it('order badges take their words from the shared ORDER_STATUS_LABELS', () => {
    for (const s of ORDER_STATUS_KEYS) expect(statusLook('order', s).label).toBe(ORDER_STATUS_LABELS[s]);
  });

  it('a status the client does not know yet reads as its own words in neutral grey', () => {
    expect(statusLook('order', 'held_at_customs')).toMatchObject({ label: 'held at customs', tone: 'cast' });
  });

  it('refusals are red oxide and finished good outcomes are machined green (DESIGN.md colour table)', () => {
    expect(statusLook('return', 'rejected').tone).toBe('oxide');
    expect(statusLook('dealer', 'declined').tone).toBe('oxide');
    expect(statusLook('return', 'refunded').tone).toBe('machined');
    expect(statusLook('dealer', 'approved').tone).toBe('machined');
    expect(statusLook('stock', 'low').tone).toBe('amber');
  });
});
