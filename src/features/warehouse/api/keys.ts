import type { PickQueueQuery } from '../../../../shared/schemas/warehouse';

export const warehouseKeys = {
  all: ['warehouse'] as const,
  queue: () => [...warehouseKeys.all, 'pick-queue'] as const,
  queuePage: (query: PickQueueQuery) => [...warehouseKeys.queue(), query] as const,
  pickLists: () => [...warehouseKeys.all, 'pick-list'] as const,
  pickList: (orders: readonly string[]) => [...warehouseKeys.pickLists(), [...orders].sort().join(',')] as const,
  bins: () => [...warehouseKeys.all, 'bins'] as const,
  stock: () => [...warehouseKeys.all, 'stock'] as const,
  stockPart: (partNumber: string) => [...warehouseKeys.stock(), partNumber] as const,
  lowStock: () => [...warehouseKeys.all, 'low-stock'] as const,
  returns: () => [...warehouseKeys.all, 'returns'] as const,
  returnList: (status: 'requested' | 'all', page = 1) => [...warehouseKeys.returns(), status, page] as const,
  returnByCode: (code: string) => [...warehouseKeys.returns(), 'code', code] as const,
  labels: (query: string) => [...warehouseKeys.all, 'labels', query] as const,
};
