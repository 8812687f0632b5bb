import { parse } from 'csv-parse/sync';
import type { Db } from '../db/client';
import { HttpError } from '../middleware/errors';
import { CATEGORY_SLUGS } from '../../shared/catalog';
import { normalizePartNumber } from '../../shared/part-number';
import { PRICE_IMPORT_MAX_ROWS, type PartForm, type PriceImport, type PriceImportRow } from '../../shared/schemas/admin-catalog';

const SPEC_COLUMNS = {
  compressorAr: 'compressor_ar',
  turbineAr: 'turbine_ar',
  trimPct: 'trim_pct',
  inducerMm: 'inducer_mm',
  exducerMm: 'exducer_mm',
  flangePattern: 'flange_pattern',
  inletMm: 'inlet_mm',
  outletMm: 'outlet_mm',
  material: 'material',
  bearing: 'bearing',
  wastegate: 'wastegate',
  cooling: 'cooling',
  gaugeType: 'gauge_type',
  rangeText: 'range_text',
  mounting: 'mounting',
  connection: 'connection',
} as const;

/** Dollars as people write them ("1,234.50", "$99") to integer cents; null when it is not a price. */
export function parseDollarsToCents(text: string): number | null {
  const t = text.trim().replace(/^\$/, '').replace(/,/g, '');
  if (!/^\d{1,7}(\.\d{1,2})?$/.test(t)) return null;
  const [whole, frac = ''] = t.split('.');
  return Number(whole) * 100 + Number(frac.padEnd(2, '0'));
}

interface StoredRow extends PriceImportRow {
  /** For a new part: the fields that create it. */
  create?: { title: string; category: string; weightGrams: number; frameCode: string | null; coreDepositCents: number } | undefined;
  coreDepositCents?: number | null | undefined;
}

