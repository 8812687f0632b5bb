export const fitmentKeys = {
  all: ['fitment'] as const,
  frameMaps: () => [...fitmentKeys.all, 'frame-maps'] as const,
  saved: () => [...fitmentKeys.all, 'saved'] as const,
  savedOne: (id: number) => [...fitmentKeys.saved(), id] as const,
  frameParts: (frameCode: string) => [...fitmentKeys.all, 'frame-parts', frameCode] as const,
};
