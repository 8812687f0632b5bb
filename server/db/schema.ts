import { sql } from 'drizzle-orm';
import {
  ALIAS_KINDS,
  AUDIT_ACTIONS,
  DEALER_STATUSES,
  inListSql,
  MAIL_KINDS,
  MAIL_STATES,
  NOTICE_KINDS,
  ORDER_CHANGE_KINDS,
  ORDER_CHANGE_REFUND_STATES,
  ORDER_CHANGE_SETTLEMENTS,
  ORDER_STATUSES,
  PART_CONDITIONS,
  PART_STATUSES,
  PAYMENT_METHODS,
  PAYMENT_ALERT_REFUND_STATES,
  PAYMENT_STATES,
  PRICE_IMPORT_STATUSES,
  RETURN_STATUSES,
  ROLES,
  SERVICE_PAYMENT_STATES,
  SERVICE_PHOTO_STAGES,
  SERVICE_STATUSES,
  STOCK_MOVEMENT_KINDS,
  UNIT_EVENT_KINDS,
  UNIT_ORIGINS,
} from '../../shared/allowed-values';
import { DEALER_TIER_KEYS, DELIVERY_ZONE_KEYS } from '../../shared/pricing';
import { BOOST_UNITS } from '../../shared/schemas/shaft-logs';
import { CONDITION_GRADE_KEYS, RETURN_KIND_KEYS } from '../../shared/schemas/warehouse';
import { BEARINGS, CATEGORIES, CATEGORY_SLUGS, type Bearing } from '../../shared/catalog';
import type { PriceImportRow } from '../../shared/schemas/admin-catalog';
import type { PriceFlag } from '../../shared/price-import-flags';
import { SHAFT_LOG_MAX_ROWS } from '../../shared/schemas/shaft-logs';
import { APPLICATIONS } from '../../shared/schemas/fitment';
import { CLOCK_POSITIONS } from '../../shared/exploded-view';
import { check, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';

/** The order the shop lists categories in; the same expression sorts the catalogue and backs an index. */
export const CATEGORY_ORDER_EXPR = `(CASE category ${CATEGORIES.map((c, i) => `WHEN '${c.slug}' THEN ${i}`).join(' ')} ELSE ${CATEGORIES.length} END)`;
const CATEGORY_ORDER_SQL = sql.raw(CATEGORY_ORDER_EXPR);
const stamp = (name: string) => text(name).notNull().default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);
const createdAt = () => stamp('created_at');
/** A CHECK that a column holds one of the allowed values (shared/allowed-values.ts); null passes where null is allowed. */
const oneOf = (table: string, column: string, values: readonly string[]) => check(`${table}_${column}_ck`, sql.raw(inListSql(column, values)));
/** A CHECK on plain column arithmetic, named after the table and what it holds. */
const holds = (table: string, name: string, expression: string) => check(`${table}_${name}_ck`, sql.raw(expression));
/**
 * A cart line's orientation as one value for its unique index, '' for none (null would make every line distinct). A
 * CASE, not ifnull(): drizzle-kit splits index expressions at commas. Upserts name the same expressions as target.
 */
export const CART_LINE_COMPRESSOR_CLOCK_KEY = sql.raw(`(CASE WHEN compressor_outlet_clock IS NULL THEN '' ELSE compressor_outlet_clock END)`);
export const CART_LINE_TURBINE_CLOCK_KEY = sql.raw(`(CASE WHEN turbine_inlet_clock IS NULL THEN '' ELSE turbine_inlet_clock END)`);
/** Both clock positions or neither, each one we name. */
const orientationChecks = (table: string) => [
  oneOf(table, 'compressor_outlet_clock', CLOCK_POSITIONS),
  oneOf(table, 'turbine_inlet_clock', CLOCK_POSITIONS),
  holds(table, 'orientation', '(compressor_outlet_clock IS NULL) = (turbine_inlet_clock IS NULL)'),
];

export const frames = sqliteTable('frames', {
  code: text('code').primaryKey(),
  name: text('name').notNull(),
  inducerMm: real('inducer_mm').notNull(),
  exducerMm: real('exducer_mm').notNull(),
  turbineWheelMm: real('turbine_wheel_mm').notNull(),
  powerMinHp: integer('power_min_hp').notNull(),
  powerMaxHp: integer('power_max_hp').notNull(),
  maxFlowLbMin: real('max_flow_lb_min').notNull(),
  // The conditions the flow rating is corrected to (K, kPa absolute).
  flowRefTempK: real('flow_ref_temp_k').notNull().default(288.15),
  flowRefPressureKpa: real('flow_ref_pressure_kpa').notNull().default(101.325),
  maxPressureRatio: real('max_pressure_ratio').notNull(),
  maxShaftRpm: integer('max_shaft_rpm').notNull(),
  weightKg: real('weight_kg').notNull(),
  flangePattern: text('flange_pattern').notNull(),
  bearingOptions: text('bearing_options', { mode: 'json' }).$type<Bearing[]>().notNull(),
  compressorMap: text('compressor_map', { mode: 'json' }).$type<unknown>().notNull(),
});

