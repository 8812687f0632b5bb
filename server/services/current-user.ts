import type { Role } from './auth';

export interface DealerInfo {
  id: number;
  companyName: string;
  status: 'pending' | 'approved' | 'declined';
  tier: 'standard' | 'preferred' | 'partner' | null;
  creditLimitCents: number;
  paymentTermsDays: number;
  deliveryZone: string;
  declineReason: string | null;
  address: { line1: string; city: string; postcode: string };
}

/** The signed-in user as services see it: the session middleware loads it once per request. */
export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  dealer: DealerInfo | null;
}
