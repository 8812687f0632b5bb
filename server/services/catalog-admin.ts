import { parse } from 'csv-parse/sync';
import { count, desc, eq, getTableColumns, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import { frames, partAliases, partLinks, parts, partSpecs, priceImports, user, type PriceImportStoredRow as StoredRow } from '../db/schema';
import { diffFields, recordAudit, type AuditEntryInput } from './audit-log';
import { ConflictError, InvalidError, NotFoundError, TooLargeError } from './errors';
import { CATEGORY_SLUGS } from '../../shared/catalog';
import { parseMoneyToCents } from '../../shared/format';
import { gtinForPart } from '../../shared/gtin';
import { normalizePartNumber, PART_NUMBER_EXAMPLE, PART_NUMBER_PATTERN } from '../../shared/part-number';
import { DEFAULT_MAX_CHANGE_PCT, describeFlag, isAcknowledged, priceFlags } from '../../shared/price-import-flags';
import {
  PRICE_IMPORT_HISTORY_PAGE,
  PRICE_IMPORT_MAX_ROWS,
  type PartForm,
  type PriceImport,
  type PriceImportAcknowledge,
  type PriceImportHistory,
} from '../../shared/schemas/admin-catalog';

const NOW = sql`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

const { partId: _partId, ...specColumns } = getTableColumns(partSpecs);

/** Every spec column, so saving a form clears the properties it leaves empty. */
const specValues = (s: PartForm['specs']): Omit<typeof partSpecs.$inferSelect, 'partId'> => ({
  compressorAr: s.compressorAr ?? null,
  turbineAr: s.turbineAr ?? null,
  trimPct: s.trimPct ?? null,
  inducerMm: s.inducerMm ?? null,
  exducerMm: s.exducerMm ?? null,
  flangePattern: s.flangePattern ?? null,
  inletMm: s.inletMm ?? null,
  outletMm: s.outletMm ?? null,
  material: s.material ?? null,
  bearing: s.bearing ?? null,
  wastegate: s.wastegate ?? null,
  cooling: s.cooling ?? null,
  gaugeType: s.gaugeType ?? null,
  rangeText: s.rangeText ?? null,
  mounting: s.mounting ?? null,
  connection: s.connection ?? null,
});

export function createCatalogAdmin(deps: { db: Db; refreshSearch: (ids: number[]) => void; rebuildSearch: () => void }) {
  const { db } = deps;

  // Helpers query through db: better-sqlite3 has one connection, so they run inside whichever transaction is open.
  const partByNumber = (number: string) =>
    db
      .select({ partNumber: parts.partNumber, title: parts.title, price: parts.priceCents, core: parts.coreDepositCents, condition: parts.condition })
      .from(parts)
      .where(eq(parts.normalizedNumber, number))
      .get();
  const frameByCode = (code: string) => db.select({ code: frames.code }).from(frames).where(eq(frames.code, code)).get();

  const findPart = (partNumber: string) =>
    db
      .select({ id: parts.id, partNumber: parts.partNumber })
      .from(parts)
      .where(eq(parts.normalizedNumber, normalizePartNumber(partNumber)))
      .get();
  const partOr404 = (partNumber: string) => {
    const part = findPart(partNumber);
    if (!part) throw new NotFoundError(`No part ${partNumber}`);
    return part;
  };
  const frameExists = (code: string) => frameByCode(code) !== undefined;

  function getForm(partNumber: string) {
    const { id } = partOr404(partNumber);
    const p = db
      .select({
        partNumber: parts.partNumber,
        gtin: parts.gtin,
        title: parts.title,
        category: parts.category,
        frameCode: parts.frameCode,
        condition: parts.condition,
        status: parts.status,
        priceCents: parts.priceCents,
        coreDepositCents: parts.coreDepositCents,
        weightGrams: parts.weightGrams,
        minStock: parts.minStock,
        description: parts.description,
        images: parts.images,
        supersededBy: parts.supersededBy,
      })
      .from(parts)
      .where(eq(parts.id, id))
      .get();
    if (!p) throw new NotFoundError(`No part ${partNumber}`);
    const specs = db.select(specColumns).from(partSpecs).where(eq(partSpecs.partId, id)).get() ?? specValues({});
    const goesWith = db
      .select({ partNumber: parts.partNumber })
      .from(partLinks)
      .innerJoin(parts, eq(parts.id, partLinks.relatedPartId))
      .where(eq(partLinks.partId, id))
      .orderBy(parts.partNumber)
      .all()
      .map((r) => r.partNumber);
    return { ...p, gtin: p.gtin ?? gtinForPart(id), status: p.status === 'superseded' ? 'discontinued' : p.status, specs, goesWith };
  }

  const writeSpecs = (id: number, specs: PartForm['specs']) => {
    const values = specValues(specs);
    db.insert(partSpecs)
      .values({ partId: id, ...values })
      .onConflictDoUpdate({ target: partSpecs.partId, set: values })
      .run();
  };

  /** The part as the audit log compares it: the form's fields, specs flattened beside them. */
  const auditView = (form: Omit<ReturnType<typeof getForm>, 'images' | 'supersededBy' | 'goesWith'>) => {
    const { specs, ...rest } = form;
    return { ...rest, ...Object.fromEntries(Object.entries(specs).map(([k, v]) => [`specs.${k}`, v])) };
  };

  function create(userId: string | null, form: PartForm) {
    if (findPart(form.partNumber) !== undefined) throw new ConflictError(`${form.partNumber} already exists`, { partNumber: ['this part number is taken'] });
    if (form.frameCode && !frameExists(form.frameCode)) throw new InvalidError(`No frame ${form.frameCode}`, { frameCode: ['no such frame'] });
    const id = db.transaction((tx) => {
      const row = tx
        .insert(parts)
        .values({
          partNumber: form.partNumber,
          normalizedNumber: normalizePartNumber(form.partNumber),
          title: form.title,
          category: form.category,
          frameCode: form.frameCode,
          status: form.status,
          condition: form.condition,
          priceCents: form.priceCents,
          coreDepositCents: form.coreDepositCents,
          weightGrams: form.weightGrams,
          description: form.description,
          minStock: form.minStock,
        })
        .returning({ id: parts.id })
        .get();
      // The GTIN's item reference is the new part's id (shared/gtin.ts); never typed, never changed afterwards.
      tx.update(parts).set({ gtin: gtinForPart(row.id) }).where(eq(parts.id, row.id)).run();
      writeSpecs(row.id, form.specs);
      const { images: _i, supersededBy: _s, goesWith: _g, ...created } = getForm(form.partNumber);
      recordAudit(tx, [{ userId, action: 'part-created', partId: row.id, partNumber: form.partNumber, changes: diffFields({}, auditView(created)) }]);
      return row.id;
    });
    deps.refreshSearch([id]);
    return { partNumber: form.partNumber };
  }

  function update(userId: string, partNumber: string, form: PartForm) {
    const { id, partNumber: stored } = partOr404(partNumber);
    if (normalizePartNumber(form.partNumber) !== normalizePartNumber(partNumber)) throw new InvalidError('A part number cannot change; supersede the part instead', { partNumber: ['supersede instead of renaming'] });
    if (form.frameCode && !frameExists(form.frameCode)) throw new InvalidError(`No frame ${form.frameCode}`, { frameCode: ['no such frame'] });
    db.transaction((tx) => {
      const { images: _i, supersededBy: _s, goesWith: _g, ...before } = getForm(stored);
      tx.update(parts)
        .set({
          title: form.title,
          category: form.category,
          frameCode: form.frameCode,
          // A superseded part stays superseded: the form offers only active and discontinued.
          status: sql`CASE WHEN ${parts.status} = 'superseded' THEN ${parts.status} ELSE ${form.status} END`,
          condition: form.condition,
          priceCents: form.priceCents,
          coreDepositCents: form.coreDepositCents,
          weightGrams: form.weightGrams,
          description: form.description,
          minStock: form.minStock,
          updatedAt: NOW,
        })
        .where(eq(parts.id, id))
        .run();
      writeSpecs(id, form.specs);
      const { images: _i2, supersededBy: _s2, goesWith: _g2, ...after } = getForm(stored);
      const changes = diffFields(auditView(before), auditView(after));
      if (Object.keys(changes).length > 0) recordAudit(tx, [{ userId, action: 'part-edited', partId: id, partNumber: stored, changes }]);
    });
    deps.refreshSearch([id]);
    return { partNumber };
  }

  /** The old number stays findable: it becomes an alias of the new part and answers with its replacement. */
  function supersede(userId: string, partNumber: string, replacedBy: string) {
    const old = partOr404(partNumber);
    const replacement = findPart(replacedBy);
    if (replacement === undefined) throw new InvalidError(`No part ${replacedBy}`, { replacedBy: ['no such part'] });
    if (replacement.id === old.id) throw new InvalidError('A part cannot replace itself', { replacedBy: ['choose another part'] });
    db.transaction((tx) => {
      // No cycles: the replacement must not lead back to this part.
      let next: string | null = replacement.partNumber;
      for (let hops = 0; next && hops < 10; hops++) {
        if (normalizePartNumber(next) === normalizePartNumber(old.partNumber)) throw new ConflictError('That would make a loop of supersessions');
        next =
          tx
            .select({ supersededBy: parts.supersededBy })
            .from(parts)
            .where(eq(parts.normalizedNumber, normalizePartNumber(next)))
            .get()?.supersededBy ?? null;
      }
      tx.update(parts).set({ status: 'superseded', supersededBy: replacement.partNumber }).where(eq(parts.id, old.id)).run();
      tx.insert(partAliases)
        .values({ partId: replacement.id, alias: old.partNumber, normalizedAlias: normalizePartNumber(old.partNumber), kind: 'superseded', source: 'earlier number' })
        .run();
      recordAudit(tx, [{ userId, action: 'part-superseded', partId: old.id, partNumber: old.partNumber, changes: { supersededBy: { from: null, to: replacement.partNumber } } }]);
    });
    deps.refreshSearch([old.id, replacement.id]);
    return { partNumber: old.partNumber, supersededBy: replacement.partNumber };
  }

  function setLinks(userId: string, partNumber: string, numbers: string[]) {
    const { id, partNumber: stored } = partOr404(partNumber);
    const before = getForm(stored).goesWith;
    const ids = numbers.map((n) => {
      const other = findPart(n);
      if (other === undefined) throw new InvalidError(`No part ${n}`, { partNumbers: [`no part ${n}`] });
      return other.id;
    });
    db.transaction((tx) => {
      tx.delete(partLinks)
        .where(or(eq(partLinks.partId, id), eq(partLinks.relatedPartId, id)))
        .run();
      for (const other of new Set(ids)) {
        if (other === id) continue;
        tx.insert(partLinks)
          .values([
            { partId: id, relatedPartId: other, kind: 'goes-with' },
            { partId: other, relatedPartId: id, kind: 'goes-with' },
          ])
          .onConflictDoNothing()
          .run();
      }
      const after = getForm(stored).goesWith;
      if (JSON.stringify(before) !== JSON.stringify(after)) recordAudit(tx, [{ userId, action: 'part-links-set', partId: id, partNumber: stored, changes: { goesWith: { from: before, to: after } } }]);
    });
    return getForm(partNumber);
  }

  function addPhotos(userId: string, partNumber: string, names: string[]) {
    const { id, partNumber: stored } = partOr404(partNumber);
    const current = db.select({ images: parts.images }).from(parts).where(eq(parts.id, id)).get()?.images ?? [];
    const images = [...current, ...names].slice(-12);
    db.transaction((tx) => {
      tx.update(parts).set({ images }).where(eq(parts.id, id)).run();
      recordAudit(tx, [{ userId, action: 'part-photos-added', partId: id, partNumber: stored, changes: { images: { from: current, to: images } } }]);
    });
    return { images };
  }

  /** The flags a checked row earns at the import's threshold, with what each saw. */
  const withFlags = (r: StoredRow, maxChangePct: number, coreNow: number): StoredRow => {
    if ((r.status !== 'changed' && r.status !== 'new') || r.newPriceCents === null) return { ...r, flags: [], flagNotes: [] };
    const input = { oldPriceCents: r.oldPriceCents, newPriceCents: r.newPriceCents, coreDepositCents: coreNow, maxChangePct };
    const flags = priceFlags(input);
    return { ...r, flags, flagNotes: flags.map((f) => describeFlag(f, input)) };
  };

  function checkRow(row: number, input: Record<string, string>, maxChangePct: number): StoredRow {
    const partNumber = (input.part_number ?? '').trim();
    const base: StoredRow = { row, partNumber, status: 'error', oldPriceCents: null, newPriceCents: null, title: null, message: null, input };
    if (!partNumber) return { ...base, message: 'part_number is empty' };
    const price = parseMoneyToCents(input.price ?? '');
    if (price === null || price <= 0) return { ...base, message: `price “${(input.price ?? '').slice(0, 20)}” is not an amount in dollars such as 123.45` };
    const core = input.core_deposit?.trim() ? parseMoneyToCents(input.core_deposit) : null;
    if (input.core_deposit?.trim() && core === null) return { ...base, message: `core_deposit “${input.core_deposit.slice(0, 20)}” is not an amount in dollars` };
    const existing = partByNumber(normalizePartNumber(partNumber));
    if (existing) {
      if (core !== null && core > 0 && existing.condition !== 'exchange') return { ...base, title: existing.title, message: 'only exchange units carry a core deposit' };
      const changed = existing.price !== price || (core !== null && core !== existing.core);
      const checked: StoredRow = {
        ...base,
        partNumber: existing.partNumber,
        status: changed ? 'changed' : 'unchanged',
        oldPriceCents: existing.price,
        newPriceCents: price,
        title: existing.title,
        coreDepositCents: core,
        oldCoreCents: existing.core,
        newCoreCents: core !== null && core !== existing.core ? core : null,
      };
      return withFlags(checked, maxChangePct, core ?? existing.core);
    }
    const title = (input.title ?? '').trim();
    const category = (input.category ?? '').trim();
    const weightKg = Number((input.weight_kg ?? '').trim());
    const frameCode = (input.frame ?? '').trim().toUpperCase() || null;
    if (!PART_NUMBER_PATTERN.test(partNumber.toUpperCase())) {
      return { ...base, message: `a new part number follows our numbering, e.g. ${PART_NUMBER_EXAMPLE} (frame code, category group and line, serial)` };
    }
    if (!title || !category || !(weightKg > 0)) return { ...base, message: 'unknown part: to add it, give title, category and weight_kg' };
    if (!(CATEGORY_SLUGS as readonly string[]).includes(category)) return { ...base, message: `category must be one of ${CATEGORY_SLUGS.join(', ')}` };
    if (frameCode && !frameExists(frameCode)) return { ...base, message: `no frame ${frameCode}` };
    const created: StoredRow = {
      ...base,
      partNumber: partNumber.toUpperCase(),
      status: 'new',
      newPriceCents: price,
      title,
      newCoreCents: core ?? 0,
      create: { title, category, weightGrams: Math.round(weightKg * 1000), frameCode, coreDepositCents: core ?? 0 },
    };
    return withFlags(created, maxChangePct, core ?? 0);
  }

  const isFlagged = (r: StoredRow) => (r.flags?.length ?? 0) > 0;
  const isWaiting = (r: StoredRow) => isFlagged(r) && !isAcknowledged(r.flags ?? [], r.acknowledged);

  const uploader = alias(user, 'uploader');
  const applier = alias(user, 'applier');

  function view(id: number): PriceImport {
    const row = db
      .select({
        id: priceImports.id,
        fileName: priceImports.fileName,
        status: priceImports.status,
        rows: priceImports.rows,
        createdAt: priceImports.createdAt,
        appliedAt: priceImports.appliedAt,
        maxChangePct: priceImports.maxChangePct,
        createdBy: uploader.name,
        appliedBy: applier.name,
      })
      .from(priceImports)
      .innerJoin(uploader, eq(uploader.id, priceImports.userId))
      .leftJoin(applier, eq(applier.id, priceImports.appliedBy))
      .where(eq(priceImports.id, id))
      .get();
    if (!row) throw new NotFoundError('No such price import');
    const rows = row.rows;
    const counts = { new: 0, changed: 0, unchanged: 0, error: 0 };
    for (const r of rows) counts[r.status]++;
    const changes = rows.filter((r) => r.status === 'new' || r.status === 'changed');
    // Errors first, then flagged rows, so neither is hidden past the first page; unchanged rows are only counted.
    const shown = [...rows.filter((r) => r.status === 'error'), ...changes.filter(isFlagged), ...changes.filter((r) => !isFlagged(r))].slice(0, 1000);
    return {
      id: row.id,
      fileName: row.fileName,
      status: row.status,
      counts,
      flagged: rows.filter(isFlagged).length,
      unacknowledged: rows.filter(isWaiting).length,
      maxChangePct: row.maxChangePct,
      rows: shown.map(({ create: _c, coreDepositCents: _d, acknowledged: _a, ...r }) => ({ ...r, acknowledged: isFlagged(r) && !isWaiting({ ...r, acknowledged: _a }) })),
      totalRows: rows.length,
      createdAt: row.createdAt,
      createdBy: row.createdBy,
      appliedAt: row.appliedAt,
      appliedBy: row.appliedBy,
    };
  }

  /** Every import, newest first: who uploaded it, who applied it and when, and what it changed. */
  function history(page: number): PriceImportHistory {
    const total = db.select({ n: count() }).from(priceImports).get()?.n ?? 0;
    const items = db
      .select({
        id: priceImports.id,
        fileName: priceImports.fileName,
        status: priceImports.status,
        createdAt: priceImports.createdAt,
        createdBy: uploader.name,
        appliedAt: priceImports.appliedAt,
        appliedBy: applier.name,
        totalRows: sql<number>`json_array_length(${priceImports.rows})`,
        changedCount: priceImports.changedCount,
        newCount: priceImports.newCount,
        flaggedCount: priceImports.flaggedCount,
      })
      .from(priceImports)
      .innerJoin(uploader, eq(uploader.id, priceImports.userId))
      .leftJoin(applier, eq(applier.id, priceImports.appliedBy))
      .orderBy(desc(priceImports.id))
      .limit(PRICE_IMPORT_HISTORY_PAGE)
      .offset((page - 1) * PRICE_IMPORT_HISTORY_PAGE)
      .all();
    return { items, total, page, pageSize: PRICE_IMPORT_HISTORY_PAGE };
  }

  function startImport(userId: string, fileName: string, csv: string) {
    let records: Array<Record<string, string>>;
    try {
      records = parse(csv.replace(/^\uFEFF/, ''), {
        columns: (header: string[]) => header.map((h) => h.trim().toLowerCase().replace(/[^a-z0-9]+/g, '_')),
        skip_empty_lines: true,
        trim: true,
        relax_column_count: true,
      }) as Array<Record<string, string>>;
    } catch {
      throw new InvalidError('The file could not be read as CSV', { file: ['the file could not be read as CSV'] });
    }
    if (records.length === 0) throw new InvalidError('The file has no rows', { file: ['the file has no rows'] });
    if (!('part_number' in records[0]!) || !('price' in records[0]!)) throw new InvalidError('The file needs the columns part_number and price', { file: ['columns part_number and price are needed'] });
    if (records.length > PRICE_IMPORT_MAX_ROWS) throw new TooLargeError(`At most ${PRICE_IMPORT_MAX_ROWS} rows per file`);
    const seen = new Map<string, number>();
    const rows = records.map((input, i) => {
      const checked = checkRow(i + 2, input, DEFAULT_MAX_CHANGE_PCT);
      const key = normalizePartNumber(checked.partNumber);
      if (key && seen.has(key)) return { ...checked, status: 'error' as const, message: `the same part is on row ${seen.get(key)}` };
      if (key) seen.set(key, i + 2);
      return checked;
    });
    const { id } = db.insert(priceImports).values({ userId, fileName: fileName.slice(0, 120), rows }).returning({ id: priceImports.id }).get();
    return view(id);
  }

  function editRows(id: number, change: (rows: StoredRow[], maxChangePct: number) => StoredRow[], settings: { maxChangePct?: number } = {}) {
    db.transaction((tx) => {
      const current = tx.select({ status: priceImports.status, rows: priceImports.rows, maxChangePct: priceImports.maxChangePct }).from(priceImports).where(eq(priceImports.id, id)).get();
      if (!current) throw new NotFoundError('No such price import');
      if (current.status !== 'preview') throw new ConflictError('This import was already applied');
      const maxChangePct = settings.maxChangePct ?? current.maxChangePct;
      tx.update(priceImports)
        .set({ rows: change(current.rows, maxChangePct), maxChangePct })
        .where(eq(priceImports.id, id))
        .run();
    });
    return view(id);
  }

  /** A corrected row is checked afresh: any acknowledgement was for what it said before. */
  const fixRow = (id: number, row: number, input: Record<string, string>) =>
    editRows(id, (rows, pct) => {
      if (!rows.some((r) => r.row === row)) throw new NotFoundError(`No row ${row}`);
      return rows.map((r) => (r.row === row ? checkRow(row, { ...r.input, ...input }, pct) : r));
    });

  /** A new threshold flags the rows again; acknowledgements stand for the flags they covered. */
  const setThreshold = (id: number, maxChangePct: number) =>
    editRows(id, (rows, pct) => rows.map((r) => (r.status === 'changed' || r.status === 'new' ? { ...checkRow(r.row, r.input, pct), acknowledged: r.acknowledged } : r)), { maxChangePct });

  /** Staff say they have looked at flagged rows (or take that back); only flagged rows can be acknowledged. */
  const acknowledge = (id: number, input: PriceImportAcknowledge) =>
    editRows(id, (rows) => {
      const wanted = 'rows' in input ? new Set(input.rows) : null;
      if (wanted) {
        for (const n of wanted) {
          const r = rows.find((x) => x.row === n);
          if (!r) throw new NotFoundError(`No row ${n}`);
          if (!isFlagged(r)) throw new InvalidError(`Row ${n} is not flagged`);
        }
      }
      return rows.map((r) => (isFlagged(r) && (wanted === null || wanted.has(r.row)) ? { ...r, acknowledged: input.acknowledged ? [...(r.flags ?? [])] : null } : r));
    });
  const dropRow = (id: number, row: number) =>
    editRows(id, (rows) => {
      if (!rows.some((r) => r.row === row)) throw new NotFoundError(`No row ${row}`);
      return rows.filter((r) => r.row !== row);
    });

  /**
   * Applies every row in one transaction. A file with an error row, or with a flagged row nobody acknowledged, applies
   * nothing; nor does one whose count of changes is not the count the person confirmed.
   */
  function apply(id: number, userId: string, expectChanges?: number) {
    const touched: number[] = [];
    db.transaction((tx) => {
      const current = tx.select({ status: priceImports.status, rows: priceImports.rows, maxChangePct: priceImports.maxChangePct }).from(priceImports).where(eq(priceImports.id, id)).get();
      if (!current) throw new NotFoundError('No such price import');
      if (current.status !== 'preview') throw new ConflictError('This import was already applied');
      // Check again at apply time: the catalogue may have changed since the preview.
      const rows = current.rows.map((r) => ({ ...checkRow(r.row, r.input, current.maxChangePct), acknowledged: r.acknowledged }));
      const errors = rows.filter((r) => r.status === 'error');
      if (errors.length > 0) {
        tx.update(priceImports).set({ rows }).where(eq(priceImports.id, id)).run();
        throw new ConflictError(`${errors.length} ${errors.length === 1 ? 'row is' : 'rows are'} in error: fix or drop ${errors.length === 1 ? 'it' : 'them'} first; nothing was applied`);
      }
      const waiting = rows.filter(isWaiting);
      if (waiting.length > 0) {
        tx.update(priceImports).set({ rows }).where(eq(priceImports.id, id)).run();
        throw new ConflictError(
          `${waiting.length} flagged ${waiting.length === 1 ? 'row is' : 'rows are'} not acknowledged (first: row ${waiting[0]!.row}, ${waiting[0]!.partNumber}): look at ${waiting.length === 1 ? 'it' : 'them'} and acknowledge, fix or drop; nothing was applied`,
        );
      }
      const changing = rows.filter((r) => r.status === 'changed' || r.status === 'new').length;
      if (expectChanges !== undefined && expectChanges !== changing) {
        tx.update(priceImports).set({ rows }).where(eq(priceImports.id, id)).run();
        throw new ConflictError(`The list now makes ${changing} changes, not the ${expectChanges} you confirmed: look at it again; nothing was applied`);
      }
      const audit: AuditEntryInput[] = [];
      for (const r of rows) {
        if (r.status === 'changed') {
          const row = tx
            .update(parts)
            .set({
              priceCents: r.newPriceCents!,
              coreDepositCents: sql`COALESCE(${r.coreDepositCents ?? null}, ${parts.coreDepositCents})`,
              updatedAt: NOW,
            })
            .where(eq(parts.normalizedNumber, normalizePartNumber(r.partNumber)))
            .returning({ id: parts.id })
            .get();
          if (row) {
            touched.push(row.id);
            const changes = diffFields({ priceCents: r.oldPriceCents }, { priceCents: r.newPriceCents });
            if (r.newCoreCents !== null && r.newCoreCents !== undefined) changes.coreDepositCents = { from: r.oldCoreCents ?? null, to: r.newCoreCents };
            audit.push({ userId, action: 'price-imported', partId: row.id, partNumber: r.partNumber, priceImportId: id, changes });
          }
        } else if (r.status === 'new' && r.create) {
          const c = r.create;
          const row = tx
            .insert(parts)
            .values({
              partNumber: r.partNumber,
              normalizedNumber: normalizePartNumber(r.partNumber),
              title: c.title,
              category: c.category,
              frameCode: c.frameCode,
              condition: c.coreDepositCents > 0 ? 'exchange' : 'new',
              priceCents: r.newPriceCents!,
              coreDepositCents: c.coreDepositCents,
              weightGrams: c.weightGrams,
            })
            .returning({ id: parts.id })
            .get();
          tx.insert(partSpecs).values({ partId: row.id }).run();
          touched.push(row.id);
          audit.push({
            userId,
            action: 'part-imported',
            partId: row.id,
            partNumber: r.partNumber,
            priceImportId: id,
            changes: diffFields({}, { title: c.title, category: c.category, frameCode: c.frameCode, priceCents: r.newPriceCents, coreDepositCents: c.coreDepositCents, weightGrams: c.weightGrams }),
          });
        }
      }
      recordAudit(tx, audit);
      tx.update(priceImports)
        .set({
          status: 'applied',
          rows,
          appliedAt: NOW,
          appliedBy: userId,
          changedCount: rows.filter((r) => r.status === 'changed').length,
          newCount: rows.filter((r) => r.status === 'new').length,
          flaggedCount: rows.filter(isFlagged).length,
        })
        .where(eq(priceImports.id, id))
        .run();
    });
    if (touched.length > 2000) deps.rebuildSearch();
    else deps.refreshSearch(touched);
    return view(id);
  }

  return { getForm, create, update, supersede, setLinks, addPhotos, startImport, viewImport: view, history, fixRow, dropRow, setThreshold, acknowledge, apply };
}

export type CatalogAdmin = ReturnType<typeof createCatalogAdmin>;
