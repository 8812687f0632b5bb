export const adminKeys = {
  all: ['admin'] as const,
  dealers: () => [...adminKeys.all, 'dealers'] as const,
};
