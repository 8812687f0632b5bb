export const tradeKeys = {
  all: ['trade'] as const,
  check: (lines: Array<{ partNumber: string; quantity: string }>) => [...tradeKeys.all, 'check', lines] as const,
};
