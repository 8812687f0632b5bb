import { z } from 'zod';
import {
  BOOST_UNITS,
  SHAFT_LOG_ERRORS_SHOWN,
  SHAFT_LOG_LIMITS,
  SHAFT_LOG_MAX_BYTES,
  SHAFT_LOG_MAX_ROWS,
  type BoostUnit,
  type ShaftLogRow,
  type ShaftLogRowError,
} from './schemas/shaft-logs';
import { barToKpa, kpaToBar, kpaToPsi, psiToKpa } from './units';

/**
 * Spoolyard's shaft-speed log: comma-separated text with a header row naming the columns below (any order, any
 * case; other columns are ignored), one row per sample, times rising. Lines starting with # and blank lines are
 * skipped. See docs/shaft-log-format.md.
 */
export const SHAFT_LOG_COLUMNS = {
  time: 'time_s',
  engineRpm: 'engine_rpm',
  shaftRpm: 'shaft_rpm',
  intakeC: 'intake_c',
} as const;
export const boostColumn = (unit: BoostUnit) => `boost_${unit}` as const;
const BOOST_COLUMNS = BOOST_UNITS.map(boostColumn);

export const BOOST_UNIT_LABELS: Record<BoostUnit, string> = { kpa: 'kPa', psi: 'psi', bar: 'bar' };

export type ShaftLogParse =
  | { ok: true; rows: ShaftLogRow[]; boostUnit: BoostUnit; ignoredColumns: string[] }
  | {
      ok: false;
      /** The first SHAFT_LOG_ERRORS_SHOWN problems, in file order. */
      errors: ShaftLogRowError[];
      errorCount: number;
      /** Over the byte or row limit: the file was not read to its end. */
      tooLarge: boolean;
    };

// One formatter, made once: toLocaleString builds a new one on every call.
const NUMBER_FORMAT = new Intl.NumberFormat('en-US', { maximumFractionDigits: 3 });
const fmt = (value: number) => NUMBER_FORMAT.format(value);

interface Limits {
  min: number;
  max: number;
}

/** Boost limits in the file's own unit, rounded inwards so a value shown as allowed converts inside the kPa limits. */
function boostLimits(unit: BoostUnit): Limits {
  const { min, max } = SHAFT_LOG_LIMITS.boostKpa;
  if (unit === 'kpa') return { min, max };
  const [toUnit, digits] = unit === 'psi' ? [kpaToPsi, 1] : [kpaToBar, 2];
  const f = 10 ** digits;
  return { min: Math.ceil(toUnit(min) * f - 1e-9) / f, max: Math.floor(toUnit(max) * f + 1e-9) / f };
}

function ranged({ min, max }: Limits, unit: string) {
  const outside = (issue: { input?: unknown }) =>
    `${typeof issue.input === 'number' ? fmt(issue.input) : String(issue.input)} ${unit} is outside the plausible ${fmt(min)} to ${fmt(max)} ${unit}`;
  return z.number().min(min, { error: outside }).max(max, { error: outside });
}

// One schema per boost unit, keyed by the file's own column names, so each issue names its column. Every field is
// optional so the cells that did read as numbers are still range-checked when another cell in the row did not.
const rowSchemas = new Map<BoostUnit, z.ZodType<Partial<Record<string, number>>>>();
function rowSchemaFor(unit: BoostUnit) {
  let schema = rowSchemas.get(unit);
  if (!schema) {
    schema = z.object({
      [SHAFT_LOG_COLUMNS.time]: ranged(SHAFT_LOG_LIMITS.timeS, 's'),
      [SHAFT_LOG_COLUMNS.engineRpm]: ranged(SHAFT_LOG_LIMITS.engineRpm, 'rpm'),
      [boostColumn(unit)]: ranged(boostLimits(unit), `${BOOST_UNIT_LABELS[unit]} (gauge)`),
      [SHAFT_LOG_COLUMNS.shaftRpm]: ranged(SHAFT_LOG_LIMITS.shaftRpm, 'rpm'),
      [SHAFT_LOG_COLUMNS.intakeC]: ranged(SHAFT_LOG_LIMITS.intakeC, '°C'),
    }).partial();
    rowSchemas.set(unit, schema);
  }
  return schema;
}

const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

/** A cell as a number, or why it is not one. Spreadsheets sometimes quote every cell; the quotes are dropped. */
function readCell(raw: string | undefined): number | string {
  const cell = (raw ?? '').trim().replace(/^"(.*)"$/, '$1').trim();
  if (cell === '') return 'is empty';
  if (!NUMBER.test(cell)) return `“${cell.length > 24 ? `${cell.slice(0, 24)}…` : cell}” is not a number`;
  return Number(cell);
}

