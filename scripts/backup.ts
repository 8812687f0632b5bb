// npm run backup [-- --to <folder>]: an online, consistent copy of the live database and the uploads folder, in a
// dated folder under BACKUP_DIR (default data/backups). Safe while the shop runs. See README, "Backup and restore".
import path from 'node:path';
import { parseArgs } from 'node:util';
import { parseEnv } from '../server/env';
import { backup } from '../server/ops/backup';

const { values } = parseArgs({ options: { to: { type: 'string' } } });
const env = parseEnv();
const target = path.resolve(values.to ?? process.env.BACKUP_DIR ?? 'data/backups');
const started = Date.now();
const { folder, manifest } = backup({ databaseFile: env.DATABASE_FILE, uploadsDir: env.UPLOADS_DIR }, target);
console.log(`Backed up to ${folder} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
console.log(`  database: ${(manifest.database.bytes / 1e6).toFixed(1)} MB, integrity ok; ${manifest.counts.orders} orders, ${manifest.counts.parts} parts, ${manifest.counts.accounts} accounts`);
console.log(`  uploads: ${manifest.uploads.files} files, ${(manifest.uploads.bytes / 1e6).toFixed(1)} MB`);
