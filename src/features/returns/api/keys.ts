export const returnsKeys = {
  all: ['returns'] as const,
  lists: () => [...returnsKeys.all, 'list'] as const,
  list: (page = 1) => [...returnsKeys.lists(), page] as const,
  label: (reference: string) => [...returnsKeys.all, 'label', reference] as const,
};
