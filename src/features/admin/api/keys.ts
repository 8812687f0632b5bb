export const adminKeys = {
  all: ['admin'] as const,
  dealers: () => [...adminKeys.all, 'dealers'] as const,
  /** Every page of the dealer list (and not the invoices, which sit under dealers() too). */
  dealerPages: () => [...adminKeys.all, 'dealers', 'page'] as const,
  dealersPage: (page: number) => [...adminKeys.dealerPages(), page] as const,
  invoices: (dealerId: number) => [...adminKeys.all, 'dealers', dealerId, 'invoices'] as const,
};
