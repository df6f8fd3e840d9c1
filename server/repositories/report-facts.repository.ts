import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';
import type { ReplayEvent, ReplayTraveller, StepRun, TrayFlow } from '@shared/domain/traveller';
import type { RoutingStep, StationKind } from '@shared/domain/vocabulary';

/** A step run as stored, with its queue and process time in working minutes of its station's calendar. */
export interface StepRunInsert extends StepRun {
  queueWorkingMinutes: number | null;
  processWorkingMinutes: number | null;
}

export type TrayFlowInsert = TrayFlow;

// The derived step_runs and tray_flows tables and their cursor. Raw prepared statements: the full
// rebuild reads a year of events (a million rows), a page of orders at a time.

const EVENT_COLUMNS = `e.tray_id as trayId, e.type, e.step_seq as stepSeq, e.station_kind as stationKind, e.station_id as stationId,
  e.occurred_at as occurredAt, e.qty_in as qtyIn, e.good_qty as goodQty, e.scrap_qty as scrapQty, e.rework_qty as reworkQty,
  e.scrap_reason as scrapReason, e.note, ov.kind as overrideKind, u.role as actorRole`;
const EVENT_FROM = `scan_events e join trays t on t.id = e.tray_id left join overrides ov on ov.id = e.override_id left join users u on u.id = e.user_id`;

const client = sqlClient;

