import { asc, eq, inArray, or } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { trays, trayStates } from '../db/schema/trays';

export type TrayRow = typeof trays.$inferSelect;
export type { TrayStateRow } from './tray-states.repository';

export const traysRepository = {
  byId: (db: Db, id: string) => db.select().from(trays).where(eq(trays.id, id)).get(),
  byNumber: (db: Db, number: string) => db.select().from(trays).where(eq(trays.number, number)).get(),
  byIds: (db: Db, ids: string[]) => (ids.length ? db.select().from(trays).where(inArray(trays.id, ids)).all() : []),
  forOrder: (db: Db, orderId: string) =>
    db
      .select({ tray: trays, state: trayStates })
      .from(trays)
      .leftJoin(trayStates, eq(trayStates.trayId, trays.id))
      .where(eq(trays.orderId, orderId))
      .orderBy(asc(trays.kind), asc(trays.createdAt), asc(trays.number))
      .all(),
  withState: (db: Db, id: string) =>
    db.select({ tray: trays, state: trayStates }).from(trays).leftJoin(trayStates, eq(trayStates.trayId, trays.id)).where(eq(trays.id, id)).get(),
  related: (db: Db, tray: TrayRow) =>
    db
      .select()
      .from(trays)
      .where(
        or(
          eq(trays.parentTrayId, tray.id),
          eq(trays.mergedIntoId, tray.id),
          ...(tray.parentTrayId ? [eq(trays.id, tray.parentTrayId)] : []),
          ...(tray.mergedIntoId ? [eq(trays.id, tray.mergedIntoId)] : []),
        ),
      )
      .all(),
  insert: (db: Db, row: typeof trays.$inferInsert) => db.insert(trays).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof trays.$inferInsert>) => db.update(trays).set(patch).where(eq(trays.id, id)).run(),
};