export const parts = sqliteTable(
  'parts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    partNumber: text('part_number').notNull(),
    // Upper-case letters and digits only: what a buyer types, without dashes or spaces.
    normalizedNumber: text('normalized_number').notNull(),
    title: text('title').notNull(),
    category: text('category').notNull(),
    frameCode: text('frame_code').references(() => frames.code),
    status: text('status', { enum: PART_STATUSES }).notNull().default('active'),
    condition: text('condition', { enum: PART_CONDITIONS }).notNull().default('new'),
    priceCents: integer('price_cents').notNull(),
    coreDepositCents: integer('core_deposit_cents').notNull().default(0),
    weightGrams: integer('weight_grams').notNull(),
    description: text('description').notNull().default(''),
    supersededBy: text('superseded_by'),
    images: text('images', { mode: 'json' }).$type<string[]>().notNull().default(sql`'[]'`),
    minStock: integer('min_stock').notNull().default(0),
    /** On hand less reserved over all bins, kept by the stock service with every movement (a test checks it). */
    available: integer('available').notNull().default(0),
    /**
     * The bearing in the part's specs, copied by triggers (drizzle/0014_list_indexes_and_counts.sql) whenever the specs are written, so the
     * catalogue filters and sorts by it through an index on parts. Never written by code: part_specs holds it.
     */
    bearing: text('bearing', { enum: BEARINGS }),
    /**
     * The part's GTIN-13 (shared/gtin.ts): our prefix in GS1's restricted-circulation range 200–299, the part id as
     * item reference, the check digit. Null only between an insert and the trigger that fills it from the id
     * (drizzle/*_gtin_backfill.sql), so every writer gets one; the seed and the Office write it themselves.
     */
    gtin: text('gtin'),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    uniqueIndex('parts_part_number_uq').on(t.partNumber),
    uniqueIndex('parts_gtin_uq').on(t.gtin),
    index('parts_normalized_number_idx').on(t.normalizedNumber),
    index('parts_frame_idx').on(t.frameCode, t.status, t.available),
    // The catalogue's default order (category as the shop lists them, frame, number), so a page is read in order.
    index('parts_browse_order_idx').on(sql`${CATEGORY_ORDER_SQL}`, t.frameCode, t.partNumber),
    // One index per sort, alone and behind each filter that narrows by equality (category, frame), so a page of any
    // list is read in order and stops after the page instead of sorting every matching part. Counts and facets come
    // from catalogCounts, not from these. Stock moves leave them alone: none holds `available`.
    index('parts_category_browse_idx').on(t.category, t.frameCode, t.partNumber),
    index('parts_frame_browse_idx').on(t.frameCode, sql`${CATEGORY_ORDER_SQL}`, t.partNumber),
    index('parts_price_idx').on(t.priceCents, t.partNumber),
    index('parts_category_price_idx').on(t.category, t.priceCents, t.partNumber),
    index('parts_frame_price_idx').on(t.frameCode, t.priceCents, t.partNumber),
    index('parts_category_number_idx').on(t.category, t.partNumber),
    index('parts_frame_number_idx').on(t.frameCode, t.partNumber),
    index('parts_title_idx').on(t.title, t.partNumber),
    index('parts_category_title_idx').on(t.category, t.title, t.partNumber),
    index('parts_frame_title_idx').on(t.frameCode, t.title, t.partNumber),
    index('parts_bearing_browse_idx').on(t.bearing, sql`${CATEGORY_ORDER_SQL}`, t.frameCode, t.partNumber),
    index('parts_bearing_price_idx').on(t.bearing, t.priceCents, t.partNumber),
    index('parts_bearing_number_idx').on(t.bearing, t.partNumber),
    index('parts_bearing_title_idx').on(t.bearing, t.title, t.partNumber),
    oneOf('parts', 'status', PART_STATUSES),
    oneOf('parts', 'condition', PART_CONDITIONS),
    oneOf('parts', 'category', CATEGORY_SLUGS),
    holds('parts', 'money', 'price_cents >= 0 AND core_deposit_cents >= 0'),
    holds('parts', 'counts', 'weight_grams >= 0 AND min_stock >= 0 AND available >= 0'),
  ],
);

/** Per-category specifications; a column is null where the category has no such property. */
export const partSpecs = sqliteTable(
  'part_specs',
  {
  partId: integer('part_id').primaryKey().references(() => parts.id, { onDelete: 'cascade' }),
  compressorAr: real('compressor_ar'),
  turbineAr: real('turbine_ar'),
  trimPct: real('trim_pct'),
  inducerMm: real('inducer_mm'),
  exducerMm: real('exducer_mm'),
  flangePattern: text('flange_pattern'),
  inletMm: real('inlet_mm'),
  outletMm: real('outlet_mm'),
  material: text('material'),
  bearing: text('bearing', { enum: BEARINGS }),
  wastegate: text('wastegate'),
  cooling: text('cooling'),
  gaugeType: text('gauge_type'),
  rangeText: text('range_text'),
  mounting: text('mounting'),
  connection: text('connection'),
  },
  () => [oneOf('part_specs', 'bearing', BEARINGS)],
);

/** Other numbers a part is known by: cross-references and the numbers it superseded. */
export const partAliases = sqliteTable(
  'part_aliases',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    partId: integer('part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
    alias: text('alias').notNull(),
    normalizedAlias: text('normalized_alias').notNull(),
    kind: text('kind', { enum: ALIAS_KINDS }).notNull(),
    source: text('source'),
  },
  (t) => [index('part_aliases_normalized_idx').on(t.normalizedAlias), index('part_aliases_part_idx').on(t.partId), oneOf('part_aliases', 'kind', ALIAS_KINDS)],
);

