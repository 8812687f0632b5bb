import type { PartsQuery } from '../../../../shared/schemas/parts';

export const catalogKeys = {
  all: ['catalog'] as const,
  parts: (query: PartsQuery) => [...catalogKeys.all, 'parts', query] as const,
  part: (partNumber: string) => [...catalogKeys.all, 'part', partNumber] as const,
  frames: () => [...catalogKeys.all, 'frames'] as const,
  frame: (code: string) => [...catalogKeys.all, 'frame', code] as const,
};