const headerName = (raw: string) => raw.trim().replace(/^"(.*)"$/, '$1').trim().toLowerCase();

const listOf = (names: readonly string[]) =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1] ?? ''}`;

function utf8Bytes(text: string): number {
  // Every character is at least one byte, so only a long text needs counting.
  return text.length * 3 <= SHAFT_LOG_MAX_BYTES ? text.length : new TextEncoder().encode(text).length;
}

/** Reads a log file's text: every row checked, each problem named by line and column. Pure; runs on both sides. */
export function parseShaftLogCsv(input: string): ShaftLogParse {
  const errors: ShaftLogRowError[] = [];
  let errorCount = 0;
  const fail = (line: number | null, column: string | null, message: string) => {
    errorCount += 1;
    if (errors.length < SHAFT_LOG_ERRORS_SHOWN) errors.push({ line, column, message });
  };
  const failed = (tooLarge: boolean): ShaftLogParse => ({ ok: false, errors, errorCount, tooLarge });

  if (utf8Bytes(input) > SHAFT_LOG_MAX_BYTES) {
    fail(null, null, `the file is larger than ${SHAFT_LOG_MAX_BYTES / 1_000_000} MB; split the session into shorter logs`);
    return failed(true);
  }
  const text = input.replace(/^\uFEFF/, '');
  if (text.includes('\u0000')) {
    fail(null, null, 'the file is not text: export the log from the logger as CSV');
    return failed(false);
  }

  const lines = text.split(/\r\n|\n|\r/);
  const skipped = (line: string) => line.trim() === '' || line.trimStart().startsWith('#');
  const headerIndex = lines.findIndex((line) => !skipped(line));
  const headerText = lines[headerIndex];
  if (headerIndex < 0 || headerText === undefined) {
    fail(null, null, 'the file is empty');
    return failed(false);
  }
  const headerLine = headerIndex + 1;
  if (!headerText.includes(',') && /[;\t]/.test(headerText)) {
    fail(headerLine, null, 'columns must be separated by commas; this file uses semicolons or tabs');
    return failed(false);
  }

  const names = headerText.split(',').map(headerName);
  const indexOf = new Map<string, number>();
  for (const [index, name] of names.entries()) {
    if (name === '') continue;
    if (indexOf.has(name)) fail(headerLine, name, `the column ${name} appears twice`);
    else indexOf.set(name, index);
  }
  const boostNames = BOOST_COLUMNS.filter((name) => indexOf.has(name));
  if (boostNames.length > 1) fail(headerLine, null, `give boost in one unit only; the header has ${listOf(boostNames)}`);
  const required = Object.values(SHAFT_LOG_COLUMNS);
  const expected = [SHAFT_LOG_COLUMNS.time, SHAFT_LOG_COLUMNS.engineRpm, 'boost', SHAFT_LOG_COLUMNS.shaftRpm, SHAFT_LOG_COLUMNS.intakeC];
  const missing = expected.flatMap((name) =>
    name === 'boost' ? (boostNames.length === 0 ? ['boost_kpa (or boost_psi or boost_bar)'] : []) : indexOf.has(name) ? [] : [name],
  );
  if (missing.length > 0) {
    const found = names.filter((name) => name !== '');
    fail(
      headerLine,
      null,
      `the header is missing ${listOf(missing)}` + (found.length > 0 ? `; it has ${listOf(found.map((n) => (n.length > 24 ? `${n.slice(0, 24)}…` : n)))}` : ''),
    );
  }
  if (errorCount > 0) return failed(false);

  const boostUnit = BOOST_UNITS.find((unit) => indexOf.has(boostColumn(unit))) ?? 'kpa';
  const used: string[] = [...required, boostColumn(boostUnit)];
  const schema = rowSchemaFor(boostUnit);
  const toKpa = boostUnit === 'kpa' ? (v: number) => v : boostUnit === 'psi' ? psiToKpa : barToKpa;
  const rows: ShaftLogRow[] = [];
  let dataRows = 0;
  let previousTime: number | null = null;

  for (let index = headerIndex + 1; index < lines.length; index += 1) {
    const text = lines[index] ?? '';
    if (skipped(text)) continue;
    const line = index + 1;
    dataRows += 1;
    if (dataRows > SHAFT_LOG_MAX_ROWS) {
      fail(null, null, `the file has more than ${SHAFT_LOG_MAX_ROWS.toLocaleString('en-US')} rows; split the session into shorter logs`);
      return failed(true);
    }

    const cells = text.split(',');
    // A trailing comma or two is harmless; more cells than columns usually means decimal commas.
    while (cells.length > names.length && (cells[cells.length - 1] ?? '').trim() === '') cells.pop();
    if (cells.length !== names.length) {
      fail(
        line,
        null,
        `has ${cells.length} ${cells.length === 1 ? 'value' : 'values'} but the header names ${names.length} columns` +
          (cells.length > names.length ? '; write decimals with a point, not a comma' : ''),
      );
      continue;
    }

    const values: Record<string, number> = {};
    const bad = new Set<string>();
    for (const name of used) {
      const value = readCell(cells[indexOf.get(name) ?? -1]);
      if (typeof value === 'string') {
        fail(line, name, value);
        bad.add(name);
      } else {
        values[name] = value;
      }
    }
    const checked = schema.safeParse(values);
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const column = String(issue.path[0] ?? '');
        fail(line, column, issue.message);
        bad.add(column);
      }
    }
    // Time order is checked whenever the row's own time is good, so one bad cell does not hide a time going back.
    const t = values[SHAFT_LOG_COLUMNS.time];
    if (t !== undefined && !bad.has(SHAFT_LOG_COLUMNS.time)) {
      if (previousTime !== null && t <= previousTime) {
        fail(line, SHAFT_LOG_COLUMNS.time, `${fmt(t)} s is not after the row before (${fmt(previousTime)} s): times must rise from row to row`);
        bad.add(SHAFT_LOG_COLUMNS.time);
      } else {
        previousTime = t;
      }
    }
    if (bad.size > 0) continue;
    rows.push({
      t: values[SHAFT_LOG_COLUMNS.time] ?? 0,
      engineRpm: values[SHAFT_LOG_COLUMNS.engineRpm] ?? 0,
      boostKpa: toKpa(values[boostColumn(boostUnit)] ?? 0),
      shaftRpm: values[SHAFT_LOG_COLUMNS.shaftRpm] ?? 0,
      intakeC: values[SHAFT_LOG_COLUMNS.intakeC] ?? 0,
    });
  }

  if (dataRows === 0) fail(null, null, 'the file has a header but no rows of data');
  if (errorCount > 0) return failed(false);
  return { ok: true, rows, boostUnit, ignoredColumns: names.filter((name) => name !== '' && !used.includes(name)) };
}

/**
 * Row errors travel in the API's one error shape as field errors: `file` for the file as a whole, `line.12` for a
 * line, `line.12.boost_kpa` for one cell. Column names hold no dots, so the key splits back unambiguously.
 */
export function rowErrorsToFieldErrors(errors: readonly ShaftLogRowError[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const e of errors) {
    const key = e.line === null ? 'file' : e.column === null ? `line.${e.line}` : `line.${e.line}.${e.column}`;
    (out[key] ??= []).push(e.message);
  }
  return out;
}

export function rowErrorsFromFieldErrors(fieldErrors: Record<string, string[]>): ShaftLogRowError[] {
  const out: ShaftLogRowError[] = [];
  for (const [key, messages] of Object.entries(fieldErrors)) {
    const match = /^line\.(\d+)(?:\.([a-z0-9_]+))?$/.exec(key);
    // Other keys (the frame, the name) belong to the form's own fields.
    if (!match && key !== 'file') continue;
    const line = match ? Number(match[1]) : null;
    const column = match?.[2] ?? null;
    for (const message of messages) out.push({ line, column, message });
  }
  // File-wide problems first, then in file order.
  return out.sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
}

/** One problem as a sentence, for places that list them as text. */
export function describeRowError(e: ShaftLogRowError): string {
  const where = [e.line === null ? null : `line ${e.line}`, e.column].filter(Boolean).join(', ');
  return where ? `${where}: ${e.message}` : e.message;
}

const BOOST_DIGITS: Record<BoostUnit, number> = { kpa: 1, psi: 2, bar: 3 };

/** Rows as a log file in this format, boost in the unit asked for; `comments` become leading # lines. */
export function formatShaftLogCsv(rows: readonly ShaftLogRow[], boostUnit: BoostUnit, comments: readonly string[] = []): string {
  const fromKpa = boostUnit === 'kpa' ? (v: number) => v : boostUnit === 'psi' ? kpaToPsi : kpaToBar;
  const header = [SHAFT_LOG_COLUMNS.time, SHAFT_LOG_COLUMNS.engineRpm, boostColumn(boostUnit), SHAFT_LOG_COLUMNS.shaftRpm, SHAFT_LOG_COLUMNS.intakeC];
  const lines = rows.map((r) =>
    [r.t.toFixed(2), Math.round(r.engineRpm), fromKpa(r.boostKpa).toFixed(BOOST_DIGITS[boostUnit]), Math.round(r.shaftRpm), r.intakeC.toFixed(1)].join(','),
  );
  return [...comments.map((c) => `# ${c}`), header.join(','), ...lines].join('\n') + '\n';
}