export const partLinks = sqliteTable(
  'part_links',
  {
    partId: integer('part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
    relatedPartId: integer('related_part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
  },
  (t) => [primaryKey({ columns: [t.partId, t.relatedPartId] }), index('part_links_related_idx').on(t.relatedPartId)],
);

export const bins = sqliteTable('bins', {
  code: text('code').primaryKey(),
  zone: text('zone').notNull(),
  walkOrder: integer('walk_order').notNull(),
});

export const stock = sqliteTable(
  'stock',
  {
    partId: integer('part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
    binCode: text('bin_code').notNull().references(() => bins.code),
    onHand: integer('on_hand').notNull().default(0),
    reserved: integer('reserved').notNull().default(0),
  },
  (t) => [
    primaryKey({ columns: [t.partId, t.binCode] }),
    index('stock_bin_idx').on(t.binCode),
    // The ledger's invariant, held by the database as well as by the stock service: nothing negative, nothing reserved
    // that is not on the shelf.
    holds('stock', 'levels', 'on_hand >= 0 AND reserved >= 0 AND reserved <= on_hand'),
  ],
);

export const meta = sqliteTable('meta', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
});

/* Accounts: the tables better-auth keeps its users and sessions in (with the admin plugin's fields). */
const ts = (name: string) => integer(name, { mode: 'timestamp_ms' });

export const user = sqliteTable(
  'user',
  {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  email: text('email').notNull().unique(),
  emailVerified: integer('email_verified', { mode: 'boolean' }).notNull().default(false),
  image: text('image'),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  role: text('role').default('customer'),
  banned: integer('banned', { mode: 'boolean' }).default(false),
  banReason: text('ban_reason'),
  banExpires: ts('ban_expires'),
  },
  () => [oneOf('user', 'role', ROLES)],
);

export const session = sqliteTable(
  'session',
  {
    id: text('id').primaryKey(),
    expiresAt: ts('expires_at').notNull(),
    token: text('token').notNull().unique(),
    createdAt: ts('created_at').notNull(),
    updatedAt: ts('updated_at').notNull(),
    ipAddress: text('ip_address'),
    userAgent: text('user_agent'),
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    impersonatedBy: text('impersonated_by'),
  },
  (t) => [index('session_user_idx').on(t.userId)],
);

export const account = sqliteTable(
  'account',
  {
    id: text('id').primaryKey(),
    accountId: text('account_id').notNull(),
    providerId: text('provider_id').notNull(),
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    accessToken: text('access_token'),
    refreshToken: text('refresh_token'),
    idToken: text('id_token'),
    accessTokenExpiresAt: ts('access_token_expires_at'),
    refreshTokenExpiresAt: ts('refresh_token_expires_at'),
    scope: text('scope'),
    password: text('password'),
    createdAt: ts('created_at').notNull(),
    updatedAt: ts('updated_at').notNull(),
  },
  (t) => [index('account_user_idx').on(t.userId)],
);

export const verification = sqliteTable('verification', {
  id: text('id').primaryKey(),
  identifier: text('identifier').notNull(),
  value: text('value').notNull(),
  expiresAt: ts('expires_at').notNull(),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
});

/* Dealers: a trade account that one or more buyers belong to. */
export const dealerAccounts = sqliteTable(
  'dealer_accounts',
  {
  id: integer('id').primaryKey({ autoIncrement: true }),
  companyName: text('company_name').notNull(),
  contactName: text('contact_name').notNull(),
  phone: text('phone').notNull(),
  taxNumber: text('tax_number'),
  addressLine1: text('address_line1').notNull(),
  city: text('city').notNull(),
  postcode: text('postcode').notNull(),
  deliveryZone: text('delivery_zone').notNull().default('national'),
  status: text('status', { enum: DEALER_STATUSES }).notNull().default('pending'),
  tier: text('tier', { enum: DEALER_TIER_KEYS }),
  creditLimitCents: integer('credit_limit_cents').notNull().default(0),
  paymentTermsDays: integer('payment_terms_days').notNull().default(30),
  declineReason: text('decline_reason'),
  createdAt: createdAt(),
  decidedAt: text('decided_at'),
  },
  () => [
    oneOf('dealer_accounts', 'status', DEALER_STATUSES),
    oneOf('dealer_accounts', 'tier', DEALER_TIER_KEYS),
    oneOf('dealer_accounts', 'delivery_zone', DELIVERY_ZONE_KEYS),
    holds('dealer_accounts', 'terms', 'credit_limit_cents >= 0 AND payment_terms_days > 0'),
  ],
);

export const dealerMembers = sqliteTable(
  'dealer_members',
  {
    userId: text('user_id').primaryKey().references(() => user.id, { onDelete: 'cascade' }),
    dealerAccountId: integer('dealer_account_id').notNull().references(() => dealerAccounts.id),
  },
  (t) => [index('dealer_members_dealer_idx').on(t.dealerAccountId)],
);

/* Saved fitment checks. */
export const savedFitments = sqliteTable(
  'saved_fitments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: text('user_id').notNull().references(() => user.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    input: text('input', { mode: 'json' }).$type<unknown>().notNull(),
    summary: text('summary').notNull(),
    bestFrameCode: text('best_frame_code'),
    createdAt: createdAt(),
  },
  (t) => [index('saved_fitments_user_idx').on(t.userId)],
);

/* Shaft-speed logs from a plug-in logger, laid on a saved check's compressor map; they go with their check. */
export const shaftLogs = sqliteTable(
  'shaft_logs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    savedFitmentId: integer('saved_fitment_id')
      .notNull()
      .references(() => savedFitments.id, { onDelete: 'cascade' }),
    frameCode: text('frame_code')
      .notNull()
      .references(() => frames.code),
    name: text('name').notNull(),
    boostUnit: text('boost_unit', { enum: BOOST_UNITS }).notNull(),
    rowCount: integer('row_count').notNull(),
    durationS: real('duration_s').notNull(),
    /** The rows as read (boost in kPa gauge), parsed with ShaftLogRowSchema when read back. Map points are worked out
     * on each read, so they follow today's maps. */
    rows: text('rows', { mode: 'json' }).$type<unknown>().notNull(),
    /** The unit the log was taken on, when it was uploaded from the unit's page (its history shows it). */
    unitId: integer('unit_id').references((): AnySQLiteColumn => units.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    index('shaft_logs_fitment_idx').on(t.savedFitmentId, t.createdAt),
    index('shaft_logs_unit_idx').on(t.unitId, t.createdAt),
    index('shaft_logs_frame_idx').on(t.frameCode),
    oneOf('shaft_logs', 'boost_unit', BOOST_UNITS),
    check('shaft_logs_row_count_ck', sql.raw(`row_count BETWEEN 1 AND ${SHAFT_LOG_MAX_ROWS}`)),
    check('shaft_logs_duration_ck', sql`${t.durationS} >= 0`),
  ],
);

/* Carts live on the server: one per signed-in user, or per guest token until sign-in merges it. */
export const carts = sqliteTable(
  'carts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: text('user_id').unique().references(() => user.id, { onDelete: 'cascade' }),
    guestToken: text('guest_token').unique(),
    deliveryZone: text('delivery_zone', { enum: DELIVERY_ZONE_KEYS }).notNull().default('national'),
    updatedAt: stamp('updated_at'),
  },
  () => [oneOf('carts', 'delivery_zone', DELIVERY_ZONE_KEYS)],
);

export const cartLines = sqliteTable(
  'cart_lines',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    cartId: integer('cart_id').notNull().references(() => carts.id, { onDelete: 'cascade' }),
    partId: integer('part_id').notNull().references(() => parts.id),
    quantity: integer('quantity').notNull(),
    fitmentId: integer('fitment_id').references(() => savedFitments.id, { onDelete: 'set null' }),
    allowBackorder: integer('allow_backorder', { mode: 'boolean' }).notNull().default(false),
    /** A complete unit's clocked housings (shared/exploded-view.ts); null on every other part. */
    compressorOutletClock: text('compressor_outlet_clock', { enum: CLOCK_POSITIONS }),
    turbineInletClock: text('turbine_inlet_clock', { enum: CLOCK_POSITIONS }),
    createdAt: createdAt(),
  },
  (t) => [
    // The same part in two orientations is two lines.
    uniqueIndex('cart_lines_cart_part_uq').on(t.cartId, t.partId, sql`${CART_LINE_COMPRESSOR_CLOCK_KEY}`, sql`${CART_LINE_TURBINE_CLOCK_KEY}`),
    ...orientationChecks('cart_lines'),
    index('cart_lines_part_idx').on(t.partId),
    index('cart_lines_fitment_idx').on(t.fitmentId),
    holds('cart_lines', 'quantity', 'quantity > 0'),
  ],
);

