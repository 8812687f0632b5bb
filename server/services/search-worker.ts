// Builds the search index off the request path: opens the database read-only, reads the whole catalogue in one
// read transaction and hands the snapshot back (typed arrays transferred, not copied). Started by search.ts; in the
// compiled server it is its own bundle beside the app (scripts/build-server.ts).
import { parentPort, workerData } from 'node:worker_threads';
import Database from 'better-sqlite3';
import { readSnapshot, transferables } from './search-index';

const { file } = workerData as { file: string };
const sqlite = new Database(file, { readonly: true, fileMustExist: true });
try {
  sqlite.pragma('busy_timeout = 5000');
  const snapshot = readSnapshot(sqlite);
  parentPort!.postMessage(snapshot, transferables(snapshot));
} finally {
  sqlite.close();
}
