import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../lib/project-root';
import * as schema from './schema/all';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = path.join(PROJECT_ROOT, 'drizzle');

/**
 * Opens the database with the pragmas every connection needs (see docs/decisions/0002).
 * WAL lets readers (reports, the wall) run beside the writer; synchronous=FULL makes every
 * confirmed scan survive a power cut; foreign keys on; wait up to 5 s for a lock.
 */
export function openDb(file: string): Db {
  const sqlite = new Database(file);
  // SQLite gives the -wal and -shm files the database file's mode: private to the server user
  fs.chmodSync(file, 0o600);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('temp_store = MEMORY');
  sqlite.pragma('cache_size = -16000');
  return drizzle(sqlite, { schema }) as Db;
}

export function migrateDb(db: Db): void {
  migrate(db, { migrationsFolder });
}

export { schema };

/** A transaction handle: repositories take either so services can group writes. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbLike = Db | Tx;