export const orders = sqliteTable(
  'orders',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    number: text('number').notNull().unique(),
    userId: text('user_id').notNull().references(() => user.id),
    dealerAccountId: integer('dealer_account_id').references(() => dealerAccounts.id),
    status: text('status', { enum: ORDER_STATUSES }).notNull(),
    paymentMethod: text('payment_method', { enum: PAYMENT_METHODS }).notNull(),
    paymentState: text('payment_state', { enum: PAYMENT_STATES }).notNull(),
    paymentIntentId: text('payment_intent_id').unique(),
    purchaseOrder: text('purchase_order'),
    paymentTermsDays: integer('payment_terms_days'),
    currency: text('currency').notNull().default('usd'),
    goodsCents: integer('goods_cents').notNull(),
    discountCents: integer('discount_cents').notNull().default(0),
    coreDepositCents: integer('core_deposit_cents').notNull().default(0),
    freightCents: integer('freight_cents').notNull(),
    taxCents: integer('tax_cents').notNull(),
    totalCents: integer('total_cents').notNull(),
    refundedCents: integer('refunded_cents').notNull().default(0),
    weightGrams: integer('weight_grams').notNull(),
    deliveryZone: text('delivery_zone').notNull(),
    shipName: text('ship_name').notNull(),
    shipLine1: text('ship_line1').notNull(),
    shipCity: text('ship_city').notNull(),
    shipPostcode: text('ship_postcode').notNull(),
    email: text('email').notNull(),
    carrier: text('carrier'),
    trackingNumber: text('tracking_number'),
    cartons: integer('cartons'),
    packedWeightGrams: integer('packed_weight_grams'),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    index('orders_user_idx').on(t.userId, t.createdAt),
    index('orders_status_idx').on(t.status, t.createdAt),
    index('orders_dealer_idx').on(t.dealerAccountId),
    oneOf('orders', 'status', ORDER_STATUSES),
    oneOf('orders', 'payment_method', PAYMENT_METHODS),
    oneOf('orders', 'payment_state', PAYMENT_STATES),
    oneOf('orders', 'delivery_zone', DELIVERY_ZONE_KEYS),
    holds(
      'orders',
      'money',
      'goods_cents >= 0 AND discount_cents >= 0 AND core_deposit_cents >= 0 AND freight_cents >= 0 AND tax_cents >= 0 AND total_cents >= 0 AND refunded_cents >= 0 AND refunded_cents <= total_cents',
    ),
    holds('orders', 'weight', 'weight_grams >= 0'),
  ],
);

export const orderLines = sqliteTable(
  'order_lines',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: integer('order_id').notNull().references(() => orders.id, { onDelete: 'cascade' }),
    partId: integer('part_id').notNull().references(() => parts.id),
    partNumber: text('part_number').notNull(),
    title: text('title').notNull(),
    quantity: integer('quantity').notNull(),
    /** Of the quantity, how many wait for stock. */
    quantityBackordered: integer('quantity_backordered').notNull().default(0),
    quantityPicked: integer('quantity_picked').notNull().default(0),
    quantityDispatched: integer('quantity_dispatched').notNull().default(0),
    unitPriceCents: integer('unit_price_cents').notNull(),
    retailUnitPriceCents: integer('retail_unit_price_cents').notNull(),
    coreDepositCents: integer('core_deposit_cents').notNull().default(0),
    weightGrams: integer('weight_grams').notNull(),
    fitmentId: integer('fitment_id'),
    fitmentSummary: text('fitment_summary'),
    compressorOutletClock: text('compressor_outlet_clock', { enum: CLOCK_POSITIONS }),
    turbineInletClock: text('turbine_inlet_clock', { enum: CLOCK_POSITIONS }),
  },
  (t) => [
    index('order_lines_order_idx').on(t.orderId),
    ...orientationChecks('order_lines'),
    index('order_lines_part_idx').on(t.partId),
    holds(
      'order_lines',
      'quantities',
      'quantity > 0 AND quantity_backordered BETWEEN 0 AND quantity AND quantity_picked BETWEEN 0 AND quantity AND quantity_dispatched BETWEEN 0 AND quantity',
    ),
    holds('order_lines', 'money', 'unit_price_cents >= 0 AND retail_unit_price_cents >= 0 AND core_deposit_cents >= 0 AND weight_grams >= 0'),
  ],
);

export const orderEvents = sqliteTable(
  'order_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: integer('order_id').notNull().references(() => orders.id, { onDelete: 'cascade' }),
    status: text('status').notNull(),
    note: text('note'),
    createdAt: createdAt(),
  },
  (t) => [index('order_events_order_idx').on(t.orderId)],
);

/** Each payment webhook event is applied once: its id is recorded in the same transaction as its effect. */
export const paymentEvents = sqliteTable('payment_events', {
  eventId: text('event_id').primaryKey(),
  type: text('type').notNull(),
  paymentIntentId: text('payment_intent_id'),
  receivedAt: createdAt(),
});

/**
 * A card payment that succeeded for an order no longer awaiting one (cancelled, expired): refunded automatically,
 * one row per payment intent, shown to staff in the Office.
 */
export const paymentAlerts = sqliteTable(
  'payment_alerts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: integer('order_id').notNull().references(() => orders.id, { onDelete: 'cascade' }),
    paymentIntentId: text('payment_intent_id').notNull().unique(),
    amountCents: integer('amount_cents').notNull(),
    what: text('what').notNull(),
    refundState: text('refund_state', { enum: PAYMENT_ALERT_REFUND_STATES }).notNull().default('pending'),
    refundId: text('refund_id'),
    /** Our own words for staff; the provider's detail goes to the log only. */
    lastError: text('last_error'),
    attempts: integer('attempts').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    index('payment_alerts_order_idx').on(t.orderId),
    oneOf('payment_alerts', 'refund_state', PAYMENT_ALERT_REFUND_STATES),
    holds('payment_alerts', 'money', 'amount_cents >= 0 AND attempts >= 0'),
  ],
);

/** The stock ledger: on hand and reserved per part and bin are always the sums of these rows. */
export const stockMovements = sqliteTable(
  'stock_movements',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    partId: integer('part_id').notNull().references(() => parts.id),
    binCode: text('bin_code').notNull().references(() => bins.code),
    kind: text('kind', { enum: STOCK_MOVEMENT_KINDS }).notNull(),
    onHandDelta: integer('on_hand_delta').notNull().default(0),
    reservedDelta: integer('reserved_delta').notNull().default(0),
    orderId: integer('order_id').references(() => orders.id),
    note: text('note'),
    createdAt: createdAt(),
  },
  (t) => [
    index('stock_movements_part_idx').on(t.partId, t.binCode),
    index('stock_movements_order_idx').on(t.orderId),
    index('stock_movements_bin_idx').on(t.binCode),
    oneOf('stock_movements', 'kind', STOCK_MOVEMENT_KINDS),
  ],
);

