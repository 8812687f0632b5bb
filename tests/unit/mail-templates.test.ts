import { describe, expect, it } from 'vitest';
import { renderBackOrderNotice, type BackOrderNoticeData } from '../../server/services/mail-templates/back-order-notice';
import {
  renderDealerApplicationApproved,
  type DealerApplicationApprovedData,
} from '../../server/services/mail-templates/dealer-application-approved';
import {
  renderDealerApplicationDeclined,
  type DealerApplicationDeclinedData,
} from '../../server/services/mail-templates/dealer-application-declined';
import {
  renderDealerApplicationReceived,
  type DealerApplicationReceivedData,
} from '../../server/services/mail-templates/dealer-application-received';
import { renderDispatchNotice, type DispatchNoticeData } from '../../server/services/mail-templates/dispatch-notice';
import { escapeHtml } from '../../server/services/mail-templates/escape-html';
import { FITTING_CAUTION_TEXT } from '../../server/services/mail-templates/fitting-caution';
import { duration, money, webUrl } from '../../server/services/mail-templates/format';
import { DISTRIBUTOR_ADDRESS, DISTRIBUTOR_NAME, MAIL_COLOURS } from '../../server/services/mail-templates/layout';
import {
  renderOrderConfirmation,
  type OrderConfirmationData,
  type OrderConfirmationLine,
} from '../../server/services/mail-templates/order-confirmation';
import { renderPasswordReset, type PasswordResetData } from '../../server/services/mail-templates/password-reset';
import { renderPaymentFailed, type PaymentFailedData } from '../../server/services/mail-templates/payment-failed';
import { renderReturnDecision, type ReturnDecisionData } from '../../server/services/mail-templates/return-decision';
import type { MailAddress, RenderedMail } from '../../server/services/mail-templates/types';

const SCRIPT_NAME = 'Robin <script>alert("x")</script> & Co';
const BASE = 'http://127.0.0.1:5173';

/** What a reader sees in the HTML part: tags dropped, the entities the escaper writes decoded. */
function visibleText(html: string): string {
  return html
    .replace(/<(style|script)[\s\S]*?<\/\1>/gi, '')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&middot;/g, '·')
    .replace(/&#9888;|&#9684;/g, '')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ');
}

function expectInBoth(mail: RenderedMail, ...values: string[]): void {
  const seen = visibleText(mail.html);
  for (const value of values) {
    expect(mail.text, `text part lacks ${value}`).toContain(value);
    expect(seen, `html part lacks ${value}`).toContain(value);
  }
}

