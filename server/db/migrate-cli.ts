import { loadEnv } from '../env';
import { openDb, migrateDb } from './client';
import path from 'node:path';
import fs from 'node:fs';

const env = loadEnv();
fs.mkdirSync(env.dataDir, { recursive: true });
const db = openDb(path.join(env.dataDir, 'trayce.db'));
migrateDb(db);
db.$client.close();
console.log(`migrated ${path.join(env.dataDir, 'trayce.db')}`);