export function createCatalogAdmin(deps: { db: Db; refreshSearch: (ids: number[]) => void; rebuildSearch: () => void }) {
  const { db } = deps;
  const sqlite = db.$client;
  const partId = (partNumber: string) => sqlite.prepare('SELECT id FROM parts WHERE normalized_number = ?').pluck().get(normalizePartNumber(partNumber)) as number | undefined;
  const partOr404 = (partNumber: string) => {
    const id = partId(partNumber);
    if (id === undefined) throw new HttpError(404, `No part ${partNumber}`);
    return id;
  };
  const frameExists = (code: string) => !!sqlite.prepare('SELECT 1 FROM frames WHERE code = ?').get(code);

  function getForm(partNumber: string) {
    const id = partOr404(partNumber);
    const p = sqlite
      .prepare(
        `SELECT part_number AS partNumber, title, category, frame_code AS frameCode, condition, status, price_cents AS priceCents, core_deposit_cents AS coreDepositCents,
                weight_grams AS weightGrams, min_stock AS minStock, description, images, superseded_by AS supersededBy FROM parts WHERE id = ?`,
      )
      .get(id) as Record<string, unknown>;
    const specsRow = (sqlite.prepare(`SELECT ${Object.values(SPEC_COLUMNS).join(', ')} FROM part_specs WHERE part_id = ?`).get(id) ?? {}) as Record<string, unknown>;
    const specs = Object.fromEntries(Object.entries(SPEC_COLUMNS).map(([k, c]) => [k, specsRow[c] ?? null]));
    const goesWith = sqlite.prepare('SELECT p.part_number FROM part_links l JOIN parts p ON p.id = l.related_part_id WHERE l.part_id = ? ORDER BY p.part_number').pluck().all(id);
    return { ...p, status: p.status === 'superseded' ? 'discontinued' : p.status, images: JSON.parse(String(p.images)) as string[], specs, goesWith };
  }

  const writeSpecs = (id: number, specs: PartForm['specs']) => {
    const cols = Object.entries(SPEC_COLUMNS);
    sqlite
      .prepare(`INSERT OR REPLACE INTO part_specs (part_id, ${cols.map(([, c]) => c).join(', ')}) VALUES (?, ${cols.map(() => '?').join(', ')})`)
      .run(id, ...cols.map(([k]) => (specs as Record<string, unknown>)[k] ?? null));
  };

  function create(form: PartForm) {
    if (partId(form.partNumber) !== undefined) throw new HttpError(409, `${form.partNumber} already exists`, { partNumber: ['this part number is taken'] });
    if (form.frameCode && !frameExists(form.frameCode)) throw new HttpError(400, `No frame ${form.frameCode}`, { frameCode: ['no such frame'] });
    const id = sqlite.transaction(() => {
      const row = sqlite
        .prepare(
          `INSERT INTO parts (part_number, normalized_number, title, category, frame_code, status, condition, price_cents, core_deposit_cents, weight_grams, description, min_stock)
           VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?) RETURNING id`,
        )
        .get(form.partNumber, normalizePartNumber(form.partNumber), form.title, form.category, form.frameCode, form.status, form.condition, form.priceCents, form.coreDepositCents, form.weightGrams, form.description, form.minStock) as { id: number };
      writeSpecs(row.id, form.specs);
      return row.id;
    })();
    deps.refreshSearch([id]);
    return { partNumber: form.partNumber };
  }

  function update(partNumber: string, form: PartForm) {
    const id = partOr404(partNumber);
    if (normalizePartNumber(form.partNumber) !== normalizePartNumber(partNumber)) throw new HttpError(400, 'A part number cannot change; supersede the part instead', { partNumber: ['supersede instead of renaming'] });
    if (form.frameCode && !frameExists(form.frameCode)) throw new HttpError(400, `No frame ${form.frameCode}`, { frameCode: ['no such frame'] });
    sqlite.transaction(() => {
      sqlite
        .prepare(
          `UPDATE parts SET title = ?, category = ?, frame_code = ?, status = CASE WHEN status = 'superseded' THEN status ELSE ? END, condition = ?, price_cents = ?, core_deposit_cents = ?,
             weight_grams = ?, description = ?, min_stock = ?, updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?`,
        )
        .run(form.title, form.category, form.frameCode, form.status, form.condition, form.priceCents, form.coreDepositCents, form.weightGrams, form.description, form.minStock, id);
      writeSpecs(id, form.specs);
    })();
    deps.refreshSearch([id]);
    return { partNumber };
  }

  /** The old number stays findable: it becomes an alias of the new part and answers with its replacement. */
  function supersede(partNumber: string, replacedBy: string) {
    const oldId = partOr404(partNumber);
    const newId = partId(replacedBy);
    if (newId === undefined) throw new HttpError(400, `No part ${replacedBy}`, { replacedBy: ['no such part'] });
    if (newId === oldId) throw new HttpError(400, 'A part cannot replace itself', { replacedBy: ['choose another part'] });
    const newNumber = sqlite.prepare('SELECT part_number FROM parts WHERE id = ?').pluck().get(newId) as string;
    const oldNumber = sqlite.prepare('SELECT part_number FROM parts WHERE id = ?').pluck().get(oldId) as string;
    sqlite.transaction(() => {
      // No cycles: the replacement must not lead back to this part.
      let next: string | null = newNumber;
      for (let hops = 0; next && hops < 10; hops++) {
        if (normalizePartNumber(next) === normalizePartNumber(oldNumber)) throw new HttpError(409, 'That would make a loop of supersessions');
        next = sqlite.prepare('SELECT superseded_by FROM parts WHERE normalized_number = ?').pluck().get(normalizePartNumber(next)) as string | null;
      }
      sqlite.prepare("UPDATE parts SET status = 'superseded', superseded_by = ? WHERE id = ?").run(newNumber, oldId);
      sqlite.prepare("INSERT INTO part_aliases (part_id, alias, normalized_alias, kind, source) VALUES (?, ?, ?, 'superseded', 'earlier number')").run(newId, oldNumber, normalizePartNumber(oldNumber));
    })();
    deps.refreshSearch([oldId, newId]);
    return { partNumber: oldNumber, supersededBy: newNumber };
  }

  function setLinks(partNumber: string, numbers: string[]) {
    const id = partOr404(partNumber);
    const ids = numbers.map((n) => {
      const other = partId(n);
      if (other === undefined) throw new HttpError(400, `No part ${n}`, { partNumbers: [`no part ${n}`] });
      return other;
    });
    sqlite.transaction(() => {
      sqlite.prepare('DELETE FROM part_links WHERE part_id = ? OR related_part_id = ?').run(id, id);
      for (const other of new Set(ids)) {
        if (other === id) continue;
        sqlite.prepare("INSERT OR IGNORE INTO part_links (part_id, related_part_id, kind) VALUES (?, ?, 'goes-with')").run(id, other);
        sqlite.prepare("INSERT OR IGNORE INTO part_links (part_id, related_part_id, kind) VALUES (?, ?, 'goes-with')").run(other, id);
      }
    })();
    return getForm(partNumber);
  }

  function addPhotos(partNumber: string, names: string[]) {
    const id = partOr404(partNumber);
    const current = JSON.parse(sqlite.prepare('SELECT images FROM parts WHERE id = ?').pluck().get(id) as string) as string[];
    const images = [...current, ...names].slice(-12);
    sqlite.prepare('UPDATE parts SET images = ? WHERE id = ?').run(JSON.stringify(images), id);
    return { images };
  }

  function checkRow(row: number, input: Record<string, string>): StoredRow {
    const partNumber = (input.part_number ?? '').trim();
    const base: StoredRow = { row, partNumber, status: 'error', oldPriceCents: null, newPriceCents: null, title: null, message: null, input };
    if (!partNumber) return { ...base, message: 'part_number is empty' };
    const price = parseDollarsToCents(input.price ?? '');
    if (price === null || price <= 0) return { ...base, message: `price “${(input.price ?? '').slice(0, 20)}” is not an amount in dollars such as 123.45` };
    const core = input.core_deposit?.trim() ? parseDollarsToCents(input.core_deposit) : null;
    if (input.core_deposit?.trim() && core === null) return { ...base, message: `core_deposit “${input.core_deposit.slice(0, 20)}” is not an amount in dollars` };
    const existing = sqlite
      .prepare('SELECT part_number AS partNumber, title, price_cents AS price, core_deposit_cents AS core, condition FROM parts WHERE normalized_number = ?')
      .get(normalizePartNumber(partNumber)) as { partNumber: string; title: string; price: number; core: number; condition: string } | undefined;
    if (existing) {
      if (core !== null && core > 0 && existing.condition !== 'exchange') return { ...base, title: existing.title, message: 'only exchange units carry a core deposit' };
      const changed = existing.price !== price || (core !== null && core !== existing.core);
      return { ...base, partNumber: existing.partNumber, status: changed ? 'changed' : 'unchanged', oldPriceCents: existing.price, newPriceCents: price, title: existing.title, coreDepositCents: core };
    }
    const title = (input.title ?? '').trim();
    const category = (input.category ?? '').trim();
    const weightKg = Number((input.weight_kg ?? '').trim());
    const frameCode = (input.frame ?? '').trim().toUpperCase() || null;
    if (!/^[A-Za-z0-9][A-Za-z0-9-]{3,30}$/.test(partNumber)) return { ...base, message: 'a new part number uses letters, digits and dashes, 4–31 characters' };
    if (!title || !category || !(weightKg > 0)) return { ...base, message: 'unknown part: to add it, give title, category and weight_kg' };
    if (!(CATEGORY_SLUGS as readonly string[]).includes(category)) return { ...base, message: `category must be one of ${CATEGORY_SLUGS.join(', ')}` };
    if (frameCode && !frameExists(frameCode)) return { ...base, message: `no frame ${frameCode}` };
    return {
      ...base,
      partNumber: partNumber.toUpperCase(),
      status: 'new',
      newPriceCents: price,
      title,
      create: { title, category, weightGrams: Math.round(weightKg * 1000), frameCode, coreDepositCents: core ?? 0 },
    };
  }

  function view(id: number): PriceImport {
    const row = sqlite.prepare('SELECT id, file_name AS fileName, status, rows, created_at AS createdAt, applied_at AS appliedAt FROM price_imports WHERE id = ?').get(id) as
      | { id: number; fileName: string; status: 'preview' | 'applied'; rows: string; createdAt: string; appliedAt: string | null }
      | undefined;
    if (!row) throw new HttpError(404, 'No such price import');
    const rows = JSON.parse(row.rows) as StoredRow[];
    const counts = { new: 0, changed: 0, unchanged: 0, error: 0 };
    for (const r of rows) counts[r.status]++;
    // Errors first, so they are never hidden past the first page; unchanged rows are only counted.
    const shown = [...rows.filter((r) => r.status === 'error'), ...rows.filter((r) => r.status === 'new' || r.status === 'changed')].slice(0, 1000);
    return {
      id: row.id,
      fileName: row.fileName,
      status: row.status,
      counts,
      rows: shown.map(({ create: _c, coreDepositCents: _d, ...r }) => r),
      totalRows: rows.length,
      createdAt: row.createdAt,
      appliedAt: row.appliedAt,
    };
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
      throw new HttpError(400, 'The file could not be read as CSV', { file: ['the file could not be read as CSV'] });
    }
    if (records.length === 0) throw new HttpError(400, 'The file has no rows', { file: ['the file has no rows'] });
    if (!('part_number' in records[0]!) || !('price' in records[0]!)) throw new HttpError(400, 'The file needs the columns part_number and price', { file: ['columns part_number and price are needed'] });
    if (records.length > PRICE_IMPORT_MAX_ROWS) throw new HttpError(413, `At most ${PRICE_IMPORT_MAX_ROWS} rows per file`);
    const seen = new Map<string, number>();
    const rows = records.map((input, i) => {
      const checked = checkRow(i + 2, input);
      const key = normalizePartNumber(checked.partNumber);
      if (key && seen.has(key)) return { ...checked, status: 'error' as const, message: `the same part is on row ${seen.get(key)}` };
      if (key) seen.set(key, i + 2);
      return checked;
    });
    const id = sqlite.prepare('INSERT INTO price_imports (user_id, file_name, rows) VALUES (?, ?, ?) RETURNING id').pluck().get(userId, fileName.slice(0, 120), JSON.stringify(rows)) as number;
    return view(id);
  }

  function editRows(id: number, change: (rows: StoredRow[]) => StoredRow[]) {
    const current = sqlite.prepare('SELECT status, rows FROM price_imports WHERE id = ?').get(id) as { status: string; rows: string } | undefined;
    if (!current) throw new HttpError(404, 'No such price import');
    if (current.status !== 'preview') throw new HttpError(409, 'This import was already applied');
    sqlite.prepare('UPDATE price_imports SET rows = ? WHERE id = ?').run(JSON.stringify(change(JSON.parse(current.rows) as StoredRow[])), id);
    return view(id);
  }

  const fixRow = (id: number, row: number, input: Record<string, string>) =>
    editRows(id, (rows) => {
      if (!rows.some((r) => r.row === row)) throw new HttpError(404, `No row ${row}`);
      return rows.map((r) => (r.row === row ? checkRow(row, { ...r.input, ...input }) : r));
    });
  const dropRow = (id: number, row: number) =>
    editRows(id, (rows) => {
      if (!rows.some((r) => r.row === row)) throw new HttpError(404, `No row ${row}`);
      return rows.filter((r) => r.row !== row);
    });

  /** Applies every row in one transaction; a file with an error row applies nothing. */
  function apply(id: number) {
    const touched: number[] = [];
    sqlite.transaction(() => {
      const current = sqlite.prepare('SELECT status, rows FROM price_imports WHERE id = ?').get(id) as { status: string; rows: string } | undefined;
      if (!current) throw new HttpError(404, 'No such price import');
      if (current.status !== 'preview') throw new HttpError(409, 'This import was already applied');
      // Check again at apply time: the catalogue may have changed since the preview.
      const rows = (JSON.parse(current.rows) as StoredRow[]).map((r) => checkRow(r.row, r.input));
      const errors = rows.filter((r) => r.status === 'error');
      if (errors.length > 0) {
        sqlite.prepare('UPDATE price_imports SET rows = ? WHERE id = ?').run(JSON.stringify(rows), id);
        throw new HttpError(409, `${errors.length} ${errors.length === 1 ? 'row is' : 'rows are'} in error: fix or drop ${errors.length === 1 ? 'it' : 'them'} first; nothing was applied`);
      }
      const updatePrice = sqlite.prepare("UPDATE parts SET price_cents = ?, core_deposit_cents = COALESCE(?, core_deposit_cents), updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE normalized_number = ? RETURNING id");
      const insert = sqlite.prepare(
        `INSERT INTO parts (part_number, normalized_number, title, category, frame_code, condition, price_cents, core_deposit_cents, weight_grams)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?) RETURNING id`,
      );
      for (const r of rows) {
        if (r.status === 'changed') {
          const row = updatePrice.get(r.newPriceCents, r.coreDepositCents ?? null, normalizePartNumber(r.partNumber)) as { id: number };
          touched.push(row.id);
        } else if (r.status === 'new' && r.create) {
          const c = r.create;
          const row = insert.get(r.partNumber, normalizePartNumber(r.partNumber), c.title, c.category, c.frameCode, c.coreDepositCents > 0 ? 'exchange' : 'new', r.newPriceCents, c.coreDepositCents, c.weightGrams) as { id: number };
          sqlite.prepare('INSERT INTO part_specs (part_id) VALUES (?)').run(row.id);
          touched.push(row.id);
        }
      }
      sqlite.prepare("UPDATE price_imports SET status = 'applied', rows = ?, applied_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?").run(JSON.stringify(rows), id);
    })();
    if (touched.length > 2000) deps.rebuildSearch();
    else deps.refreshSearch(touched);
    return view(id);
  }

  return { getForm, create, update, supersede, setLinks, addPhotos, startImport, viewImport: view, fixRow, dropRow, apply };
}

export type CatalogAdmin = ReturnType<typeof createCatalogAdmin>;
