import type { Db } from './client';

/** An online backup through SQLite's backup API: safe while the app keeps writing. */
export async function backupDb(db: Db, destination: string): Promise<{ file: string; pages: number }> {
  let pages = 0;
  await db.$client.backup(destination, {
    progress: ({ totalPages }) => {
      pages = totalPages;
      return 200;
    },
  });
  return { file: destination, pages };
}
