import { and, asc, desc, eq, inArray, isNull, max, ne, or, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { customers } from '../db/schema/customers';
import { orders, orderSteps, payments, proofs } from '../db/schema/orders';
import { trays, trayStates } from '../db/schema/trays';
import { scanEvents } from '../db/schema/scans';
import { cartons, shipments } from '../db/schema/shipping';
import { auditLog, settings } from '../db/schema/reference-data';
import { users } from '../db/schema/users';
import type { Role } from '@shared/domain/vocabulary';
import { DEFAULT_TIME_ZONE } from '@shared/domain/time-zone';

/** SQLite caps the variables in one statement; long id lists are read in slices. */
function inChunks<T>(ids: string[], read: (slice: string[]) => T[], size = 5000): T[] {
  if (ids.length === 0) return [];
  if (ids.length <= size) return read(ids);
  const out: T[] = [];
  for (let i = 0; i < ids.length; i += size) out.push(...read(ids.slice(i, i + size)));
  return out;
}

export type ShipmentRow = typeof shipments.$inferSelect;
export type CartonRow = typeof cartons.$inferSelect;

const orderColumns = {
  id: orders.id,
  number: orders.number,
  title: orders.title,
  quantity: orders.quantity,
  overrunPct: orders.overrunPct,
  status: orders.status,
  dueDate: orders.dueDate,
  releasedAt: orders.releasedAt,
  packedAt: orders.packedAt,
  shippedAt: orders.shippedAt,
  createdAt: orders.createdAt,
  salesOwnerId: orders.salesOwnerId,
  customerId: customers.id,
  customer: customers.name,
  contactName: customers.contactName,
  contactEmail: customers.contactEmail,
};
export type ShippingOrder = {
  id: string;
  number: string;
  title: string;
  quantity: number;
  overrunPct: number;
  status: string;
  dueDate: string;
  releasedAt: number | null;
  packedAt: number | null;
  shippedAt: number | null;
  createdAt: number;
  salesOwnerId: string | null;
  customerId: string;
  customer: string;
  contactName: string | null;
  contactEmail: string | null;
};

export const shippingRepository = {
  order: (db: Db, id: string): ShippingOrder | undefined =>
    db.select(orderColumns).from(orders).innerJoin(customers, eq(customers.id, orders.customerId)).where(eq(orders.id, id)).get(),

  /** orders whose number, customer or title contains the text; newest first */
  search: (db: Db, q: string | undefined, limit: number): ShippingOrder[] => {
    const base = db.select(orderColumns).from(orders).innerJoin(customers, eq(customers.id, orders.customerId));
    const text = q?.trim();
    if (!text) return base.orderBy(desc(orders.createdAt)).limit(limit).all();
    const pattern = `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    const esc = sql`'\\'`;
    return (
      base
        .where(
          or(
            sql`${orders.number} like ${pattern} escape ${esc}`,
            sql`${customers.name} like ${pattern} escape ${esc}`,
            sql`${orders.title} like ${pattern} escape ${esc}`,
          ),
        )
        // an exact order number first, then the newest
        .orderBy(sql`${orders.number} = ${text} desc`, desc(orders.createdAt))
        .limit(limit)
        .all()
    );
  },

  /** open orders (released, not shipped or cancelled), for the late-risk digest */
  openOrders: (db: Db): ShippingOrder[] =>
    db
      .select(orderColumns)
      .from(orders)
      .innerJoin(customers, eq(customers.id, orders.customerId))
      .where(inArray(orders.status, ['released', 'in_production', 'packed', 'on_hold']))
      .orderBy(asc(orders.dueDate))
      .all(),

  /** travellers of the orders with their current state */
  travellers: (db: Db, allOrderIds: string[]) =>
    inChunks(allOrderIds, (orderIds) =>
      db
        .select({
          id: trays.id,
          orderId: trays.orderId,
          number: trays.number,
          kind: trays.kind,
          quantity: trays.quantity,
          writtenOffAt: trays.writtenOffAt,
          phase: trayStates.phase,
          stepSeq: trayStates.stepSeq,
          stateQuantity: trayStates.quantity,
          onHold: trayStates.onHold,
          startedAt: trayStates.startedAt,
          waitingSince: trayStates.waitingSince,
          cureReadyAt: trayStates.cureReadyAt,
          lastEventAt: trayStates.lastEventAt,
        })
        .from(trays)
        .leftJoin(trayStates, eq(trayStates.trayId, trays.id))
        .where(inArray(trays.orderId, orderIds))
        .orderBy(asc(trays.number))
        .all(),
    ),

  steps: (db: Db, allOrderIds: string[]) =>
    inChunks(allOrderIds, (orderIds) =>
      db
        .select({
          orderId: orderSteps.orderId,
          travellerKind: orderSteps.travellerKind,
          seq: orderSteps.seq,
          name: orderSteps.name,
          stationKind: orderSteps.stationKind,
          trayMinutes: orderSteps.trayMinutes,
          pieceMinutes: orderSteps.pieceMinutes,
          cureMinutes: orderSteps.cureMinutes,
        })
        .from(orderSteps)
        .where(inArray(orderSteps.orderId, orderIds))
        .orderBy(asc(orderSteps.orderId), asc(orderSteps.travellerKind), asc(orderSteps.seq))
        .all(),
    ),

  /** when each tray's dispatch step last finished */
  dispatchFinishes: (db: Db, allTrayIds: string[]) =>
    inChunks(allTrayIds, (trayIds) =>
      db
        .select({ trayId: scanEvents.trayId, at: max(scanEvents.occurredAt) })
        .from(scanEvents)
        .where(and(inArray(scanEvents.trayId, trayIds), eq(scanEvents.type, 'finish'), eq(scanEvents.stationKind, 'dispatch')))
        .groupBy(scanEvents.trayId)
        .all(),
    ),

  /** holds and releases of the order's travellers, for the history */
  holdEvents: (db: Db, trayIds: string[]) =>
    trayIds.length
      ? db
          .select({
            trayId: scanEvents.trayId,
            type: scanEvents.type,
            at: scanEvents.occurredAt,
            note: scanEvents.note,
            scrapReason: scanEvents.scrapReason,
            by: users.name,
          })
          .from(scanEvents)
          .leftJoin(users, eq(users.id, scanEvents.userId))
          .where(and(inArray(scanEvents.trayId, trayIds), inArray(scanEvents.type, ['hold', 'release', 'write_off'])))
          .all()
      : [],

  /** first start of any of the order's travellers */
  firstStart: (db: Db, trayIds: string[]) =>
    trayIds.length
      ? (db
          .select({ at: sql<number | null>`min(${scanEvents.occurredAt})` })
          .from(scanEvents)
          .where(and(inArray(scanEvents.trayId, trayIds), eq(scanEvents.type, 'start')))
          .get()?.at ?? null)
      : null,

  shipments: (db: Db, allOrderIds: string[]) =>
    inChunks(allOrderIds, (orderIds) => db.select().from(shipments).where(inArray(shipments.orderId, orderIds)).orderBy(asc(shipments.number)).all()),
  shipmentById: (db: Db, id: string) => db.select().from(shipments).where(eq(shipments.id, id)).get(),
  cartons: (db: Db, orderId: string) => db.select().from(cartons).where(eq(cartons.orderId, orderId)).orderBy(asc(cartons.createdAt)).all(),
  nextShipmentNumber: (db: Db, orderId: string) =>
    (db
      .select({ n: max(shipments.number) })
      .from(shipments)
      .where(eq(shipments.orderId, orderId))
      .get()?.n ?? 0) + 1,
  /** other orders' numbers that already carry this tracking number */
  ordersWithTracking: (db: Db, trackingNumber: string, exceptOrderId: string) =>
    db
      .selectDistinct({ number: orders.number })
      .from(shipments)
      .innerJoin(orders, eq(orders.id, shipments.orderId))
      .where(and(eq(shipments.trackingNumber, trackingNumber), ne(shipments.orderId, exceptOrderId)))
      .all()
      .map((r) => r.number),
  sameOrderTracking: (db: Db, trackingNumber: string, orderId: string) =>
    db
      .select({ id: shipments.id })
      .from(shipments)
      .where(and(eq(shipments.trackingNumber, trackingNumber), eq(shipments.orderId, orderId)))
      .get(),
  /** for each tracking number, the orders that carry it */
  trackingOwners: (db: Db, trackingNumbers: string[]) =>
    trackingNumbers.length
      ? db
          .selectDistinct({ trackingNumber: shipments.trackingNumber, orderId: shipments.orderId, number: orders.number })
          .from(shipments)
          .innerJoin(orders, eq(orders.id, shipments.orderId))
          .where(inArray(shipments.trackingNumber, trackingNumbers))
          .all()
      : [],
  insertShipment: (db: Db, row: typeof shipments.$inferInsert) => db.insert(shipments).values(row).run(),
  insertCarton: (db: Db, row: typeof cartons.$inferInsert) => db.insert(cartons).values(row).run(),
  /** put packed cartons into a shipment; only those still unshipped */
  assignCartons: (db: Db, ids: string[], shipmentId: string) =>
    ids.length
      ? db
          .update(cartons)
          .set({ shipmentId })
          .where(and(inArray(cartons.id, ids), isNull(cartons.shipmentId)))
          .run().changes
      : 0,
  deleteUnshippedCarton: (db: Db, orderId: string, id: string) =>
    db
      .delete(cartons)
      .where(and(eq(cartons.id, id), eq(cartons.orderId, orderId), isNull(cartons.shipmentId)))
      .run().changes,

  setOrderStatus: (db: Db, id: string, from: readonly string[], patch: Partial<typeof orders.$inferInsert>) =>
    db
      .update(orders)
      .set(patch)
      .where(and(eq(orders.id, id), inArray(orders.status, [...from])))
      .run().changes > 0,
  setSalesOwner: (db: Db, id: string, salesOwnerId: string | null, at: number) =>
    db.update(orders).set({ salesOwnerId, updatedAt: at }).where(eq(orders.id, id)).run(),
  setCustomerContact: (db: Db, customerId: string, contact: { contactName?: string | null; contactEmail: string }, at: number) =>
    db
      .update(customers)
      .set({ ...contact, updatedAt: at })
      .where(eq(customers.id, customerId))
      .run(),

  proofs: (db: Db, orderId: string) => db.select().from(proofs).where(eq(proofs.orderId, orderId)).orderBy(asc(proofs.revision)).all(),
  proof: (db: Db, orderId: string, revision: number) =>
    db
      .select()
      .from(proofs)
      .where(and(eq(proofs.orderId, orderId), eq(proofs.revision, revision)))
      .get(),
  payments: (db: Db, orderId: string) =>
    db
      .select({ recordedAt: payments.recordedAt, isException: payments.isException, by: users.name })
      .from(payments)
      .leftJoin(users, eq(users.id, payments.recordedBy))
      .where(eq(payments.orderId, orderId))
      .all(),
  auditFor: (db: Db, entity: string, entityId: string) =>
    db
      .select({ at: auditLog.at, action: auditLog.action, detail: auditLog.detail, by: users.name })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.userId))
      .where(and(eq(auditLog.entity, entity), eq(auditLog.entityId, entityId)))
      .orderBy(asc(auditLog.at))
      .all(),

  user: (db: Db, id: string) =>
    db.select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active }).from(users).where(eq(users.id, id)).get(),
  usersByName: (db: Db, ids: string[]) => (ids.length ? db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids)).all() : []),
  activeUsersWithRoles: (db: Db, roles: Role[]) =>
    db
      .select({ id: users.id, name: users.name, email: users.email, role: users.role })
      .from(users)
      .where(and(inArray(users.role, roles), eq(users.active, true)))
      .all(),

  factory: (db: Db) => {
    const row = db.select().from(settings).where(eq(settings.key, 'factory')).get();
    const v = (row?.value ?? {}) as { name?: string; timeZone?: string };
    return { name: v.name ?? 'Trayce factory', timeZone: v.timeZone ?? DEFAULT_TIME_ZONE };
  },
};
