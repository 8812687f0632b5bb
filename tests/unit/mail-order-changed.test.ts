import { describe, expect, it } from 'vitest';
import { renderOrderChanged, type OrderChangedData } from '../../server/services/mail-templates/order-changed';

const base: OrderChangedData = {
  orderNumber: 'SY-100042',
  customerName: 'Robin <b>Ashdown</b> & Co',
  kind: 'change',
  lines: [
    { partNumber: 'AWL-10-0202', title: 'Turbocharger <0.43 A/R>', before: 3, after: 1 },
    { partNumber: 'FLG-50-0201', title: 'Inlet gasket', before: 2, after: 0 },
  ],
  beforeTotalCents: 220_957,
  afterTotalCents: 73_218,
  adjustmentCents: 147_739,
  settlement: 'card-refund',
  orderUrl: 'https://shop.spoolyard.test/orders/SY-100042',
};

describe('the order-changed mail', () => {
  it('says what changed and what goes back to the card, in text and escaped HTML', () => {
    const mail = renderOrderChanged(base);
    expect(mail.subject).toBe('Order SY-100042 is changed');
    expect(mail.text).toContain('We are refunding $1,477.39 to the card you paid with.');
    expect(mail.text).toContain('QUANTITY: 3 → 1');
    expect(mail.text).toContain('TAKEN OFF: was 2');
    expect(mail.html).toContain('Robin &lt;b&gt;Ashdown&lt;/b&gt; &amp; Co');
    expect(mail.html).toContain('Turbocharger &lt;0.43 A/R&gt;');
    expect(mail.html).not.toContain('<b>Ashdown');
  });
  it('tells an account buyer the invoice is amended, or cancelled, with their purchase order', () => {
    const amended = renderOrderChanged({ ...base, settlement: 'amended-invoice', purchaseOrder: 'TBW-2207' });
    expect(amended.text).toContain('The invoice for this order (your purchase order TBW-2207) is amended from $2,209.57 to $732.18');
    const cancelled = renderOrderChanged({ ...base, kind: 'cancel', settlement: 'amended-invoice', afterTotalCents: 0, adjustmentCents: 220_957 });
    expect(cancelled.subject).toBe('Order SY-100042 is cancelled');
    expect(cancelled.text).toContain('is cancelled: you owe nothing for it');
  });
  it('says no money was taken when an unpaid card payment was cancelled', () => {
    expect(renderOrderChanged({ ...base, kind: 'cancel', settlement: 'payment-cancelled', adjustmentCents: 0 }).text).toContain('no money left your account');
  });
});
