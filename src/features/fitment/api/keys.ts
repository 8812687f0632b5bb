export const fitmentKeys = {
  all: ['fitment'] as const,
  frameMaps: () => [...fitmentKeys.all, 'frame-maps'] as const,
  saved: () => [...fitmentKeys.all, 'saved'] as const,
  savedOne: (id: number) => [...fitmentKeys.saved(), id] as const,
  frameDetail: (frameCode: string) => [...fitmentKeys.all, 'frame', frameCode] as const,
  frameParts: (frameCode: string) => [...fitmentKeys.all, 'frame-parts', frameCode] as const,
  buildParts: (frameCode: string, bearing: string) => [...fitmentKeys.all, 'build-parts', frameCode, bearing] as const,
  part: (partNumber: string) => [...fitmentKeys.all, 'part', partNumber] as const,
  shaftLogs: (savedId: number) => [...fitmentKeys.savedOne(savedId), 'shaft-logs'] as const,
  shaftLog: (savedId: number, logId: number) => [...fitmentKeys.shaftLogs(savedId), logId] as const,
};
