import { parseEnv } from '../env';
import { openDatabase } from './client';

const env = parseEnv();
const db = openDatabase(env.DATABASE_FILE);
db.$client.close();
console.log(`Migrations applied to ${env.DATABASE_FILE}`);
