import type { Me } from '../../../shared/schemas/accounts';

export type Role = NonNullable<Me['user']>['role'];

export const ROLE_LABELS: Record<Role, string> = {
  customer: 'Retail buyer',
  dealer: 'Dealer',
  warehouse: 'Warehouse staff',
  admin: 'Administrator',
};
