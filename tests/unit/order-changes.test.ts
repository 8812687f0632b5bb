import { describe, expect, it } from 'vitest';
import { changeRefusal, reduceLine, repriceOrder } from '../../shared/order-changes';
import { priceOrder } from '../../shared/pricing';

describe('which orders may change', () => {
  const clean = [{ quantityPicked: 0, quantityDispatched: 0 }];
  it('allows a change or a cancel while the order waits for the warehouse', () => {
    for (const status of ['paid', 'on_account', 'back_ordered'] as const) {
      expect(changeRefusal({ number: 'SY-1', status }, clean, 'change')).toBeNull();
      expect(changeRefusal({ number: 'SY-1', status }, clean, 'cancel')).toBeNull();
    }
  });
  it('refuses once anything is picked or dispatched, whatever the status says', () => {
    expect(changeRefusal({ number: 'SY-1', status: 'picking' }, clean, 'cancel')).toMatch(/started picking/);
    expect(changeRefusal({ number: 'SY-1', status: 'back_ordered' }, [{ quantityPicked: 1, quantityDispatched: 0 }], 'change')).toMatch(/started picking/);
    expect(changeRefusal({ number: 'SY-1', status: 'back_ordered' }, [{ quantityPicked: 1, quantityDispatched: 1 }], 'change')).toMatch(/left the warehouse/);
    expect(changeRefusal({ number: 'SY-1', status: 'cancelled' }, clean, 'cancel')).toMatch(/already cancelled/);
  });
  it('lets an unpaid card order be cancelled but not changed', () => {
    expect(changeRefusal({ number: 'SY-1', status: 'pending_payment' }, clean, 'cancel')).toBeNull();
    expect(changeRefusal({ number: 'SY-1', status: 'pending_payment' }, clean, 'change')).toMatch(/not confirmed yet/);
  });
});

describe('taking units off a line', () => {
  it('drops units waiting for stock before units held on the shelf', () => {
    expect(reduceLine({ quantity: 5, quantityBackordered: 3 }, 4)).toEqual({ dropBackordered: 1, release: 0 });
    expect(reduceLine({ quantity: 5, quantityBackordered: 3 }, 1)).toEqual({ dropBackordered: 3, release: 1 });
    expect(reduceLine({ quantity: 5, quantityBackordered: 0 }, 0)).toEqual({ dropBackordered: 0, release: 5 });
  });
  it('never raises a quantity', () => {
    expect(() => reduceLine({ quantity: 2, quantityBackordered: 0 }, 3)).toThrow(RangeError);
  });
});

describe('repricing an amended order', () => {
  const lines = [
    { partNumber: 'A', quantity: 3, retailUnitPriceCents: 12_345, unitPriceCents: 10_493, coreDepositCents: 14_000, weightGrams: 2_100 },
    { partNumber: 'B', quantity: 2, retailUnitPriceCents: 2_500, unitPriceCents: 2_125, coreDepositCents: 0, weightGrams: 120 },
  ];
  it('prices an unchanged order to what checkout charged (same freight table, tax rule and dealer prices)', () => {
    const atCheckout = priceOrder(
      lines.map((l) => ({ partNumber: l.partNumber, quantity: l.quantity, retailUnitCents: l.retailUnitPriceCents, coreDepositCents: l.coreDepositCents, weightGrams: l.weightGrams })),
      { kind: 'dealer', tier: 'preferred' },
      'national',
      8,
    );
    const again = repriceOrder(lines, 'national', 8);
    expect(again).toEqual({
      goodsCents: atCheckout.goodsCents,
      discountCents: atCheckout.discountCents,
      coreDepositCents: atCheckout.coreDepositCents,
      freightCents: atCheckout.freightCents,
      taxCents: atCheckout.taxCents,
      totalCents: atCheckout.totalCents,
      weightGrams: atCheckout.weightGrams,
    });
  });
  it('drops freight to the lighter band when units come off (worked by hand)', () => {
    // 1 × $104.93 + deposit $140.00, 2.1 kg national → $16.95 freight; tax 8 % of ($104.93 + $16.95) = $9.75.
    expect(repriceOrder([{ ...lines[0]!, quantity: 1 }, { ...lines[1]!, quantity: 0 }], 'national', 8)).toMatchObject({
      goodsCents: 10_493,
      freightCents: 1_695,
      taxCents: 975,
      totalCents: 10_493 + 14_000 + 1_695 + 975,
    });
  });
});
