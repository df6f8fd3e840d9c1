import { loadEnv } from '../env';
import { openDb } from './client';
import { backupDb } from './backup';
import path from 'node:path';
import fs from 'node:fs';

const env = loadEnv();
const dir = path.join(env.dataDir, 'backups');
fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = process.argv[2] ?? path.join(dir, `trayce-${stamp}.db`);
const db = openDb(path.join(env.dataDir, 'trayce.db'));
const { file, pages } = await backupDb(db, target);
db.$client.close();
console.log(`backup written to ${file} (${pages} pages)`);
