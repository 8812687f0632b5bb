import path from 'node:path';
import { catalogueIsEmpty, loadCatalogue } from '../catalog-seed/load';
import { generateCatalogue } from '../catalog-seed/generate';
import { createApp } from './app';
import { openDatabase } from './db/client';
import { parseEnv } from './env';

const env = parseEnv();
const db = openDatabase(env.DATABASE_FILE);
if (env.SEED_DEMO && catalogueIsEmpty(db)) {
  const { parts } = loadCatalogue(db, generateCatalogue());
  console.log(`Seeded the demo catalogue: ${parts} parts`);
}
const { app } = createApp({ db, clientDir: path.resolve(import.meta.dirname, '../dist/client') });
const server = app.listen(env.PORT, env.HOST, () => {
  console.log(`Spoolyard is running at http://${env.HOST === '0.0.0.0' ? 'localhost' : env.HOST}:${env.PORT}/`);
});

function shutdown(signal: string) {
  console.log(`${signal}: shutting down`);
  server.close(() => {
    db.$client.close();
    process.exit(0);
  });
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
