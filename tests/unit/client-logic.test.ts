import { describe, expect, it } from 'vitest';
import type { CartLineView, CartView } from '../../shared/schemas/orders';
import { QUANTITY_MAX } from '../../shared/schemas/orders';
import type { PickLine } from '../../shared/schemas/warehouse';
import { serverFieldErrors, serverMessage, summaryItems, type SummaryField } from '../../src/components/ui/error-summary';
import { ApiError } from '../../src/lib/api-client';
import { blockedLines, readQuantity, shortBy, stepQuantity } from '../../src/features/cart/lib/cart-lines';
import { currentLine, isLineDone, normalisePartNumber, pickTarget, remainingToPick } from '../../src/features/warehouse/lib/pick-progress';

const createLine = (overrides: Partial<CartLineView> = {}): CartLineView => ({ id: 1, quantity: 1, available: 5, allowBackorder: false, ...overrides }) as CartLineView;
const createCart = (kind: 'retail' | 'dealer', lines: CartLineView[]): CartView => ({ lines, buyer: { kind, tier: null, discountPct: 0 } }) as unknown as CartView;

describe('cart lines', () => {
  it('a line is short by what stock cannot cover, never less than nothing', () => {
    expect(shortBy({ quantity: 7, available: 5 })).toBe(2);
    expect(shortBy({ quantity: 3, available: 5 })).toBe(0);
    expect(shortBy({ quantity: 2, available: 0 })).toBe(2);
  });

  it('a short line blocks checkout unless a dealer back-orders it; a retail buyer cannot back-order', () => {
    const short = createLine({ id: 2, quantity: 4, available: 1, allowBackorder: true });
    const covered = createLine({ id: 3, quantity: 1, available: 1 });
    expect(blockedLines(createCart('dealer', [short, covered]))).toEqual([]);
    expect(blockedLines(createCart('dealer', [{ ...short, allowBackorder: false }, covered])).map((l) => l.id)).toEqual([2]);
    expect(blockedLines(createCart('retail', [short, covered])).map((l) => l.id)).toEqual([2]);
  });

  it('reads a typed quantity only as a whole number from 1 to the most per line', () => {
    expect(readQuantity('3')).toBe(3);
    expect(readQuantity(' 12 ')).toBe(12);
    expect(readQuantity(String(QUANTITY_MAX))).toBe(QUANTITY_MAX);
    for (const bad of ['', '0', '-1', '1.5', 'two', String(QUANTITY_MAX + 1)]) expect(readQuantity(bad), bad).toBeNull();
  });

  it('the − and + buttons stay between 1 and the most per line', () => {
    expect(stepQuantity(1, -1)).toBe(1);
    expect(stepQuantity(2, 1)).toBe(3);
    expect(stepQuantity(QUANTITY_MAX, 1)).toBe(QUANTITY_MAX);
  });
});

const createPickLine = (overrides: Partial<PickLine> = {}): PickLine => ({ lineId: 1, quantity: 2, toPick: 2, picked: 0, backordered: 0, ...overrides }) as PickLine;

describe('a pick session on the Floor', () => {
  it('counts what is still to come off the shelf, leaving back-ordered units out', () => {
    const line = createPickLine({ quantity: 5, picked: 2, toPick: 1, backordered: 2 });
    expect(remainingToPick(line)).toBe(1);
    expect(pickTarget(line)).toBe(3);
    expect(isLineDone(line)).toBe(false);
    expect(isLineDone({ ...line, picked: 3, toPick: 0 })).toBe(true);
  });

  it('stays on the chosen line while it has units to pick, then moves to the first unfinished line in walk order', () => {
    const lines = [createPickLine({ lineId: 1, toPick: 0, picked: 2 }), createPickLine({ lineId: 2 }), createPickLine({ lineId: 3 })];
    expect(currentLine(lines, null)?.lineId).toBe(2);
    expect(currentLine(lines, 3)?.lineId).toBe(3);
    expect(currentLine(lines, 1)?.lineId).toBe(2);
    expect(currentLine(lines.map((l) => ({ ...l, toPick: 0 })), 2)).toBeNull();
  });

  it('reads a scanned or typed part number as stored (upper case, no spaces around)', () => {
    expect(normalisePartNumber('  crt-60-1142 ')).toBe('CRT-60-1142');
  });
});

const FIELDS: SummaryField[] = [
  { name: 'email', id: 'f-email', label: 'E-mail address' },
  { name: 'specs.trimPct', id: 'f-trim', label: 'Trim' },
];

describe('the error summary at the top of a form', () => {
  it('lists field errors in the form’s order, nested ones too, each linked to its field', () => {
    const errors = { specs: { trimPct: { type: 'too_big', message: 'at most 100' } }, email: { type: 'invalid', message: 'enter an e-mail address' } };
    expect(summaryItems(errors, FIELDS)).toEqual([
      { id: 'f-email', message: 'E-mail address: enter an e-mail address' },
      { id: 'f-trim', message: 'Trim: at most 100' },
    ]);
  });

  it('places the server’s field errors that have a field on the form, first message each', () => {
    const error = new ApiError(400, 'Check the form', { email: ['already in use', 'second'], other: ['not on this form'] });
    expect(serverFieldErrors(error, FIELDS)).toEqual([{ name: 'email', message: 'already in use' }]);
    expect(serverFieldErrors(new Error('offline'), FIELDS)).toEqual([]);
  });

  it('keeps the server’s message unless every field error it sent is already beside a field', () => {
    expect(serverMessage(new ApiError(400, 'Check the form', { email: ['already in use'] }), FIELDS)).toBeUndefined();
    expect(serverMessage(new ApiError(400, 'Check the form', { other: ['x'] }), FIELDS)).toBe('Check the form');
    expect(serverMessage(new ApiError(409, 'Only 2 left in that bin'), FIELDS)).toBe('Only 2 left in that bin');
    expect(serverMessage('not an error', FIELDS)).toBe('That did not work. Try again.');
  });
});
