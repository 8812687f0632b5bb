export const serviceKeys = {
  all: ['service'] as const,
  list: (page = 1) => [...serviceKeys.all, 'list', page] as const,
  detail: (reference: string) => [...serviceKeys.all, 'detail', reference] as const,
  label: (reference: string) => [...serviceKeys.all, 'label', reference] as const,
  invoice: (reference: string) => [...serviceKeys.all, 'invoice', reference] as const,
  bench: ['bench'] as const,
  queue: (queue: string, page: number) => [...serviceKeys.bench, 'queue', queue, page] as const,
  benchRequest: (reference: string) => [...serviceKeys.bench, 'request', reference] as const,
};
