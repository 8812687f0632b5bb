export const officeKeys = {
  all: ['office'] as const,
  parts: (q: string, sort: string, page: number) => [...officeKeys.all, 'parts', { q, sort, page }] as const,
  part: (partNumber: string) => [...officeKeys.all, 'part', partNumber] as const,
  lookup: (partNumber: string) => [...officeKeys.all, 'lookup', partNumber] as const,
  priceImport: (id: number) => [...officeKeys.all, 'price-import', id] as const,
  priceImportHistory: (page: number) => [...officeKeys.all, 'price-import-history', page] as const,
  audit: (query: Record<string, string | number | undefined>) => [...officeKeys.all, 'audit', query] as const,
  mail: () => [...officeKeys.all, 'mail'] as const,
  mailList: (state: string, page: number) => [...officeKeys.mail(), { state, page }] as const,
  paymentAlerts: () => [...officeKeys.all, 'payment-alerts'] as const,
  summary: () => [...officeKeys.all, 'summary'] as const,
  serviceIntervals: () => [...officeKeys.all, 'service-intervals'] as const,
};
