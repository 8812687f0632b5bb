import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { count, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { z } from 'zod';
import { openDatabase } from '../db/client';
import { orders, parts, user } from '../db/schema';

/**
 * Backups of the live shop: the SQLite file copied online with `VACUUM INTO` (one read transaction, so the copy is
 * the database as it stood at one instant, committed work in the write-ahead log included, while the shop keeps
 * taking orders — SQLite's documentation of VACUUM INTO), then the uploads folder. The database goes first: a photo
 * is written before the row that names it commits, so every photo the copy names is already on disk when the folder
 * is copied. Each backup is a dated folder with a manifest that lets a restore check it before using it.
 */

const MANIFEST = 'manifest.json';
const DATABASE_COPY = 'spoolyard.db';
const UPLOADS_COPY = 'uploads';

const ManifestSchema = z.object({
  format: z.literal('spoolyard-backup-1'),
  createdAt: z.string(),
  database: z.object({ file: z.string(), bytes: z.number(), sha256: z.string(), integrity: z.literal('ok') }),
  counts: z.object({ orders: z.number(), parts: z.number(), accounts: z.number() }),
  uploads: z.object({ files: z.number(), bytes: z.number() }),
});
export type BackupManifest = z.infer<typeof ManifestSchema>;

export interface BackupPlaces {
  databaseFile: string;
  uploadsDir: string;
}

const sha256 = (file: string) => crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex');

function filesUnder(dir: string): Array<{ file: string; bytes: number }> {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => {
      const file = path.join(e.parentPath, e.name);
      return { file, bytes: fs.statSync(file).size };
    });
}

/** Opens a copy read-only and checks it page by page and reference by reference; throws with SQLite's findings. */
function checkCopy(file: string) {
  const sqlite = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const integrity = sqlite.pragma('integrity_check', { simple: true });
    if (integrity !== 'ok') throw new Error(`${file} fails SQLite's integrity check: ${String(integrity)}`);
    const broken = sqlite.pragma('foreign_key_check') as unknown[];
    if (broken.length > 0) throw new Error(`${file} has ${broken.length} broken references`);
    const db = drizzle(sqlite);
    const n = (table: typeof orders | typeof parts | typeof user) => db.select({ n: count() }).from(table).get()?.n ?? 0;
    return { orders: n(orders), parts: n(parts), accounts: n(user) };
  } finally {
    sqlite.close();
  }
}

/** "2026-12-02T16-40-05Z": sorts by time and is a valid folder name everywhere. */
const stamp = (d: Date) => d.toISOString().replace(/\.\d+Z$/, 'Z').replace(/:/g, '-');

/** Makes a consistent copy of the live database and the uploads in a new dated folder under `backupsDir`. */
export function backup(places: BackupPlaces, backupsDir: string, now = new Date()): { folder: string; manifest: BackupManifest } {
  if (!fs.existsSync(places.databaseFile)) throw new Error(`No database at ${places.databaseFile}`);
  const folder = path.join(backupsDir, stamp(now));
  if (fs.existsSync(folder)) throw new Error(`${folder} already exists`);
  const partial = `${folder}.partial`;
  fs.rmSync(partial, { recursive: true, force: true });
  fs.mkdirSync(partial, { recursive: true });
  try {
    const copy = path.join(partial, DATABASE_COPY);
    const live = new Database(places.databaseFile, { fileMustExist: true });
    try {
      live.pragma('busy_timeout = 5000');
      drizzle(live).run(sql`VACUUM INTO ${copy}`);
    } finally {
      live.close();
    }
    const counts = checkCopy(copy);
    const uploads = filesUnder(places.uploadsDir);
    if (uploads.length > 0) fs.cpSync(places.uploadsDir, path.join(partial, UPLOADS_COPY), { recursive: true });
    const manifest: BackupManifest = {
      format: 'spoolyard-backup-1',
      createdAt: now.toISOString(),
      database: { file: DATABASE_COPY, bytes: fs.statSync(copy).size, sha256: sha256(copy), integrity: 'ok' },
      counts,
      uploads: { files: uploads.length, bytes: uploads.reduce((s, f) => s + f.bytes, 0) },
    };
    fs.writeFileSync(path.join(partial, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`);
    // Only a finished backup gets the dated name, so a folder with that name is always whole.
    fs.renameSync(partial, folder);
    return { folder, manifest };
  } catch (err) {
    fs.rmSync(partial, { recursive: true, force: true });
    throw err;
  }
}

/** Reads and checks a backup folder: the manifest, the copy's checksum and SQLite's integrity check. */
export function verifyBackup(folder: string): BackupManifest {
  const manifestFile = path.join(folder, MANIFEST);
  if (!fs.existsSync(manifestFile)) throw new Error(`${folder} is not a backup: it has no ${MANIFEST}`);
  const manifest = ManifestSchema.parse(JSON.parse(fs.readFileSync(manifestFile, 'utf8')));
  const copy = path.join(folder, manifest.database.file);
  if (!fs.existsSync(copy)) throw new Error(`${copy} is missing`);
  if (sha256(copy) !== manifest.database.sha256) throw new Error(`${copy} has changed since the backup was made (checksum differs)`);
  checkCopy(copy);
  const uploads = filesUnder(path.join(folder, UPLOADS_COPY));
  if (uploads.length !== manifest.uploads.files) throw new Error(`the backup should hold ${manifest.uploads.files} uploaded files but holds ${uploads.length}`);
  return manifest;
}

/**
 * Puts a backup in place of the live database and uploads. The shop must be stopped: a database with a write-ahead
 * log beside it is open somewhere (or was not closed cleanly), and restoring under a running shop would lose what it
 * writes next. What was there is moved aside, not deleted, and the restored file is migrated to this version and
 * checked again.
 */
export function restore(folder: string, places: BackupPlaces, options: { force?: boolean; now?: Date } = {}) {
  const manifest = verifyBackup(folder);
  const wal = `${places.databaseFile}-wal`;
  if (fs.existsSync(wal) && !options.force) {
    throw new Error(`${wal} exists: the shop looks to be running (or was not stopped cleanly). Stop it first, or pass --force after checking.`);
  }
  const aside = `before-restore-${stamp(options.now ?? new Date())}`;
  const movedAside: string[] = [];
  for (const suffix of ['', '-wal', '-shm']) {
    const file = `${places.databaseFile}${suffix}`;
    if (fs.existsSync(file)) {
      fs.renameSync(file, `${places.databaseFile}.${aside}${suffix}`);
      movedAside.push(`${file} → ${places.databaseFile}.${aside}${suffix}`);
    }
  }
  fs.mkdirSync(path.dirname(path.resolve(places.databaseFile)), { recursive: true });
  fs.copyFileSync(path.join(folder, manifest.database.file), places.databaseFile);
  if (fs.existsSync(places.uploadsDir)) {
    fs.renameSync(places.uploadsDir, `${places.uploadsDir}.${aside}`);
    movedAside.push(`${places.uploadsDir} → ${places.uploadsDir}.${aside}`);
  }
  if (fs.existsSync(path.join(folder, UPLOADS_COPY))) fs.cpSync(path.join(folder, UPLOADS_COPY), places.uploadsDir, { recursive: true });
  else fs.mkdirSync(places.uploadsDir, { recursive: true });
  // Brings a backup from an older version up to this one, then checks the result as the shop will open it.
  openDatabase(places.databaseFile).$client.close();
  const counts = checkCopy(places.databaseFile);
  return { manifest, counts, movedAside };
}
