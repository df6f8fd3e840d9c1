import { eq, asc } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { stations } from '../db/schema/stations';
import { reasonCodes } from '../db/schema/reference-data';

export type StationRow = typeof stations.$inferSelect;

export const stationsRepository = {
  list: (db: Db) => db.select().from(stations).orderBy(asc(stations.code)).all(),
  byId: (db: Db, id: string) => db.select().from(stations).where(eq(stations.id, id)).get(),
  byCode: (db: Db, code: string) => db.select().from(stations).where(eq(stations.code, code)).get(),
  insert: (db: Db, row: typeof stations.$inferInsert) => db.insert(stations).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof stations.$inferInsert>) => db.update(stations).set(patch).where(eq(stations.id, id)).run(),
  reasonCodes: (db: Db) => db.select().from(reasonCodes).where(eq(reasonCodes.active, true)).orderBy(reasonCodes.code).all(),
};