/** Each dispatch of an order: a back-order that arrives later leaves in a shipment of its own. */
export const shipments = sqliteTable(
  'shipments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: integer('order_id').notNull().references(() => orders.id),
    carrier: text('carrier').notNull(),
    trackingNumber: text('tracking_number').notNull(),
    cartons: integer('cartons').notNull(),
    weightGrams: integer('weight_grams').notNull(),
    units: integer('units').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('shipments_order_idx').on(t.orderId), holds('shipments', 'counts', 'cartons > 0 AND weight_grams >= 0 AND units > 0')],
);

export const returns = sqliteTable(
  'returns',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    reference: text('reference').notNull().unique(),
    orderId: integer('order_id').notNull().references(() => orders.id),
    orderLineId: integer('order_line_id').notNull().references(() => orderLines.id),
    userId: text('user_id').notNull().references(() => user.id),
    kind: text('kind', { enum: RETURN_KIND_KEYS }).notNull(),
    quantity: integer('quantity').notNull(),
    reason: text('reason').notNull(),
    status: text('status', { enum: RETURN_STATUSES }).notNull().default('requested'),
    conditionGrade: text('condition_grade', { enum: CONDITION_GRADE_KEYS }),
    decision: text('decision'),
    refundCents: integer('refund_cents').notNull().default(0),
    rejectReason: text('reject_reason'),
    /** Why a partial refund is less than the most it could be; the customer reads it. */
    decisionReason: text('decision_reason'),
    paymentRefundId: text('payment_refund_id'),
    createdAt: createdAt(),
    decidedAt: text('decided_at'),
  },
  (t) => [
    index('returns_order_idx').on(t.orderId),
    index('returns_status_idx').on(t.status),
    index('returns_order_line_idx').on(t.orderLineId),
    index('returns_user_idx').on(t.userId),
    oneOf('returns', 'kind', RETURN_KIND_KEYS),
    oneOf('returns', 'status', RETURN_STATUSES),
    oneOf('returns', 'condition_grade', CONDITION_GRADE_KEYS),
    holds('returns', 'amounts', 'quantity > 0 AND refund_cents >= 0'),
  ],
);

export const returnPhotos = sqliteTable(
  'return_photos',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    returnId: integer('return_id').notNull().references(() => returns.id, { onDelete: 'cascade' }),
    /** Made by the server; the uploaded name is never used on disk. */
    storedName: text('stored_name').notNull().unique(),
    mimeType: text('mime_type').notNull(),
    bytes: integer('bytes').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('return_photos_return_idx').on(t.returnId), holds('return_photos', 'bytes', 'bytes >= 0')],
);

export const creditNotes = sqliteTable(
  'credit_notes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    number: text('number').notNull().unique(),
    dealerAccountId: integer('dealer_account_id').notNull().references(() => dealerAccounts.id),
    orderId: integer('order_id').notNull().references(() => orders.id),
    returnId: integer('return_id').notNull().unique().references(() => returns.id),
    amountCents: integer('amount_cents').notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    index('credit_notes_dealer_idx').on(t.dealerAccountId),
    index('credit_notes_order_idx').on(t.orderId),
    holds('credit_notes', 'amount', 'amount_cents >= 0'),
  ],
);

/** A price-import row as kept until it is applied: the row the preview shows, plus what applying it needs. */
export type PriceImportStoredRow = PriceImportRow & {
  /** For a new part: the fields that create it. */
  create?: { title: string; category: string; weightGrams: number; frameCode: string | null; coreDepositCents: number } | undefined;
  coreDepositCents?: number | null | undefined;
  /** The flags staff acknowledged on this row (an acknowledgement holds only for the flags seen). */
  acknowledged?: PriceFlag[] | null | undefined;
};

export const priceImports = sqliteTable(
  'price_imports',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: text('user_id').notNull().references(() => user.id),
    fileName: text('file_name').notNull(),
    status: text('status', { enum: PRICE_IMPORT_STATUSES }).notNull().default('preview'),
    rows: text('rows', { mode: 'json' }).$type<PriceImportStoredRow[]>().notNull(),
    createdAt: createdAt(),
    appliedAt: text('applied_at'),
    /** A price moving more than this share (either way) is flagged for a look before applying. */
    maxChangePct: integer('max_change_pct').notNull().default(30),
    appliedBy: text('applied_by').references(() => user.id),
    /** Counted when applied, so the history lists imports without reading every row. */
    changedCount: integer('changed_count').notNull().default(0),
    newCount: integer('new_count').notNull().default(0),
    flaggedCount: integer('flagged_count').notNull().default(0),
  },
  (t) => [
    index('price_imports_user_idx').on(t.userId),
    index('price_imports_created_idx').on(t.createdAt),
    index('price_imports_applied_by_idx').on(t.appliedBy),
    oneOf('price_imports', 'status', PRICE_IMPORT_STATUSES),
  ],
);

/*
 * What several app processes on one database share (docs/decisions/0005-several-processes.md).
 */

/** Counters that move when a kind of data changes; written by triggers (drizzle/0007), read by each process's caches. */
export const changeVersions = sqliteTable('change_versions', {
  topic: text('topic', { enum: ['stock', 'frames', 'search', 'accounts'] }).primaryKey(),
  version: integer('version').notNull().default(0),
});

/** Which parts changed, in order: each process's search index reloads the parts changed since it last looked. */
export const partChanges = sqliteTable('part_changes', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  partId: integer('part_id').notNull(),
});

/** Fixed-window request counters by client key, shared by every process. */
export const rateLimitHits = sqliteTable('rate_limit_hits', {
  key: text('key').primaryKey(),
  windowEndsAt: integer('window_ends_at').notNull(),
  hits: integer('hits').notNull(),
});

/** A scheduled job runs in the one process that holds its lease. */
export const jobLeases = sqliteTable('job_leases', {
  name: text('name').primaryKey(),
  holder: text('holder').notNull(),
  expiresAt: integer('expires_at').notNull(),
  lastRunAt: integer('last_run_at'),
});

