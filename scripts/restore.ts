// npm run restore -- <backup folder> [--force]: checks the backup, moves the current database and uploads aside and
// puts the backup in their place. Stop the shop first. See README, "Backup and restore".
import path from 'node:path';
import { parseArgs } from 'node:util';
import { parseEnv } from '../server/env';
import { restore } from '../server/ops/backup';

const { values, positionals } = parseArgs({ options: { force: { type: 'boolean', default: false } }, allowPositionals: true });
const folder = positionals[0];
if (!folder) {
  console.error('Usage: npm run restore -- <backup folder> [--force]');
  process.exit(2);
}
const env = parseEnv();
try {
  const { manifest, counts, movedAside } = restore(path.resolve(folder), { databaseFile: env.DATABASE_FILE, uploadsDir: env.UPLOADS_DIR }, { force: values.force });
  console.log(`Restored the backup made ${manifest.createdAt}: ${counts.orders} orders, ${counts.parts} parts, ${counts.accounts} accounts, ${manifest.uploads.files} uploaded files; integrity ok.`);
  for (const m of movedAside) console.log(`  kept aside: ${m}`);
} catch (err) {
  console.error(`Not restored: ${(err as Error).message}`);
  process.exit(1);
}
