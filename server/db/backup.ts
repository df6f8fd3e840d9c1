import fs from 'node:fs';
import path from 'node:path';
import type { Db } from './client';

/** An online backup through SQLite's backup API: safe while the app keeps writing. */
export async function backupDb(db: Db, destination: string): Promise<{ file: string; pages: number }> {
  let pages = 0;
  fs.mkdirSync(path.dirname(destination), { recursive: true, mode: 0o700 });
  await db.$client.backup(destination, {
    progress: ({ totalPages }) => {
      pages = totalPages;
      return 200;
    },
  });
  // a backup is the whole database: private to the server user like the database itself
  fs.chmodSync(destination, 0o600);
  return { file: destination, pages };
}
