import { and, asc, desc, eq, ne } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { moulds, orderMoulds } from '../db/schema/moulds';
import { orders } from '../db/schema/orders';
import { customers } from '../db/schema/customers';
import { trays, trayStates } from '../db/schema/trays';

export type MouldRow = typeof moulds.$inferSelect;

export const mouldsRepository = {
  byId: (db: Db, id: string) => db.select().from(moulds).where(eq(moulds.id, id)).get(),
  /** a stored mould of this design and side that is still in use */
  reusable: (db: Db, designKey: string, side: 'front' | 'back') =>
    db
      .select()
      .from(moulds)
      .where(and(eq(moulds.designKey, designKey), eq(moulds.side, side), ne(moulds.status, 'retired')))
      .orderBy(desc(moulds.createdAt))
      .get(),
  insert: (db: Db, row: typeof moulds.$inferInsert) => db.insert(moulds).values(row).run(),
  update: (db: Db, id: string, patch: Partial<typeof moulds.$inferInsert>) => db.update(moulds).set(patch).where(eq(moulds.id, id)).run(),
  link: (db: Db, orderId: string, mouldId: string) => db.insert(orderMoulds).values({ orderId, mouldId }).onConflictDoNothing().run(),

  library: (db: Db) =>
    db
      .select({ mould: moulds, orderNumber: orders.number, orderTitle: orders.title, customer: customers.name })
      .from(moulds)
      .leftJoin(orders, eq(orders.id, moulds.firstOrderId))
      .leftJoin(customers, eq(customers.id, orders.customerId))
      .orderBy(asc(moulds.number))
      .all(),

  /** every mould traveller with its state: the mould's own progress is its travellers' */
  travellers: (db: Db) =>
    db
      .select({ mouldId: trays.mouldId, orderId: trays.orderId, releasedAt: trays.releasedAt, phase: trayStates.phase, stationKind: trayStates.stationKind })
      .from(trays)
      .innerJoin(trayStates, eq(trayStates.trayId, trays.id))
      .where(eq(trays.kind, 'mould'))
      .all(),

  /** the order's mould travellers with their state */
  orderTravellers: (db: Db, orderId: string) =>
    db
      .select({ tray: trays, phase: trayStates.phase })
      .from(trays)
      .leftJoin(trayStates, eq(trayStates.trayId, trays.id))
      .where(and(eq(trays.orderId, orderId), eq(trays.kind, 'mould')))
      .all(),
};

/**
 * Whether an order's trays may start striking or casting: every mould traveller of the order
 * has finished (engraved where new, and checked). An order without mould travellers (entered
 * before the product was used) counts as ready.
 */
export function orderMouldsReady(db: Db, orderId: string): boolean {
  return mouldsRepository.orderTravellers(db, orderId).every((t) => t.phase === 'done');
}
