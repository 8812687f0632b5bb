export const adminKeys = {
  all: ['admin'] as const,
  dealers: () => [...adminKeys.all, 'dealers'] as const,
  invoices: (dealerId: number) => [...adminKeys.all, 'dealers', dealerId, 'invoices'] as const,
};
