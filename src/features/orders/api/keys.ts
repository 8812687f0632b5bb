export const orderKeys = {
  all: ['orders'] as const,
  list: () => [...orderKeys.all, 'list'] as const,
  detail: (number: string) => [...orderKeys.all, 'detail', number] as const,
};
