export const unitsKeys = {
  all: ['units'] as const,
  mine: (page: number) => [...unitsKeys.all, 'mine', page] as const,
  one: (serial: string) => [...unitsKeys.all, 'one', serial] as const,
};
