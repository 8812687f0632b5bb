import { asc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { bins, dealerAccounts, dealerMembers, parts, user as users } from '../../server/db/schema';
import type { DealerTier, DeliveryZone } from '../../shared/pricing';
import type { Role } from '../../shared/allowed-values';
import { normalizePartNumber } from '../../shared/part-number';
import { PartFormSchema, type PartForm } from '../../shared/schemas/admin-catalog';
import { CheckoutResponseSchema, type Checkout, type CheckoutResponse } from '../../shared/schemas/orders';
import { clientOf, type Client } from './session';
import type { TestApp } from './test-app';

/**
 * Test data made fresh for each test, so no test leans on what another left in a shared demo account: every row
 * gets a name no other row in the run has. Users sign up through the auth library and orders are placed through
 * the API, so the rows hold the same invariants as real ones.
 */

const SignUpReplySchema = z.object({ user: z.object({ id: z.string() }) });

let serial = 0;
const next = () => ++serial;

export const FACTORY_PASSWORD = 'factory-password-1';

export interface TestAccount {
  id: string;
  email: string;
  name: string;
  password: string;
  role: Role;
}

export interface TestUser extends TestAccount {
  /** Signed in: keeps its cookies and sends the app's own Origin, like the browser. */
  client: Client;
}

export interface UserOverrides {
  role?: Role;
  name?: string;
  email?: string;
  password?: string;
}

/** Signs up through the auth library; the address is then marked confirmed and the role set as the office would. */
async function signUp(t: TestApp, overrides: UserOverrides): Promise<TestAccount> {
  const n = next();
  const role = overrides.role ?? 'customer';
  const name = overrides.name ?? `Factory ${role} ${n}`;
  const email = overrides.email ?? `${role}-${n}-${process.pid}@factory.spoolyard.test`;
  const password = overrides.password ?? FACTORY_PASSWORD;
  const res = await t.app.auth.api.signUpEmail({ body: { name, email, password }, asResponse: true });
  if (!res.ok) throw new Error(`sign-up of ${email}: ${res.status} ${await res.text()}`);
  const { user } = SignUpReplySchema.parse(await res.json());
  t.db.update(users).set({ role, emailVerified: true }).where(eq(users.id, user.id)).run();
  return { id: user.id, email, name, password, role };
}

/** An account whose session nobody holds (for tests that count sign-ins). */
export async function createAccount(t: TestApp, overrides: UserOverrides = {}): Promise<TestAccount> {
  return signUp(t, overrides);
}

/**
 * A user and a client signed in as them. A new account signs in only once its address is confirmed, so the
 * session comes from a sign-in through the auth library (not through HTTP, where the sign-in limits apply).
 */
export async function createUser(t: TestApp, overrides: UserOverrides = {}): Promise<TestUser> {
  const account = await signUp(t, overrides);
  const res = await t.app.auth.api.signInEmail({ body: { email: account.email, password: account.password }, asResponse: true });
  if (!res.ok) throw new Error(`sign-in of ${account.email}: ${res.status} ${await res.text()}`);
  return { ...account, client: clientOf(t, res.headers.getSetCookie()) };
}

export const createCustomer = (t: TestApp, overrides: Omit<UserOverrides, 'role'> = {}) => createUser(t, { ...overrides, role: 'customer' });

export interface TestDealer extends TestUser {
  dealerAccountId: number;
  companyName: string;
  tier: DealerTier | null;
  creditLimitCents: number;
  paymentTermsDays: number;
}

export interface DealerOverrides extends Omit<UserOverrides, 'role'> {
  companyName?: string;
  status?: 'approved' | 'pending' | 'declined';
  tier?: DealerTier;
  /** Large by default, so a test that is not about credit never meets the limit. */
  creditLimitCents?: number;
  paymentTermsDays?: number;
  deliveryZone?: DeliveryZone;
}

/** A trade account with one member; approved (so its member is a dealer) unless told otherwise, as the office's decision leaves it. */
export async function createDealer(t: TestApp, overrides: DealerOverrides = {}): Promise<TestDealer> {
  const status = overrides.status ?? 'approved';
  const approved = status === 'approved';
  const buyer = await createUser(t, { ...overrides, role: approved ? 'dealer' : 'customer' });
  const companyName = overrides.companyName ?? `Factory Boost Works ${next()}`;
  const tier = approved ? (overrides.tier ?? 'standard') : null;
  const creditLimitCents = approved ? (overrides.creditLimitCents ?? 10_000_000) : 0;
  const paymentTermsDays = overrides.paymentTermsDays ?? 30;
  const dealerAccountId = t.db.transaction((tx) => {
    const row = tx
      .insert(dealerAccounts)
      .values({
        companyName,
        contactName: buyer.name,
        phone: '+10 555 0100',
        addressLine1: '1 Factory Yard',
        city: 'Testbury',
        postcode: 'TB1 1AA',
        deliveryZone: overrides.deliveryZone ?? 'national',
        status,
        tier,
        creditLimitCents,
        paymentTermsDays,
        decidedAt: status === 'pending' ? null : new Date().toISOString(),
      })
      .returning({ id: dealerAccounts.id })
      .get();
    tx.insert(dealerMembers).values({ userId: buyer.id, dealerAccountId: row.id }).run();
    return row.id;
  });
  return { ...buyer, dealerAccountId, companyName, tier, creditLimitCents, paymentTermsDays };
}

export interface TestPart {
  id: number;
  partNumber: string;
  priceCents: number;
  binCode: string;
}

export interface PartOverrides extends Partial<Omit<PartForm, 'partNumber' | 'specs'>> {
  /** Units put on the shelf through goods-in, so the ledger holds them. */
  stock?: number;
  /** The category's specifications (a bearing for a complete unit or cartridge, say). */
  specs?: PartForm['specs'];
  binCode?: string;
}

/**
 * A part of its own, made through the catalogue service and stocked through the stock service, so a test's stock
 * figures are not shared with any other test's. Numbered in a product line (9) the demo catalogue leaves empty.
 */
export function createPart(t: TestApp, overrides: PartOverrides = {}): TestPart {
  const { stock = 10, binCode: bin, ...fields } = overrides;
  const exchange = fields.condition === 'exchange';
  let partNumber: string;
  do partNumber = `FLG-59-${String(next()).padStart(4, '0')}${exchange ? '-XCH' : ''}`;
  while (t.db.select({ id: parts.id }).from(parts).where(eq(parts.normalizedNumber, normalizePartNumber(partNumber))).get());
  const form = PartFormSchema.parse({
    partNumber,
    title: `Factory flange gasket ${partNumber}`,
    category: 'gaskets-fittings',
    frameCode: null,
    condition: 'new',
    status: 'active',
    priceCents: 2_500,
    coreDepositCents: exchange ? 14_000 : 0,
    weightGrams: 120,
    minStock: 0,
    description: '',
    specs: {},
    ...fields,
  });
  t.app.catalogAdmin.create(null, form);
  const id = t.db.select({ id: parts.id }).from(parts).where(eq(parts.partNumber, partNumber)).get()!.id;
  const binCode = bin ?? t.db.select({ code: bins.code }).from(bins).orderBy(asc(bins.walkOrder)).limit(1).get()!.code;
  if (stock > 0) t.app.stock.goodsIn(id, binCode, stock, 'test setup');
  return { id, partNumber, priceCents: form.priceCents, binCode };
}

export interface OrderLine {
  partNumber: string;
  quantity: number;
  allowBackorder?: boolean;
}

export const TEST_DELIVERY = { name: 'Factory Buyer', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' } as const;

/**
 * Places an order through the API as `buyer`: the lines go into their cart, then checkout. A dealer pays on account
 * unless told otherwise; anyone else pays by card (which needs the app started with its fakes).
 */
export async function createOrder(buyer: TestUser, lines: OrderLine[], checkout?: Checkout): Promise<CheckoutResponse> {
  for (const line of lines) {
    const added = await buyer.client.send('POST', '/api/cart/lines', line);
    if (added.status !== 201) throw new Error(`adding ${line.partNumber} to ${buyer.email}'s cart: ${added.status} ${JSON.stringify(added.body)}`);
  }
  const body: Checkout =
    checkout ?? ('dealerAccountId' in buyer ? { method: 'account', purchaseOrder: `PO-${next()}` } : { method: 'card', paymentMethod: 'pm_card_visa', delivery: TEST_DELIVERY });
  const placed = await buyer.client.send('POST', '/api/checkout', body);
  if (placed.status !== 201) throw new Error(`checkout for ${buyer.email}: ${placed.status} ${JSON.stringify(placed.body)}`);
  return CheckoutResponseSchema.parse(placed.body);
}
