export const returnsKeys = {
  all: ['returns'] as const,
  list: () => [...returnsKeys.all, 'list'] as const,
  orders: () => [...returnsKeys.all, 'orders'] as const,
  order: (number: string) => [...returnsKeys.all, 'order', number] as const,
};
