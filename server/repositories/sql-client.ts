import type Database from 'better-sqlite3';
import type { DbLike } from '../db/client';

/**
 * The better-sqlite3 connection behind a Drizzle database or transaction handle, for the report
 * and floor queries that use raw prepared statements (plain rows, no per-row object mapping).
 */
export function sqlClient(db: DbLike): Database.Database {
  const d = db as unknown as { $client?: Database.Database; session?: { client?: Database.Database } };
  const c = d.$client ?? d.session?.client;
  if (!c) throw new Error('no SQLite connection behind this handle');
  return c;
}