/**
 * Mail waiting to go, written in the same transaction as the change that causes it and rendered then, so the message
 * says what was true at that moment. A worker claims due rows (state `sending`, with a claim that runs out) and marks
 * each sent or schedules its next attempt; see server/services/mail-outbox.ts.
 */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind', { enum: MAIL_KINDS }).notNull(),
    recipient: text('recipient').notNull(),
    subject: text('subject').notNull(),
    state: text('state', { enum: MAIL_STATES }).notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    /** Epoch milliseconds: the worker takes a queued row once this has passed. */
    nextAttemptAt: integer('next_attempt_at').notNull(),
    /** The process sending the row and when its claim runs out (a process that died mid-send gives the row back). */
    claimedBy: text('claimed_by'),
    claimExpiresAt: integer('claim_expires_at'),
    lastError: text('last_error'),
    lastAttemptAt: text('last_attempt_at'),
    /** When it last went; kept when a sent message is queued again. */
    sentAt: text('sent_at'),
    createdAt: createdAt(),
  },
  (t) => [
    index('mail_outbox_due_idx').on(t.state, t.nextAttemptAt),
    index('mail_outbox_created_idx').on(t.createdAt),
    oneOf('mail_outbox', 'kind', MAIL_KINDS),
    oneOf('mail_outbox', 'state', MAIL_STATES),
    holds('mail_outbox', 'attempts', 'attempts >= 0'),
    holds('mail_outbox', 'sent', "state <> 'sent' OR sent_at IS NOT NULL"),
  ],
);

/**
 * A queued message's text and HTML, kept apart from its sending state: a message is a few pages of text, and SQLite
 * rewrites a whole row on every update, so the worker's claims and marks would otherwise copy the message each time.
 */
export const mailBodies = sqliteTable('mail_bodies', {
  outboxId: integer('outbox_id')
    .primaryKey()
    .references(() => mailOutbox.id, { onDelete: 'cascade' }),
  text: text('text').notNull(),
  html: text('html').notNull(),
});

/** On-site notices: what changed on a buyer's orders and returns, written beside the e-mail in the same transaction. */
export const notices = sqliteTable(
  'notices',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    orderId: integer('order_id').references(() => orders.id),
    kind: text('kind', { enum: NOTICE_KINDS }).notNull(),
    title: text('title').notNull(),
    body: text('body').notNull(),
    /** A path inside the shop, e.g. /orders/SY-100123. */
    link: text('link').notNull(),
    readAt: text('read_at'),
    createdAt: createdAt(),
  },
  (t) => [index('notices_user_idx').on(t.userId, t.id), index('notices_unread_idx').on(t.userId, t.readAt), index('notices_order_idx').on(t.orderId), oneOf('notices', 'kind', NOTICE_KINDS)],
);

/** Who changed what in the catalogue and when: one row per part changed, by hand or by a price import. Never updated. */
export const auditLog = sqliteTable(
  'audit_log',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    /** Null for a change made by the system itself (a script, not a person). */
    userId: text('user_id').references(() => user.id),
    action: text('action', { enum: AUDIT_ACTIONS }).notNull(),
    partId: integer('part_id').references(() => parts.id),
    partNumber: text('part_number'),
    priceImportId: integer('price_import_id').references(() => priceImports.id),
    /** Field by field, what it was and what it became. */
    changes: text('changes', { mode: 'json' }).$type<Record<string, { from: unknown; to: unknown }>>().notNull().default(sql`'{}'`),
    createdAt: createdAt(),
  },
  (t) => [
    index('audit_log_part_idx').on(t.partNumber, t.id),
    index('audit_log_part_id_idx').on(t.partId),
    index('audit_log_user_idx').on(t.userId, t.id),
    index('audit_log_created_idx').on(t.createdAt),
    index('audit_log_import_idx').on(t.priceImportId),
    oneOf('audit_log', 'action', AUDIT_ACTIONS),
  ],
);

/** A dealer's payment of an invoice on account, as the office records it; the statement lists these. */
export const dealerPayments = sqliteTable(
  'dealer_payments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    dealerAccountId: integer('dealer_account_id')
      .notNull()
      .references(() => dealerAccounts.id),
    orderId: integer('order_id')
      .notNull()
      .references(() => orders.id),
    amountCents: integer('amount_cents').notNull(),
    reference: text('reference').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('dealer_payments_dealer_idx').on(t.dealerAccountId, t.createdAt), index('dealer_payments_order_idx').on(t.orderId), holds('dealer_payments', 'amount', 'amount_cents >= 0')],
);

/**
 * A buyer's change to an order before picking started: units taken off lines, or the whole order cancelled. The
 * order's lines and totals are amended in the same transaction (so they always describe the order as it stands);
 * this row keeps what it was, what it became and how the money followed (docs/decisions/0008-order-changes.md).
 */
export const orderChanges = sqliteTable(
  'order_changes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    orderId: integer('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => user.id),
    kind: text('kind', { enum: ORDER_CHANGE_KINDS }).notNull(),
    /** Per line: part number, title, quantity before and after (0 = the line went). Parsed with OrderChangeLineSchema. */
    lines: text('lines', { mode: 'json' }).$type<unknown>().notNull(),
    beforeTotalCents: integer('before_total_cents').notNull(),
    afterTotalCents: integer('after_total_cents').notNull(),
    /** What the buyer gets back or no longer owes. */
    adjustmentCents: integer('adjustment_cents').notNull(),
    settlement: text('settlement', { enum: ORDER_CHANGE_SETTLEMENTS }).notNull(),
    refundState: text('refund_state', { enum: ORDER_CHANGE_REFUND_STATES }),
    refundId: text('refund_id'),
    refundAttempts: integer('refund_attempts').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    index('order_changes_order_idx').on(t.orderId),
    index('order_changes_user_idx').on(t.userId),
    index('order_changes_refund_idx').on(t.refundState),
    oneOf('order_changes', 'kind', ORDER_CHANGE_KINDS),
    oneOf('order_changes', 'settlement', ORDER_CHANGE_SETTLEMENTS),
    oneOf('order_changes', 'refund_state', ORDER_CHANGE_REFUND_STATES),
    holds('order_changes', 'money', 'before_total_cents >= 0 AND after_total_cents >= 0 AND adjustment_cents >= 0 AND refund_attempts >= 0'),
    holds('order_changes', 'refund', "(settlement = 'card-refund') = (refund_state IS NOT NULL)"),
  ],
);

/**
 * Named parts lists of a trade account ("van stock", "season rebuild kit"): every user of the account sees and edits
 * them. A part is on a list once, with the quantity to order.
 */
