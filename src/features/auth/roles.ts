import type { Me } from '../../../shared/schemas/accounts';

export type Role = NonNullable<Me['user']>['role'];

export const ROLE_LABELS: Record<Role, string> = {
  customer: 'Retail buyer',
  dealer: 'Dealer',
  warehouse: 'Warehouse staff',
  workshop: 'Workshop staff',
  admin: 'Administrator',
};

/** Where each role starts its day: staff in their workspace, buyers at the Counter. */
export const ROLE_HOME: Record<Role, string> = {
  customer: '/',
  dealer: '/',
  warehouse: '/floor',
  workshop: '/bench',
  admin: '/office',
};
