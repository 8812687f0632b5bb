export const returnsKeys = {
  all: ['returns'] as const,
  list: () => [...returnsKeys.all, 'list'] as const,
};