export const partsLists = sqliteTable(
  'parts_lists',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    dealerAccountId: integer('dealer_account_id')
      .notNull()
      .references(() => dealerAccounts.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    createdBy: text('created_by').references(() => user.id, { onDelete: 'set null' }),
    updatedBy: text('updated_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    uniqueIndex('parts_lists_dealer_name_uq').on(t.dealerAccountId, sql`lower(${t.name})`),
    index('parts_lists_created_by_idx').on(t.createdBy),
    index('parts_lists_updated_by_idx').on(t.updatedBy),
  ],
);

export const partsListLines = sqliteTable(
  'parts_list_lines',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    listId: integer('list_id')
      .notNull()
      .references(() => partsLists.id, { onDelete: 'cascade' }),
    partId: integer('part_id')
      .notNull()
      .references(() => parts.id),
    quantity: integer('quantity').notNull(),
    addedBy: text('added_by').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('parts_list_lines_list_part_uq').on(t.listId, t.partId),
    index('parts_list_lines_part_idx').on(t.partId),
    index('parts_list_lines_added_by_idx').on(t.addedBy),
    holds('parts_list_lines', 'quantity', 'quantity > 0'),
  ],
);

/**
 * How many parts share each combination of the catalogue's filters (category, frame, bearing, status, in stock),
 * kept by triggers on parts and part_specs in the same statement as the change (drizzle/0014_list_indexes_and_counts.sql), so the list's total
 * and its facet counts add up a few hundred rows instead of counting the parts. '' stands for no frame or no bearing.
 * A combination whose parts all went keeps its row at zero.
 */
export const catalogCounts = sqliteTable(
  'catalog_counts',
  {
    category: text('category').notNull(),
    frameCode: text('frame_code').notNull(),
    bearing: text('bearing').notNull(),
    status: text('status', { enum: PART_STATUSES }).notNull(),
    inStock: integer('in_stock', { mode: 'boolean' }).notNull(),
    partCount: integer('part_count').notNull(),
  },
  (t) => [primaryKey({ columns: [t.category, t.frameCode, t.bearing, t.status, t.inStock] })],
);

/*
 * Units: each turbocharger or cartridge we know by its serial (shared/unit-serial.ts) — sold by us, or first seen when
 * a customer books it in for service — and its history, one row per event.
 */
export const units = sqliteTable(
  'units',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    serial: text('serial').notNull(),
    /** The catalogue part the unit is (a complete unit or a cartridge), when known. */
    partId: integer('part_id').references(() => parts.id),
    frameCode: text('frame_code').references(() => frames.code),
    bearing: text('bearing', { enum: BEARINGS }).notNull(),
    /** How the unit is used (the fitment check's applications); sets its service interval. */
    application: text('application', { enum: APPLICATIONS }).notNull().default('street'),
    origin: text('origin', { enum: UNIT_ORIGINS }).notNull(),
    /** Who has the unit now: the buyer who bought it or booked it in, and their trade account when they have one. */
    ownerUserId: text('owner_user_id').references(() => user.id, { onDelete: 'set null' }),
    dealerAccountId: integer('dealer_account_id').references(() => dealerAccounts.id),
    /** The order line it left on, when we sold it. */
    orderLineId: integer('order_line_id').references(() => orderLines.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('units_serial_uq').on(t.serial),
    index('units_owner_idx').on(t.ownerUserId),
    index('units_dealer_idx').on(t.dealerAccountId),
    index('units_part_idx').on(t.partId),
    index('units_frame_idx').on(t.frameCode),
    index('units_order_line_idx').on(t.orderLineId),
    oneOf('units', 'bearing', BEARINGS),
    oneOf('units', 'application', APPLICATIONS),
    oneOf('units', 'origin', UNIT_ORIGINS),
  ],
);

export const unitEvents = sqliteTable(
  'unit_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    unitId: integer('unit_id')
      .notNull()
      .references(() => units.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: UNIT_EVENT_KINDS }).notNull(),
    summary: text('summary').notNull(),
    ref: text('ref'),
    actorUserId: text('actor_user_id').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('unit_events_unit_idx').on(t.unitId, t.id), index('unit_events_actor_idx').on(t.actorUserId), oneOf('unit_events', 'kind', UNIT_EVENT_KINDS)],
);

/**
 * How often a unit should come in, by bearing and use: defaults seeded by migration from common practice, adjusted by
 * staff in the Office (docs/decisions/0012-serials-logs-reminders.md).
 */
export const serviceIntervals = sqliteTable(
  'service_intervals',
  {
    bearing: text('bearing', { enum: BEARINGS }).notNull(),
    application: text('application', { enum: APPLICATIONS }).notNull(),
    months: integer('months').notNull(),
    /** Why this interval: shown to staff beside it. */
    note: text('note').notNull().default(''),
    updatedBy: text('updated_by').references(() => user.id, { onDelete: 'set null' }),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    primaryKey({ columns: [t.bearing, t.application] }),
    index('service_intervals_updated_by_idx').on(t.updatedBy),
    oneOf('service_intervals', 'bearing', BEARINGS),
    oneOf('service_intervals', 'application', APPLICATIONS),
    holds('service_intervals', 'months', 'months BETWEEN 1 AND 60'),
  ],
);

/** One row per service reminder sent: a unit is reminded once for each date it falls due. */
export const serviceReminders = sqliteTable(
  'service_reminders',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    unitId: integer('unit_id')
      .notNull()
      .references(() => units.id, { onDelete: 'cascade' }),
    /** The calendar date (YYYY-MM-DD) the unit fell due on. */
    dueOn: text('due_on').notNull(),
    mailId: integer('mail_id').references(() => mailOutbox.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('service_reminders_unit_due_uq').on(t.unitId, t.dueOn), index('service_reminders_mail_idx').on(t.mailId)],
);

/*
 * The Bench: service requests from booking in to shipping back (docs/decisions/0013-bench-service-requests.md). Their
 * money lives here, apart from orders: the quote, the card payment taken at approval and the invoice issued at shipping.
 */
