export const devKeys = {
  all: ['dev'] as const,
  mail: () => [...devKeys.all, 'mail'] as const,
};
