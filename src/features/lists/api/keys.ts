export const listKeys = {
  all: ['parts-lists'] as const,
  index: () => [...listKeys.all, 'index'] as const,
  detail: (id: number) => [...listKeys.all, 'detail', id] as const,
};