export const serviceRequests = sqliteTable(
  'service_requests',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    reference: text('reference').notNull().unique(),
    unitId: integer('unit_id')
      .notNull()
      .references(() => units.id),
    userId: text('user_id')
      .notNull()
      .references(() => user.id),
    dealerAccountId: integer('dealer_account_id').references(() => dealerAccounts.id),
    status: text('status', { enum: SERVICE_STATUSES }).notNull().default('booked'),
    frameCode: text('frame_code')
      .notNull()
      .references(() => frames.code),
    bearing: text('bearing', { enum: BEARINGS }).notNull(),
    application: text('application', { enum: APPLICATIONS }).notNull(),
    /** Ticked symptoms (shared/service.ts SERVICE_SYMPTOMS), parsed when read. */
    symptoms: text('symptoms', { mode: 'json' }).$type<unknown>().notNull(),
    symptomNotes: text('symptom_notes').notNull().default(''),
    returnName: text('return_name').notNull(),
    returnLine1: text('return_line1').notNull(),
    returnCity: text('return_city').notNull(),
    returnPostcode: text('return_postcode').notNull(),
    receivedAt: text('received_at'),
    receivedBy: text('received_by').references(() => user.id),
    /** The inspection's findings (shared/schemas/service.ts InspectionSchema), parsed when read. */
    inspection: text('inspection', { mode: 'json' }).$type<unknown>(),
    inspectedAt: text('inspected_at'),
    inspectedBy: text('inspected_by').references(() => user.id),
    /** The quote; labour in tenths of an hour at the rate of the day, every amount fixed when quoted. */
    labourTenths: integer('labour_tenths'),
    labourRateCents: integer('labour_rate_cents'),
    labourCents: integer('labour_cents'),
    balancingCents: integer('balancing_cents'),
    partsCents: integer('parts_cents'),
    discountCents: integer('discount_cents'),
    taxCents: integer('tax_cents'),
    totalCents: integer('total_cents'),
    quoteNotes: text('quote_notes'),
    quotedAt: text('quoted_at'),
    quotedBy: text('quoted_by').references(() => user.id),
    /** The inspection fee charged if the quote is declined (fixed at booking, with its tax at the decision). */
    inspectionFeeCents: integer('inspection_fee_cents').notNull(),
    decidedAt: text('decided_at'),
    decision: text('decision', { enum: ['approve', 'decline'] }),
    paymentMethod: text('payment_method', { enum: ['card', 'account'] }),
    paymentState: text('payment_state', { enum: SERVICE_PAYMENT_STATES }).notNull().default('none'),
    paymentIntentId: text('payment_intent_id').unique(),
    purchaseOrder: text('purchase_order'),
    paymentTermsDays: integer('payment_terms_days'),
    /** What the customer owes for the request: the quote's total when approved, the fee with tax when declined. */
    chargeCents: integer('charge_cents').notNull().default(0),
    /** Balance readings and the test record (shared/schemas/service.ts RebuildSchema), parsed when read. */
    rebuild: text('rebuild', { mode: 'json' }).$type<unknown>(),
    rebuiltAt: text('rebuilt_at'),
    rebuiltBy: text('rebuilt_by').references(() => user.id),
    carrier: text('carrier'),
    trackingNumber: text('tracking_number'),
    shippedAt: text('shipped_at'),
    shippedBy: text('shipped_by').references(() => user.id),
    /** Issued when the unit ships; an invoice on account is on the dealer's statement from then. */
    invoiceNumber: text('invoice_number').unique(),
    invoicePaidAt: text('invoice_paid_at'),
    invoicePaymentReference: text('invoice_payment_reference'),
    createdAt: createdAt(),
    updatedAt: stamp('updated_at'),
  },
  (t) => [
    index('service_requests_user_idx').on(t.userId, t.id),
    index('service_requests_dealer_idx').on(t.dealerAccountId),
    index('service_requests_status_idx').on(t.status, t.id),
    index('service_requests_unit_idx').on(t.unitId),
    index('service_requests_frame_idx').on(t.frameCode),
    index('service_requests_received_by_idx').on(t.receivedBy),
    index('service_requests_inspected_by_idx').on(t.inspectedBy),
    index('service_requests_quoted_by_idx').on(t.quotedBy),
    index('service_requests_rebuilt_by_idx').on(t.rebuiltBy),
    index('service_requests_shipped_by_idx').on(t.shippedBy),
    oneOf('service_requests', 'status', SERVICE_STATUSES),
    oneOf('service_requests', 'bearing', BEARINGS),
    oneOf('service_requests', 'application', APPLICATIONS),
    oneOf('service_requests', 'payment_method', ['card', 'account']),
    oneOf('service_requests', 'decision', ['approve', 'decline']),
    oneOf('service_requests', 'payment_state', SERVICE_PAYMENT_STATES),
    holds(
      'service_requests',
      'money',
      'inspection_fee_cents >= 0 AND charge_cents >= 0 AND coalesce(total_cents, 0) >= 0 AND coalesce(tax_cents, 0) >= 0 AND coalesce(labour_tenths, 0) >= 0',
    ),
  ],
);

export const serviceRequestLines = sqliteTable(
  'service_request_lines',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    requestId: integer('request_id')
      .notNull()
      .references(() => serviceRequests.id, { onDelete: 'cascade' }),
    partId: integer('part_id')
      .notNull()
      .references(() => parts.id),
    partNumber: text('part_number').notNull(),
    title: text('title').notNull(),
    quantity: integer('quantity').notNull(),
    retailUnitCents: integer('retail_unit_cents').notNull(),
    unitCents: integer('unit_cents').notNull(),
  },
  (t) => [
    index('service_request_lines_request_idx').on(t.requestId),
    index('service_request_lines_part_idx').on(t.partId),
    holds('service_request_lines', 'amounts', 'quantity > 0 AND retail_unit_cents >= 0 AND unit_cents >= 0'),
  ],
);

/** The request's timeline: one row per step, with who took it. */
export const serviceRequestEvents = sqliteTable(
  'service_request_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    requestId: integer('request_id')
      .notNull()
      .references(() => serviceRequests.id, { onDelete: 'cascade' }),
    status: text('status').notNull(),
    note: text('note'),
    actorUserId: text('actor_user_id').references(() => user.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('service_request_events_request_idx').on(t.requestId, t.id), index('service_request_events_actor_idx').on(t.actorUserId)],
);

export const serviceRequestPhotos = sqliteTable(
  'service_request_photos',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    requestId: integer('request_id')
      .notNull()
      .references(() => serviceRequests.id, { onDelete: 'cascade' }),
    stage: text('stage', { enum: SERVICE_PHOTO_STAGES }).notNull(),
    /** Made by the server; the uploaded name is never used on disk. */
    storedName: text('stored_name').notNull().unique(),
    mimeType: text('mime_type').notNull(),
    bytes: integer('bytes').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('service_request_photos_request_idx').on(t.requestId), oneOf('service_request_photos', 'stage', SERVICE_PHOTO_STAGES), holds('service_request_photos', 'bytes', 'bytes >= 0')],
);