function expectWellFormedParts(mail: RenderedMail): void {
  expect(mail.subject).not.toMatch(/[\r\n]/);
  // No markup or entities of the template's own leak into the text part (user text may hold brackets).
  expect(mail.text).not.toMatch(/<\/?(p|br|table|tr|td|th|span|a|strong|h1|h2|div)\b|&(amp|lt|gt|quot|#39);/i);
  expect(mail.html).toMatch(/^<!DOCTYPE html>/);
  // Mail clients drop <style> and linked sheets, so the look must be inline.
  expect(mail.html).not.toMatch(/<style|<link|<script/i);
  expectInBoth(mail, DISTRIBUTOR_NAME, DISTRIBUTOR_ADDRESS);
}

function createAddress(overrides: Partial<MailAddress> = {}): MailAddress {
  return { name: 'Robin Vale', company: 'Vale Diesel Works', lines: ['14 Kiln Lane'], city: 'Ashcombe', postalCode: '00042', ...overrides };
}

function createOrderLine(overrides: Partial<OrderConfirmationLine> = {}): OrderConfirmationLine {
  return {
    partNumber: 'FLG-50-0203',
    title: 'Turbine inlet flange gasket',
    category: 'gaskets-fittings',
    quantity: 4,
    unitPriceCents: 650,
    lineTotalCents: 2600,
    ...overrides,
  };
}

function createOrderConfirmation(overrides: Partial<OrderConfirmationData> = {}): OrderConfirmationData {
  return {
    orderNumber: 'SY-1042',
    customerName: 'Robin Vale',
    placedAt: new Date('2025-03-04T10:00:00Z'),
    lines: [createOrderLine()],
    totals: { goodsCents: 2600, dealerDiscountCents: 0, coreDepositsCents: 0, freightCents: 1250, taxCents: 311, totalCents: 4161 },
    deliveryAddress: createAddress(),
    payment: { method: 'card', status: 'paid', cardLast4: '4242' },
    orderUrl: `${BASE}/orders/SY-1042`,
    ...overrides,
  };
}

function createDealerOrder(): OrderConfirmationData {
  return createOrderConfirmation({
    customerName: 'Sam Ferrow',
    lines: [
      createOrderLine({
        partNumber: 'FUL-10-0201-XCH',
        title: 'Vanecraft Fuller (FUL) turbocharger, journal bearing (exchange unit)',
        category: 'turbochargers',
        quantity: 3,
        unitPriceCents: 84900,
        lineTotalCents: 254700,
        coreDepositCents: 22000,
        backOrderedQuantity: 1,
      }),
      createOrderLine(),
    ],
    totals: {
      goodsCents: 257300,
      dealerDiscountCents: 38595,
      coreDepositsCents: 66000,
      freightCents: 4500,
      taxCents: 17496,
      totalCents: 306701,
    },
    payment: { method: 'account', purchaseOrder: 'PO-7781', paymentTerms: 'Net 30 days' },
  });
}

describe('escapeHtml', () => {
  it('escapes the five characters that matter in text and quoted attributes', () => {
    // The OWASP XSS prevention cheat sheet lists & < > " ' for HTML entity encoding.
    expect(escapeHtml(`<script>alert("x")</script> & 'y'`)).toBe(
      '&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;y&#39;',
    );
    expect(escapeHtml(42)).toBe('42');
  });
});

describe('formatting helpers', () => {
  it('formats integer cents as US dollars', () => {
    // en-US currency pattern with grouping and two decimals, as in CLDR (from memory).
    expect(money(123450)).toBe('$1,234.50');
    expect(money(5)).toBe('$0.05');
    expect(() => money(10.5)).toThrow(RangeError);
  });

  it('names link lifetimes in the largest whole unit', () => {
    expect(duration(60)).toBe('1 hour');
    expect(duration(90)).toBe('90 minutes');
    expect(duration(2880)).toBe('2 days');
  });

  it('allows only web links', () => {
    expect(webUrl(`${BASE}/x`)).toBe(`${BASE}/x`);
    expect(() => webUrl('javascript:alert(1)')).toThrow(TypeError);
  });
});

describe('order confirmation', () => {
  it('shows every figure of a retail card order in both parts and no dealer fields', () => {
    const mail = renderOrderConfirmation(createOrderConfirmation());
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Order SY-1042 confirmed');
    expectInBoth(mail, 'SY-1042', 'FLG-50-0203', 'Turbine inlet flange gasket', '$6.50', '$26.00', '$12.50', '$3.11', '$41.61');
    expectInBoth(mail, '14 Kiln Lane', 'Ashcombe 00042', 'Card ending 4242, paid');
    expect(mail.text).toContain(`See your order: ${BASE}/orders/SY-1042`);
    expect(mail.html).toContain(`href="${BASE}/orders/SY-1042"`);
    for (const part of [mail.subject, mail.text, visibleText(mail.html)]) {
      expect(part).not.toMatch(/\bPO\b|Purchase order|Dealer discount|back-order/i);
    }
    // A gasket alone is not run on an engine, so no fitting caution.
    expect(mail.text).not.toContain(FITTING_CAUTION_TEXT);
  });

  it('carries PO number, terms, discount, core deposits and marked back-orders for a dealer', () => {
    const mail = renderOrderConfirmation(createDealerOrder());
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Order SY-1042 confirmed (PO: PO-7781) (part on back-order)');
    expectInBoth(mail, 'PO-7781', 'Net 30 days', 'Dealer discount', '-$385.95', '$660.00', '$3,067.01', '$2,547.00');
    // Per-unit deposit times quantity: 3 x $220.00.
    expectInBoth(mail, '$220.00', 'Core deposit');
    expect(mail.text).toContain('Core deposit (refundable): 3 x $220.00 = $660.00');
    expect(mail.text).toContain('BACK-ORDER: 2 ship now, 1 on back-order until stock arrives');
    expect(mail.html).toMatch(/Back-order<\/span> 2 ship now, 1 on back-order/);
    // The back-order mark sits on the turbocharger line, not on the gasket.
    const gasketBlock = mail.text.slice(mail.text.indexOf('FLG-50-0203'), mail.text.indexOf('TOTALS'));
    expect(gasketBlock).not.toContain('BACK-ORDER');
  });

  it('says the payment is still being confirmed for a pending card order', () => {
    const mail = renderOrderConfirmation(createOrderConfirmation({ payment: { method: 'card', status: 'pending' } }));
    expectInBoth(mail, 'Card, payment being confirmed', 'waiting for the card payment');
  });

  it('adds the fitting caution for complete turbochargers and cartridges', () => {
    for (const category of ['turbochargers', 'cartridges'] as const) {
      const mail = renderOrderConfirmation(createOrderConfirmation({ lines: [createOrderLine({ category })] }));
      expectInBoth(mail, 'Prime the oil supply before the first start', 'hot enough to burn', 'licensed mechanic');
      expect(mail.html).toContain(`border-left:4px solid ${MAIL_COLOURS.amber}`);
      expect(mail.html).toContain(MAIL_COLOURS.amberTint);
    }
  });

  it('escapes user-supplied values in the HTML part and keeps them readable', () => {
    const mail = renderOrderConfirmation(
      createOrderConfirmation({
        customerName: SCRIPT_NAME,
        deliveryAddress: createAddress({ lines: ['<img src=x onerror=alert(1)>'] }),
        payment: { method: 'account', purchaseOrder: '"><script>1</script>', paymentTerms: 'Net 30' },
      }),
    );
    expect(mail.html).not.toMatch(/<script|<img/i);
    expect(mail.html).toContain('Robin &lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; Co');
    expect(visibleText(mail.html)).toContain(SCRIPT_NAME);
    expect(mail.text).toContain(`Hello ${SCRIPT_NAME},`);
  });

  it('uses the house palette and table layout', () => {
    const { html } = renderOrderConfirmation(createOrderConfirmation());
    for (const colour of [MAIL_COLOURS.ink, MAIL_COLOURS.paper, MAIL_COLOURS.temper]) expect(html).toContain(colour);
    expect(html).toContain('role="presentation"');
  });

  it('refuses a link that is not a web address', () => {
    expect(() => renderOrderConfirmation(createOrderConfirmation({ orderUrl: 'javascript:alert(1)' }))).toThrow(TypeError);
  });
});

describe('payment failure', () => {
  const data: PaymentFailedData = {
    orderNumber: 'SY-1043',
    customerName: SCRIPT_NAME,
    amountCents: 48250,
    declineMessage: 'Your card has insufficient funds.',
    retryUrl: `${BASE}/orders/SY-1043/pay`,
  };

  it('says what happened, the decline message and where to retry', () => {
    const mail = renderPaymentFailed(data);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Payment for order SY-1043 did not go through');
    expectInBoth(mail, '$482.50', 'SY-1043', 'Your card has insufficient funds.', 'No money has been taken');
    expect(mail.text).toContain(data.retryUrl);
    expect(mail.html).toContain(`href="${data.retryUrl}"`);
    expect(mail.html).not.toContain('<script');
  });
});

describe('dealer applications', () => {
  const received: DealerApplicationReceivedData = {
    contactName: 'Sam Ferrow',
    companyName: 'Ferrow <b>Diesel</b>',
    submittedAt: new Date('2025-05-02T08:00:00Z'),
  };
  const approved: DealerApplicationApprovedData = {
    contactName: 'Sam Ferrow',
    companyName: 'Ferrow Diesel',
    tier: 'Trade 2',
    discountPercent: 12.5,
    creditLimitCents: 1_500_000,
    paymentTerms: 'Net 30 days',
    signInUrl: `${BASE}/sign-in`,
  };
  const declined: DealerApplicationDeclinedData = {
    contactName: 'Sam Ferrow',
    companyName: 'Ferrow Diesel',
    reason: 'We could not confirm a trading address <yet>.',
  };

  it('acknowledges an application', () => {
    const mail = renderDealerApplicationReceived(received);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('We have your dealer application for Ferrow <b>Diesel</b>');
    expectInBoth(mail, 'Sam Ferrow', 'Ferrow <b>Diesel</b>', 'May 2, 2025');
    expect(mail.html).not.toContain('<b>Diesel');
  });

  it('gives tier, discount, credit limit and terms on approval', () => {
    const mail = renderDealerApplicationApproved(approved);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Dealer account approved for Ferrow Diesel');
    expectInBoth(mail, 'Trade 2', '12.5%', '$15,000.00', 'Net 30 days');
    expect(mail.text).toContain(`Sign in: ${approved.signInUrl}`);
    expect(mail.html).toContain(`href="${approved.signInUrl}"`);
  });

  it('gives the reason on a decline', () => {
    const mail = renderDealerApplicationDeclined(declined);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Your dealer application for Ferrow Diesel');
    expectInBoth(mail, 'We could not confirm a trading address <yet>.', 'not able to open one');
    expect(mail.html).toContain('&lt;yet&gt;');
  });
});

describe('password reset', () => {
  const data: PasswordResetData = { name: 'Robin Vale', resetUrl: `${BASE}/reset-password?token=a1b2&x=1`, expiresInMinutes: 60 };

  it('gives the link and how long it works', () => {
    const mail = renderPasswordReset(data);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Reset your Spoolyard password');
    expectInBoth(mail, data.resetUrl, '1 hour', 'ignore this message');
    // The & in the query string is escaped inside the attribute.
    expect(mail.html).toContain(`href="${BASE}/reset-password?token=a1b2&amp;x=1"`);
  });
});

describe('back-order notice', () => {
  const data: BackOrderNoticeData = {
    orderNumber: 'SY-1044',
    customerName: 'Sam Ferrow',
    cause: 'short-pick',
    lines: [
      { partNumber: 'GIM-20-0203', title: 'Vanecraft Gimlet (GIM) cartridge, ball bearing', orderedQuantity: 3, backOrderedQuantity: 2, expectedDate: new Date('2025-06-10T00:00:00Z') },
      { partNumber: 'FLG-50-0203', title: 'Turbine inlet flange gasket', orderedQuantity: 5, backOrderedQuantity: 5 },
    ],
    orderUrl: `${BASE}/orders/SY-1044`,
  };

  it('names each waiting line and quantity', () => {
    const mail = renderBackOrderNotice(data);
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Order SY-1044: 7 items on back-order');
    expectInBoth(mail, 'GIM-20-0203', 'FLG-50-0203', 'Jun 10, 2025', 'awaiting stock', 'fewer on the shelf');
    expect(mail.text).toContain('BACK-ORDER: 2 of 3 waiting, expected Jun 10, 2025');
    expect(mail.text).toContain('BACK-ORDER: 5 of 5 waiting, awaiting stock');
    expect(mail.html.match(/Back-order<\/span>/g)).toHaveLength(2);
  });

  it('explains a back-order chosen at checkout differently from a short pick', () => {
    const mail = renderBackOrderNotice({ ...data, cause: 'checkout' });
    expectInBoth(mail, 'as agreed at checkout');
    expect(mail.text).not.toContain('fewer on the shelf');
  });
});

describe('dispatch notice', () => {
  function createDispatch(overrides: Partial<DispatchNoticeData> = {}): DispatchNoticeData {
    return {
      orderNumber: 'SY-1045',
      customerName: SCRIPT_NAME,
      dispatchedAt: new Date('2025-06-12T15:00:00Z'),
      carrier: 'Cobbleline Freight',
      trackingNumber: 'CF123456789',
      trackingUrl: `${BASE}/track/CF123456789`,
      cartons: 2,
      weightKg: 18.4,
      lines: [{ partNumber: 'FUL-10-0201', title: 'Vanecraft Fuller (FUL) turbocharger, journal bearing', category: 'turbochargers', quantity: 1 }],
      stillBackOrdered: [{ partNumber: 'FLG-50-0203', title: 'Turbine inlet flange gasket', quantity: 2 }],
      deliveryAddress: createAddress(),
      orderUrl: `${BASE}/orders/SY-1045`,
      ...overrides,
    };
  }

  it('gives carrier, tracking number, cartons and lines in both parts', () => {
    const mail = renderDispatchNotice(createDispatch());
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Order SY-1045 is on its way: Cobbleline Freight CF123456789');
    expectInBoth(mail, 'Cobbleline Freight', 'CF123456789', 'Cartons', '18.4 kg', 'FUL-10-0201', 'Jun 12, 2025', '14 Kiln Lane');
    expect(mail.text).toContain('BACK-ORDER: 2 to follow when stock arrives');
    expect(mail.html).toContain(`href="${BASE}/track/CF123456789"`);
    expect(mail.html).not.toContain('<script');
  });

  it('carries the fitting caution for a turbocharger and not for gaskets alone', () => {
    expectInBoth(renderDispatchNotice(createDispatch()), FITTING_CAUTION_TEXT);
    const gaskets = renderDispatchNotice(
      createDispatch({ lines: [{ partNumber: 'FLG-50-0203', title: 'Turbine inlet flange gasket', category: 'gaskets-fittings', quantity: 2 }] }),
    );
    expect(gaskets.text).not.toContain(FITTING_CAUTION_TEXT);
    expect(gaskets.html).not.toContain('Prime the oil supply');
  });
});

describe('return decision', () => {
  function createReturn(outcome: ReturnDecisionData['outcome']): ReturnDecisionData {
    return {
      customerName: 'Sam Ferrow',
      returnReference: 'RT-0311',
      orderNumber: 'SY-1046',
      partNumber: 'FUL-10-0201-XCH',
      title: 'Vanecraft Fuller (FUL) turbocharger (exchange unit)',
      quantity: 1,
      conditionGrade: 'rebuildable, housing intact',
      outcome,
      orderUrl: `${BASE}/orders/SY-1046`,
    };
  }

  it('states a partial card refund and its amount', () => {
    const mail = renderReturnDecision(createReturn({ kind: 'refund', amountCents: 12000, partial: true, route: { via: 'card' } }));
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Return RT-0311: partial refund of $120.00');
    expectInBoth(mail, '$120.00', 'partial refund', 'card you paid with', 'rebuildable, housing intact', 'RT-0311', 'SY-1046');
  });

  it('states a core deposit refund as a credit note on account', () => {
    const mail = renderReturnDecision(
      createReturn({ kind: 'core-deposit-refund', amountCents: 22000, route: { via: 'credit-note', creditNoteNumber: 'CN-0042' } }),
    );
    expect(mail.subject).toBe('Return RT-0311: core deposit refund of $220.00');
    expectInBoth(mail, 'core deposit of $220.00', 'CN-0042', 'passed inspection');
  });

  it('gives the reason for a rejection and no amount', () => {
    const mail = renderReturnDecision(createReturn({ kind: 'rejected', reason: 'Cracked turbine housing <beyond repair>' }));
    expectWellFormedParts(mail);
    expect(mail.subject).toBe('Return RT-0311: not accepted');
    expectInBoth(mail, 'Cracked turbine housing <beyond repair>', 'no refund is due');
    expect(mail.text).not.toMatch(/\$\d/);
    expect(mail.html).toContain('&lt;beyond repair&gt;');
  });
});
