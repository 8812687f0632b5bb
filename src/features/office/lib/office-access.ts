import type { Me } from '../../../../shared/schemas/accounts';
import type { OfficeAccess } from '../components/office-shell';

const ROLE_WORDS: Record<NonNullable<Me['user']>['role'], string> = { customer: 'a retail buyer', dealer: 'a dealer', warehouse: 'warehouse staff', workshop: 'workshop staff', admin: 'an administrator' };

/** Who may use the Office, from the signed-in user (the server checks again on every call). */
export function officeAccess(me: { isPending: boolean; data?: Me | undefined }): OfficeAccess {
  if (me.isPending) return { state: 'loading' };
  const user = me.data?.user;
  if (!user) return { state: 'signed-out' };
  if (user.role !== 'admin') return { state: 'denied', roleLabel: ROLE_WORDS[user.role] };
  return { state: 'allowed' };
}
