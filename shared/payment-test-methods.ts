/**
 * Test payment-method tokens the payments fake understands. The ids are the provider's documented
 * test tokens (from memory), so code written against the fake also runs against the provider's test mode.
 * Shared so the app's development card step offers exactly what the fake understands.
 */
export const TEST_PAYMENT_METHODS = {
  success: 'pm_card_visa',
  successAlt: 'pm_card_mastercard',
  declined: 'pm_card_chargeDeclined',
  insufficientFunds: 'pm_card_chargeDeclinedInsufficientFunds',
  authenticationRequired: 'pm_card_authenticationRequired',
} as const;

export type TestPaymentMethodId = (typeof TEST_PAYMENT_METHODS)[keyof typeof TEST_PAYMENT_METHODS];

export type TestCardBehaviour = 'succeed' | 'decline' | 'authenticate';

export interface TestCard {
  id: TestPaymentMethodId;
  label: string;
  brand: string;
  last4: string;
  behaviour: TestCardBehaviour;
  /** Only for declines: the provider's decline code and customer-facing message (from memory). */
  declineCode?: string;
  declineMessage?: string;
}

export const TEST_CARDS: Readonly<Record<TestPaymentMethodId, TestCard>> = {
  pm_card_visa: {
    id: 'pm_card_visa',
    label: 'Test card ending 4242 - payment succeeds',
    brand: 'visa',
    last4: '4242',
    behaviour: 'succeed',
  },
  pm_card_mastercard: {
    id: 'pm_card_mastercard',
    label: 'Test card ending 4444 - payment succeeds',
    brand: 'mastercard',
    last4: '4444',
    behaviour: 'succeed',
  },
  pm_card_chargeDeclined: {
    id: 'pm_card_chargeDeclined',
    label: 'Test card ending 0002 - declined',
    brand: 'visa',
    last4: '0002',
    behaviour: 'decline',
    declineCode: 'generic_decline',
    declineMessage: 'Your card was declined.',
  },
  pm_card_chargeDeclinedInsufficientFunds: {
    id: 'pm_card_chargeDeclinedInsufficientFunds',
    label: 'Test card ending 9995 - declined, insufficient funds',
    brand: 'visa',
    last4: '9995',
    behaviour: 'decline',
    declineCode: 'insufficient_funds',
    declineMessage: 'Your card has insufficient funds.',
  },
  pm_card_authenticationRequired: {
    id: 'pm_card_authenticationRequired',
    label: 'Test card ending 3184 - needs 3-D Secure authentication',
    brand: 'visa',
    last4: '3184',
    behaviour: 'authenticate',
  },
};

export function isTestPaymentMethodId(id: string): id is TestPaymentMethodId {
  return Object.hasOwn(TEST_CARDS, id);
}
