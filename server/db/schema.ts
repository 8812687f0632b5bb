import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';

const createdAt = () => text('created_at').notNull().default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);

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
  bearingOptions: text('bearing_options', { mode: 'json' }).$type<string[]>().notNull(),
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
    status: text('status', { enum: ['active', 'superseded', 'discontinued'] }).notNull().default('active'),
    condition: text('condition', { enum: ['new', 'exchange'] }).notNull().default('new'),
    priceCents: integer('price_cents').notNull(),
    coreDepositCents: integer('core_deposit_cents').notNull().default(0),
    weightGrams: integer('weight_grams').notNull(),
    description: text('description').notNull().default(''),
    supersededBy: text('superseded_by'),
    images: text('images', { mode: 'json' }).$type<string[]>().notNull().default(sql`'[]'`),
    minStock: integer('min_stock').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  (t) => [
    uniqueIndex('parts_part_number_uq').on(t.partNumber),
    index('parts_normalized_number_idx').on(t.normalizedNumber),
    index('parts_category_idx').on(t.category, t.frameCode),
    index('parts_frame_idx').on(t.frameCode),
  ],
);

/** Per-category specifications; a column is null where the category has no such property. */
export const partSpecs = sqliteTable('part_specs', {
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
  bearing: text('bearing', { enum: ['journal', 'ball'] }),
  wastegate: text('wastegate'),
  cooling: text('cooling'),
  gaugeType: text('gauge_type'),
  rangeText: text('range_text'),
  mounting: text('mounting'),
  connection: text('connection'),
});

/** Other numbers a part is known by: cross-references and the numbers it superseded. */
export const partAliases = sqliteTable(
  'part_aliases',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    partId: integer('part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
    alias: text('alias').notNull(),
    normalizedAlias: text('normalized_alias').notNull(),
    kind: text('kind', { enum: ['cross-reference', 'superseded'] }).notNull(),
    source: text('source'),
  },
  (t) => [index('part_aliases_normalized_idx').on(t.normalizedAlias), index('part_aliases_part_idx').on(t.partId)],
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
  (t) => [primaryKey({ columns: [t.partId, t.binCode] }), index('stock_bin_idx').on(t.binCode)],
);

export const meta = sqliteTable('meta', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
});
