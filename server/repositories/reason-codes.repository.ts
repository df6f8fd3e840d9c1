import { eq, asc } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { reasonCodes } from '../db/schema/reference-data';

export const reasonCodesRepository = {
  listAll: (db: Db) => db.select().from(reasonCodes).orderBy(asc(reasonCodes.kind), asc(reasonCodes.code)).all(),
  byCode: (db: Db, code: string) => db.select().from(reasonCodes).where(eq(reasonCodes.code, code)).get(),
  insert: (db: Db, row: typeof reasonCodes.$inferInsert) => db.insert(reasonCodes).values(row).run(),
  update: (db: Db, code: string, patch: Partial<typeof reasonCodes.$inferInsert>) => db.update(reasonCodes).set(patch).where(eq(reasonCodes.code, code)).run(),
};
