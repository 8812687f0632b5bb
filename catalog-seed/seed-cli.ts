import fs from 'node:fs';
import { parseArgs } from 'node:util';
import { openDatabase } from '../server/db/client';
import { parseEnv } from '../server/env';
import { generateCatalogue } from './generate';
import { catalogueIsEmpty, loadCatalogue } from './load';

// Usage: npm run seed -- [--parts 50000] [--file path.db] [--reset]
const { values } = parseArgs({
  options: {
    parts: { type: 'string' },
    file: { type: 'string' },
    reset: { type: 'boolean', default: false },
    seed: { type: 'string' },
  },
});
const file = values.file ?? parseEnv().DATABASE_FILE;
const parts = values.parts ? Number(values.parts) : undefined;
if (parts !== undefined && (!Number.isInteger(parts) || parts < 1 || parts > 1_000_000)) {
  console.error('--parts must be a whole number between 1 and 1000000');
  process.exit(2);
}
if (values.reset) for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${file}${suffix}`, { force: true });
const db = openDatabase(file);
if (!catalogueIsEmpty(db)) {
  console.log(`${file} already has a catalogue; use --reset to replace it`);
} else {
  const started = Date.now();
  const result = loadCatalogue(db, generateCatalogue({ parts, seed: values.seed ? Number(values.seed) : undefined }));
  console.log(`Seeded ${result.parts} parts into ${file} in ${Date.now() - started} ms`);
}
db.$client.close();
