import { and, asc, eq, inArray, or } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { trays, trayStates } from '../db/schema/trays';
import { scanEvents } from '../db/schema/scans';
import { stations } from '../db/schema/stations';
import { users } from '../db/schema/users';

export type TrayRow = typeof trays.$inferSelect;
export type TrayStateRow = typeof trayStates.$inferSelect;
export type TrayStateInsert = typeof trayStates.$inferInsert;

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
    db
      .select({ tray: trays, state: trayStates })
      .from(trays)
      .leftJoin(trayStates, eq(trayStates.trayId, trays.id))
      .where(eq(trays.id, id))
      .get(),
  state: (db: Db, trayId: string) => db.select().from(trayStates).where(eq(trayStates.trayId, trayId)).get(),
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
  insertState: (db: Db, row: typeof trayStates.$inferInsert) => db.insert(trayStates).values(row).run(),
  updateState: (db: Db, trayId: string, patch: Partial<typeof trayStates.$inferInsert>) =>
    db.update(trayStates).set(patch).where(eq(trayStates.trayId, trayId)).run(),

  events: (db: Db, trayId: string) =>
    db
      .select({ event: scanEvents, by: users.name, station: stations.name })
      .from(scanEvents)
      .leftJoin(users, eq(users.id, scanEvents.userId))
      .leftJoin(stations, eq(stations.id, scanEvents.stationId))
      .where(eq(scanEvents.trayId, trayId))
      .orderBy(asc(scanEvents.occurredAt), asc(scanEvents.receivedAt))
      .all(),
  insertEvent: (db: Db, row: typeof scanEvents.$inferInsert) => db.insert(scanEvents).values(row).run(),
  /** events of these types on any of the trays (for the order history) */
  eventsOfTypes: (db: Db, trayIds: string[], types: ('split' | 'merge')[]) =>
    trayIds.length
      ? db
          .select()
          .from(scanEvents)
          .where(and(inArray(scanEvents.trayId, trayIds), inArray(scanEvents.type, types)))
          .all()
      : [],
};