export const reportFactsRepository = {
  cursor(db: Db, name: string): number {
    const row = client(db).prepare('select position from report_cursors where name = ?').get(name) as { position: number } | undefined;
    return row?.position ?? 0;
  },
  setCursor(db: Db, name: string, position: number, at: number) {
    client(db)
      .prepare(
        'insert into report_cursors (name, position, updated_at) values (?, ?, ?) on conflict(name) do update set position = excluded.position, updated_at = excluded.updated_at',
      )
      .run(name, position, at);
  },
  maxEventRowid(db: Db): number {
    return ((client(db).prepare('select max(rowid) as m from scan_events').get() as { m: number | null }).m ?? 0) as number;
  },
  traysWithEventsAfter(db: Db, rowid: number, limit: number): string[] {
    return (client(db).prepare('select distinct tray_id as t from scan_events where rowid > ? limit ?').all(rowid, limit) as { t: string }[]).map((r) => r.t);
  },
  /** orders with events after a rowid (at most `limit`) */
  ordersWithEventsAfter(db: Db, rowid: number, limit: number): string[] {
    return (
      client(db).prepare('select distinct t.order_id as o from scan_events e join trays t on t.id = e.tray_id where e.rowid > ? limit ?').all(rowid, limit) as {
        o: string;
      }[]
    ).map((r) => r.o);
  },
  /** every order that has travellers with events, in id order */
  ordersWithEvents(db: Db): string[] {
    return (
      client(db)
        .prepare('select distinct t.order_id from trays t where exists (select 1 from scan_events e where e.tray_id = t.id) order by t.order_id')
        .raw(true)
        .all() as [string][]
    ).map((r) => r[0]);
  },
  /** the travellers of some orders with their routings, as the replay takes them */
  travellers(db: Db, orderIds: readonly string[]): ReplayTraveller[] {
    const c = client(db);
    const trayStmt = c.prepare(
      `select id, order_id as orderId, kind, quantity, released_at as releasedAt, parent_tray_id as parentId, merged_into_id as mergedIntoId from trays where order_id = ?`,
    );
    const stepStmt = c.prepare(
      `select traveller_kind as k, seq, name, station_kind as stationKind, tray_minutes as trayMinutes, piece_minutes as pieceMinutes, cure_minutes as cureMinutes, colour
       from order_steps where order_id = ? order by seq`,
    );
    const out: ReplayTraveller[] = [];
    for (const orderId of orderIds) {
      const steps = stepStmt.all(orderId) as (RoutingStep & { k: string; stationKind: StationKind })[];
      const routing = (kind: string) => steps.filter((s) => s.k === kind).map(({ k: _k, ...s }) => s);
      const byKind = { tray: routing('tray'), mould: routing('mould') };
      for (const t of trayStmt.all(orderId) as Omit<ReplayTraveller, 'routing'>[]) out.push({ ...t, routing: byKind[t.kind] });
    }
    return out;
  },
  /** the events of some orders' travellers up to a rowid, in time order (then in the order stored) */
  eventsOfOrders(db: Db, orderIds: readonly string[], upTo: number): ReplayEvent[] {
    if (orderIds.length === 0) return [];
    return client(db)
      .prepare(
        `select ${EVENT_COLUMNS} from ${EVENT_FROM} where t.order_id in (${orderIds.map(() => '?').join(', ')}) and e.rowid <= ? order by e.occurred_at, e.rowid`,
      )
      .all(...orderIds, upTo) as ReplayEvent[];
  },
  deleteRunsOfOrder(db: Db, orderId: string) {
    client(db).prepare('delete from step_runs where order_id = ?').run(orderId);
    client(db).prepare('delete from tray_flows where order_id = ?').run(orderId);
  },
  /**
   * Runs `fill` with the derived tables' indexes dropped and builds them again afterwards from
   * their own stored definitions: one sort per index instead of a million scattered inserts.
   */
  withoutIndexes(db: Db, fill: () => void) {
    const c = client(db);
    const indexes = c
      .prepare(`select name, sql from sqlite_master where type = 'index' and tbl_name in ('step_runs', 'tray_flows') and sql is not null`)
      .all() as { name: string; sql: string }[];
    for (const i of indexes) c.exec(`drop index "${i.name.replace(/"/g, '""')}"`);
    fill();
    for (const i of indexes) c.exec(i.sql);
  },
  deleteAllRuns(db: Db) {
    client(db).prepare('delete from step_runs').run();
    client(db).prepare('delete from tray_flows').run();
  },
  flowInserter(db: Db): (f: TrayFlowInsert) => void {
    const stmt = client(db)
      .prepare(`insert or replace into tray_flows (tray_id, order_id, released_at, started_at, inspected_at, packed_at, shipped_at, shipped_qty,
      last_finish_at, process_minutes, cure_minutes, process_working_minutes, cure_working_minutes) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`);
    return (f) =>
      stmt.run(
        f.trayId,
        f.orderId,
        f.releasedAt,
        f.startedAt,
        f.inspectedAt,
        f.packedAt,
        f.shippedAt,
        f.shippedQty,
        f.lastFinishAt,
        f.processMinutes,
        f.cureMinutes,
        f.processWorkingMinutes,
        f.cureWorkingMinutes,
      );
  },
  inserter(db: Db): (r: StepRunInsert) => void {
    const stmt = client(db).prepare(`insert into step_runs (tray_id, order_id, traveller_kind, step_seq, station_kind, station_id, ready_at, started_at,
      finished_at, queue_minutes, process_minutes, cure_minutes, qty_in, good_qty, scrap_qty, rework_qty, scrap_reason, implicit,
      pass, queue_working_minutes, process_working_minutes)
      values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`);
    return (r) =>
      stmt.run(
        r.trayId,
        r.orderId,
        r.travellerKind,
        r.stepSeq,
        r.stationKind,
        r.stationId,
        r.readyAt,
        r.startedAt,
        r.finishedAt,
        r.queueMinutes,
        r.processMinutes,
        r.cureMinutes,
        r.qtyIn,
        r.goodQty,
        r.scrapQty,
        r.reworkQty,
        r.scrapReason,
        r.implicit ? 1 : 0,
        r.pass,
        r.queueWorkingMinutes,
        r.processWorkingMinutes,
      );
  },
  transaction<T>(db: Db, fn: () => T): T {
    return client(db).transaction(fn)();
  },
};
