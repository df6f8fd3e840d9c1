import { and, asc, desc, eq, gte, inArray, isNull, or, sql } from 'drizzle-orm';
import type { DbLike as Db } from '../db/client';
import { scanRejections, overrides, attachments } from '../db/schema/scans';
import { trays, trayStates } from '../db/schema/trays';
import { orders, orderSteps, proofs } from '../db/schema/orders';
import { stations } from '../db/schema/stations';
import { users, sessions } from '../db/schema/users';
import { customers } from '../db/schema/customers';
import { sqlClient } from './sql-client';
import type Database from 'better-sqlite3';

/** The traveller fields a scan needs. */
export type TrayRow = Pick<typeof trays.$inferSelect, 'id' | 'number' | 'kind' | 'orderId' | 'revision' | 'quantity' | 'releasedAt'>;
export type { TrayStateRow, ScanEventInsert } from './tray-states.repository';
export type OrderStepRow = typeof orderSteps.$inferSelect;
export type OverrideRow = typeof overrides.$inferSelect;
export type RejectionRow = typeof scanRejections.$inferSelect;
export type RejectionInsert = typeof scanRejections.$inferInsert;

// The scan path runs for every scan a tablet sends, so its statements are prepared once per
// connection and reused (tray states and event rows: tray-states.repository.ts) (raw better-sqlite3: building each query through the ORM cost more than
// the write itself). Lists go in as one JSON array parameter, read with json_each.
const TRAY_COLS = 'id, number, kind, order_id as orderId, revision, quantity, released_at as releasedAt';
const STEP_COLS = `id, order_id as orderId, traveller_kind as travellerKind, seq, name, station_kind as stationKind, tray_minutes as trayMinutes,
  piece_minutes as pieceMinutes, cure_minutes as cureMinutes, colour`;
const REJECTION_COLS = `id, event_id as eventId, tray_id as trayId, station_id as stationId, device_id as deviceId, user_id as userId, code, message,
  payload, occurred_at as occurredAt, received_at as receivedAt, resolved_at as resolvedAt, resolved_by as resolvedBy, resolution`;
const IN_LIST = '(select value from json_each(?))';

function prepareAll(c: Database.Database) {
  return {
    rejectionsByEventIds: c.prepare(`select ${REJECTION_COLS} from scan_rejections where event_id in ${IN_LIST}`),
    traysByNumbers: c.prepare(`select ${TRAY_COLS} from trays where number in ${IN_LIST}`),
    trayById: c.prepare(`select ${TRAY_COLS} from trays where id = ?`),
    stepsByOrders: c.prepare(`select ${STEP_COLS} from order_steps where order_id in ${IN_LIST} order by order_id, seq`),
    // a mould is ready for an order when it is marked ready, or when the order's own mould traveller
    // for it has finished (engraved where new, and checked)
    mouldsNotReady: c.prepare(`select om.order_id as orderId, sum(case when m.status = 'ready' then 0
        when exists (select 1 from trays mt join tray_states ms on ms.tray_id = mt.id
          where mt.order_id = om.order_id and mt.mould_id = m.id and mt.kind = 'mould' and ms.phase = 'done') then 0
        else 1 end) as notReady
      from order_moulds om join moulds m on m.id = om.mould_id where om.order_id in ${IN_LIST} group by om.order_id`),
    openRetryable: c.prepare(`select ${REJECTION_COLS} from scan_rejections
      where tray_id in ${IN_LIST} and resolved_at is null and code in (select value from json_each(?))
      order by occurred_at, received_at`),
    insertRejection:
      c.prepare(`insert into scan_rejections (id, event_id, tray_id, station_id, device_id, user_id, code, message, payload, occurred_at, received_at)
      values (@id, @eventId, @trayId, @stationId, @deviceId, @userId, @code, @message, @payload, @occurredAt, @receivedAt)`),
    markInProduction: c.prepare(`update orders set status = 'in_production', updated_at = ? where status = 'released' and id in ${IN_LIST}`),
    savepoint: c.prepare('savepoint scan_batch'),
    release: c.prepare('release savepoint scan_batch'),
    rollbackTo: c.prepare('rollback to savepoint scan_batch'),
    stations: c.prepare('select id, code, name, kind, active from stations'),
    reasonCodes: c.prepare('select code from reason_codes where active = 1').pluck(),
    reasonNames: c.prepare('select code, name from reason_codes'),
  };
}

const prepared = new WeakMap<Database.Database, ReturnType<typeof prepareAll>>();
function q(db: Db) {
  const c = sqlClient(db);
  let p = prepared.get(c);
  if (!p) {
    p = prepareAll(c);
    prepared.set(c, p);
  }
  return p;
}

