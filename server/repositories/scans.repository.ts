import { and, asc, desc, eq, gte, inArray, isNull, or, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { scanEvents, scanRejections, overrides, attachments } from '../db/schema/scans';
import { trays, trayStates } from '../db/schema/trays';
import { orders, orderSteps, proofs } from '../db/schema/orders';
import { moulds, orderMoulds } from '../db/schema/moulds';
import { stations } from '../db/schema/stations';
import { reasonCodes } from '../db/schema/reference-data';
import { users, sessions } from '../db/schema/users';
import { customers } from '../db/schema/customers';

export type TrayRow = typeof trays.$inferSelect;
export type TrayStateRow = typeof trayStates.$inferSelect;
export type OrderStepRow = typeof orderSteps.$inferSelect;
export type OverrideRow = typeof overrides.$inferSelect;
export type RejectionRow = typeof scanRejections.$inferSelect;
export type ScanEventInsert = typeof scanEvents.$inferInsert;
export type RejectionInsert = typeof scanRejections.$inferInsert;

/** SQLite allows 32,766 bound values per statement; keep well below when inserting many rows. */
const INSERT_CHUNK = 50;

function chunks<T>(rows: T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < rows.length; i += size) out.push(rows.slice(i, i + size));
  return out;
}

export const scansRepository = {
  // --- reads for a batch ---------------------------------------------------------------
  acceptedIds: (db: Db, ids: string[]) =>
    ids.length ? db.select({ id: scanEvents.id }).from(scanEvents).where(inArray(scanEvents.id, ids)).all().map((r) => r.id) : [],

  rejectionsByEventIds: (db: Db, ids: string[]) =>
    ids.length ? db.select().from(scanRejections).where(inArray(scanRejections.eventId, ids)).all() : [],

  traysByNumbers: (db: Db, numbers: string[]) => (numbers.length ? db.select().from(trays).where(inArray(trays.number, numbers)).all() : []),

  trayById: (db: Db, id: string) => db.select().from(trays).where(eq(trays.id, id)).get(),

  statesByTrayIds: (db: Db, ids: string[]) => (ids.length ? db.select().from(trayStates).where(inArray(trayStates.trayId, ids)).all() : []),

  stepsByOrders: (db: Db, orderIds: string[]) =>
    orderIds.length
      ? db.select().from(orderSteps).where(inArray(orderSteps.orderId, orderIds)).orderBy(asc(orderSteps.orderId), asc(orderSteps.seq)).all()
      : [],

  /** Per order: how many of its moulds are not ready yet (0 when it needs none, or all are ready). */
  mouldsNotReady: (db: Db, orderIds: string[]) =>
    orderIds.length
      ? db
          // a mould is ready for this order when it is marked ready, or when the order's own mould
          // traveller for it has finished (engraved where new, and checked)
          .select({
            orderId: orderMoulds.orderId,
            notReady: sql<number>`sum(case when ${moulds.status} = 'ready' then 0 when exists (select 1 from ${trays} mt join ${trayStates} ms on ms.tray_id = mt.id where mt.order_id = ${orderMoulds.orderId} and mt.mould_id = ${moulds.id} and mt.kind = 'mould' and ms.phase = 'done') then 0 else 1 end)`,
          })
          .from(orderMoulds)
          .innerJoin(moulds, eq(moulds.id, orderMoulds.mouldId))
          .where(inArray(orderMoulds.orderId, orderIds))
          .groupBy(orderMoulds.orderId)
          .all()
      : [],

  stations: (db: Db) => db.select({ id: stations.id, code: stations.code, name: stations.name, kind: stations.kind, active: stations.active }).from(stations).all(),

  reasonCodes: (db: Db) => db.select({ code: reasonCodes.code }).from(reasonCodes).where(eq(reasonCodes.active, true)).all().map((r) => r.code),

  overridesByIds: (db: Db, ids: string[]) => (ids.length ? db.select().from(overrides).where(inArray(overrides.id, ids)).all() : []),

  usersByIds: (db: Db, ids: string[]) =>
    ids.length ? db.select({ id: users.id, name: users.name, role: users.role, active: users.active }).from(users).where(inArray(users.id, ids)).all() : [],

  /** Sessions a person opened on a device: the proof that scans queued offline on it were theirs. */
  deviceSessions: (db: Db, deviceId: string, userIds: string[]) =>
    userIds.length
      ? db
          .select({ userId: sessions.userId, createdAt: sessions.createdAt, expiresAt: sessions.expiresAt })
          .from(sessions)
          .where(and(eq(sessions.deviceId, deviceId), inArray(sessions.userId, userIds)))
          .all()
      : [],

  /** Open refusals of these trays that a late scan from another tablet may have made right. */
  openRetryable: (db: Db, trayIds: string[], codes: readonly string[]) =>
    trayIds.length
      ? db
          .select()
          .from(scanRejections)
          .where(and(inArray(scanRejections.trayId, trayIds), isNull(scanRejections.resolvedAt), inArray(scanRejections.code, [...codes])))
          .orderBy(asc(scanRejections.occurredAt), asc(scanRejections.receivedAt))
          .all()
      : [],

  // --- writes ---------------------------------------------------------------------------
  insertEvents(db: Db, rows: ScanEventInsert[]) {
    for (const part of chunks(rows, INSERT_CHUNK)) db.insert(scanEvents).values(part).run();
  },

  insertRejections(db: Db, rows: RejectionInsert[]) {
    for (const part of chunks(rows, INSERT_CHUNK)) db.insert(scanRejections).values(part).run();
  },

  upsertState(db: Db, row: typeof trayStates.$inferInsert) {
    const { trayId: _id, ...rest } = row;
    db.insert(trayStates).values(row).onConflictDoUpdate({ target: trayStates.trayId, set: rest }).run();
  },

  useOverride: (db: Db, id: string, eventId: string) => db.update(overrides).set({ usedEventId: eventId }).where(eq(overrides.id, id)).run(),

  insertOverride: (db: Db, row: typeof overrides.$inferInsert) => db.insert(overrides).values(row).run(),

  resolveRejection: (db: Db, id: string, patch: { resolvedAt: number; resolvedBy: string | null; resolution: string }) =>
    db.update(scanRejections).set(patch).where(eq(scanRejections.id, id)).run(),

  updateRejection: (db: Db, id: string, patch: Partial<RejectionInsert>) => db.update(scanRejections).set(patch).where(eq(scanRejections.id, id)).run(),

  rejectionById: (db: Db, id: string) => db.select().from(scanRejections).where(eq(scanRejections.id, id)).get(),

  markOrderInProduction: (db: Db, orderIds: string[], at: number) =>
    orderIds.length
      ? db
          .update(orders)
          .set({ status: 'in_production', updatedAt: at })
          .where(and(inArray(orders.id, orderIds), eq(orders.status, 'released')))
          .run()
      : undefined,

  insertAttachment: (db: Db, row: typeof attachments.$inferInsert) => db.insert(attachments).values(row).run(),

  // --- screens --------------------------------------------------------------------------
  /** The travellers a station's tablet needs: waiting for its kind, in process or curing there, or curing before it. */
  stationQueue(db: Db, stationId: string, kind: string, limit = 300) {
    return db
      .select({ state: trayStates, tray: trays })
      .from(trayStates)
      .innerJoin(trays, eq(trays.id, trayStates.trayId))
      .where(
        or(
          and(eq(trayStates.phase, 'waiting'), eq(trayStates.stationKind, kind)),
          and(inArray(trayStates.phase, ['in_process', 'curing']), eq(trayStates.stationId, stationId)),
          // curing elsewhere, with this station's kind next: shown with its countdown
          and(
            eq(trayStates.phase, 'curing'),
            sql`exists (select 1 from ${orderSteps} s where s.order_id = ${trays.orderId} and s.traveller_kind = ${trays.kind} and s.seq = ${trayStates.stepSeq} + 1 and s.station_kind = ${kind})`,
          ),
        ),
      )
      .orderBy(asc(sql`coalesce(${trayStates.cureReadyAt}, ${trayStates.waitingSince}, ${trayStates.startedAt})`))
      .limit(limit)
      .all();
  },

  ordersByIds: (db: Db, ids: string[]) =>
    ids.length
      ? db
          .select({
            id: orders.id,
            number: orders.number,
            title: orders.title,
            customer: customers.name,
            process: orders.process,
            material: orders.material,
            sizeMm: orders.sizeMm,
            colours: orders.colours,
            plating: orders.plating,
            backingType: orders.backingType,
            backingCount: orders.backingCount,
            packaging: orders.packaging,
            dueDate: orders.dueDate,
            notes: orders.notes,
          })
          .from(orders)
          .innerJoin(customers, eq(customers.id, orders.customerId))
          .where(inArray(orders.id, ids))
          .all()
      : [],

  /** Newest approved proof per order whose file is a picture (the artwork thumbnail). */
  artworkProofs: (db: Db, orderIds: string[]) =>
    orderIds.length
      ? db
          .select({ orderId: proofs.orderId, revision: proofs.revision, fileHash: proofs.fileHash, mime: proofs.mime })
          .from(proofs)
          .where(and(inArray(proofs.orderId, orderIds), sql`${proofs.approvedAt} is not null`, inArray(proofs.mime, ['image/png', 'image/jpeg'])))
          .orderBy(desc(proofs.revision))
          .all()
      : [],

  events: (db: Db, trayId: string) => db.select().from(scanEvents).where(eq(scanEvents.trayId, trayId)).orderBy(asc(scanEvents.occurredAt)).all(),

  /** Refused scans for the supervisors' list, newest first. */
  rejections(db: Db, filter: { open?: boolean; deviceId?: string; since?: number; limit: number }) {
    const where = [
      filter.open === true ? isNull(scanRejections.resolvedAt) : undefined,
      filter.open === false ? sql`${scanRejections.resolvedAt} is not null` : undefined,
      filter.deviceId ? eq(scanRejections.deviceId, filter.deviceId) : undefined,
      filter.since ? gte(scanRejections.receivedAt, filter.since) : undefined,
    ].filter(Boolean);
    return db
      .select({
        r: scanRejections,
        trayNumber: trays.number,
        stationName: stations.name,
        stationKind: stations.kind,
        userName: users.name,
      })
      .from(scanRejections)
      .leftJoin(trays, eq(trays.id, scanRejections.trayId))
      .leftJoin(stations, eq(stations.id, scanRejections.stationId))
      .leftJoin(users, eq(users.id, scanRejections.userId))
      .where(where.length ? and(...where) : undefined)
      .orderBy(desc(scanRejections.receivedAt))
      .limit(filter.limit)
      .all();
  },

  countOpenRejections: (db: Db) =>
    db.select({ n: sql<number>`count(*)` }).from(scanRejections).where(isNull(scanRejections.resolvedAt)).get()?.n ?? 0,

  /** For tests and the bench: event rows of an id range. */
  countEvents: (db: Db, sinceReceived = 0) =>
    db.select({ n: sql<number>`count(*)` }).from(scanEvents).where(gte(scanEvents.receivedAt, sinceReceived)).get()?.n ?? 0,

  attachmentsOf: (db: Db, trayId: string) => db.select().from(attachments).where(eq(attachments.trayId, trayId)).all(),

  stationById: (db: Db, id: string) => db.select().from(stations).where(eq(stations.id, id)).get(),
};