/** Stations and reason codes change rarely (an admin's edit); a scan batch reads them from a 5-second cache. */
const REFERENCE_TTL_MS = 5000;
const reference = new WeakMap<Database.Database, { at: number; stations: StationRef[]; reasonCodes: string[]; reasonNames: Map<string, string> }>();
export interface StationRef {
  id: string;
  code: string;
  name: string;
  kind: string;
  active: boolean;
}
function referenceData(db: Db) {
  const c = sqlClient(db);
  const now = Date.now();
  let r = reference.get(c);
  if (!r || now - r.at > REFERENCE_TTL_MS) {
    const p = q(db);
    r = {
      at: now,
      stations: (p.stations.all() as (Omit<StationRef, 'active'> & { active: number })[]).map((s) => ({ ...s, active: !!s.active })),
      reasonCodes: p.reasonCodes.all() as string[],
      reasonNames: new Map((p.reasonNames.all() as { code: string; name: string }[]).map((x) => [x.code, x.name])),
    };
    reference.set(c, r);
  }
  return r;
}

const json = (xs: readonly string[]) => JSON.stringify(xs);

type RawRejection = Omit<RejectionRow, 'payload'> & { payload: string };
const toRejection = (r: RawRejection): RejectionRow => ({ ...r, payload: JSON.parse(r.payload) });

export const scansRepository = {
  // --- reads for a batch ---------------------------------------------------------------
  rejectionsByEventIds: (db: Db, ids: string[]): RejectionRow[] =>
    ids.length ? (q(db).rejectionsByEventIds.all(json(ids)) as RawRejection[]).map(toRejection) : [],

  traysByNumbers: (db: Db, numbers: string[]): TrayRow[] => (numbers.length ? (q(db).traysByNumbers.all(json(numbers)) as TrayRow[]) : []),

  trayById: (db: Db, id: string): TrayRow | undefined => q(db).trayById.get(id) as TrayRow | undefined,

  stepsByOrders: (db: Db, orderIds: string[]): OrderStepRow[] => (orderIds.length ? (q(db).stepsByOrders.all(json(orderIds)) as OrderStepRow[]) : []),

  /** Per order: how many of its moulds are not ready yet (none listed: it needs none, or all are ready). */
  mouldsNotReady: (db: Db, orderIds: string[]): { orderId: string; notReady: number }[] =>
    orderIds.length ? (q(db).mouldsNotReady.all(json(orderIds)) as { orderId: string; notReady: number }[]) : [],

  stations: (db: Db): StationRef[] => referenceData(db).stations,

  reasonCodes: (db: Db): string[] => referenceData(db).reasonCodes,

  /** reason code → English name, for the refusal texts supervisors read */
  reasonNames: (db: Db): Map<string, string> => referenceData(db).reasonNames,

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
  openRetryable: (db: Db, trayIds: string[], codes: readonly string[]): RejectionRow[] =>
    trayIds.length ? (q(db).openRetryable.all(json(trayIds), json(codes)) as RawRejection[]).map(toRejection) : [],

  /**
   * Runs `fn` in a savepoint of the open transaction: on a throw only its own writes are undone.
   * (Prepared once; the ORM's nested transaction builds and prepares its SQL on every call.)
   */
  inSavepoint<T>(db: Db, fn: () => T): { ok: T } | { error: unknown } {
    const p = q(db);
    p.savepoint.run();
    try {
      const ok = fn();
      p.release.run();
      return { ok };
    } catch (error) {
      p.rollbackTo.run();
      p.release.run();
      return { error };
    }
  },

  // --- writes ---------------------------------------------------------------------------
  insertRejections(db: Db, rows: RejectionInsert[]) {
    const stmt = q(db).insertRejection;
    for (const r of rows) {
      stmt.run({ trayId: null, stationId: null, deviceId: null, userId: null, occurredAt: null, ...r, payload: JSON.stringify(r.payload) });
    }
  },

  useOverride: (db: Db, id: string, eventId: string) => db.update(overrides).set({ usedEventId: eventId }).where(eq(overrides.id, id)).run(),

  insertOverride: (db: Db, row: typeof overrides.$inferInsert) => db.insert(overrides).values(row).run(),

  resolveRejection: (db: Db, id: string, patch: { resolvedAt: number; resolvedBy: string | null; resolution: string }) =>
    db.update(scanRejections).set(patch).where(eq(scanRejections.id, id)).run(),

  updateRejection: (db: Db, id: string, patch: Partial<RejectionInsert>) => db.update(scanRejections).set(patch).where(eq(scanRejections.id, id)).run(),

  rejectionById: (db: Db, id: string) => db.select().from(scanRejections).where(eq(scanRejections.id, id)).get(),

  markOrderInProduction: (db: Db, orderIds: string[], at: number) => {
    if (orderIds.length) q(db).markInProduction.run(at, json(orderIds));
  },

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
    db
      .select({ n: sql<number>`count(*)` })
      .from(scanRejections)
      .where(isNull(scanRejections.resolvedAt))
      .get()?.n ?? 0,

  attachmentsOf: (db: Db, trayId: string) => db.select().from(attachments).where(eq(attachments.trayId, trayId)).all(),

  stationById: (db: Db, id: string) => db.select().from(stations).where(eq(stations.id, id)).get(),
};
