import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

// The derived step_runs table and its cursor. Raw prepared statements: the full rebuild reads
// a year of events (a million rows) and must stream them rather than build objects per row.

export interface EventRow {
  rowid: number;
  trayId: string;
  type: string;
  stepSeq: number | null;
  stationKind: string | null;
  stationId: string | null;
  occurredAt: number;
  qtyIn: number | null;
  goodQty: number | null;
  scrapQty: number | null;
  reworkQty: number | null;
  scrapReason: string | null;
}

export interface TrayInfo {
  id: string;
  orderId: string;
  kind: 'tray' | 'mould';
  quantity: number;
  releasedAt: number;
}

export interface StepRunInsert {
  trayId: string;
  orderId: string;
  travellerKind: 'tray' | 'mould';
  stepSeq: number;
  stationKind: string;
  stationId: string | null;
  readyAt: number;
  startedAt: number | null;
  finishedAt: number;
  queueMinutes: number | null;
  processMinutes: number | null;
  cureMinutes: number | null;
  qtyIn: number;
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
  scrapReason: string | null;
  implicit: boolean;
}

export interface TrayFlowInsert {
  trayId: string;
  orderId: string;
  releasedAt: number;
  startedAt: number | null;
  inspectedAt: number | null;
  packedAt: number | null;
  shippedAt: number | null;
  shippedQty: number | null;
  lastFinishAt: number | null;
  processMinutes: number;
  cureMinutes: number;
}

const EVENT_COLUMNS = `rowid, tray_id as trayId, type, step_seq as stepSeq, station_kind as stationKind, station_id as stationId,
  occurred_at as occurredAt, qty_in as qtyIn, good_qty as goodQty, scrap_qty as scrapQty, rework_qty as reworkQty, scrap_reason as scrapReason`;

const client = sqlClient;

export const reportFactsRepository = {
  cursor(db: Db, name: string): number {
    const row = client(db).prepare('select position from report_cursors where name = ?').get(name) as { position: number } | undefined;
    return row?.position ?? 0;
  },
  setCursor(db: Db, name: string, position: number, at: number) {
    client(db)
      .prepare('insert into report_cursors (name, position, updated_at) values (?, ?, ?) on conflict(name) do update set position = excluded.position, updated_at = excluded.updated_at')
      .run(name, position, at);
  },
  maxEventRowid(db: Db): number {
    return ((client(db).prepare('select max(rowid) as m from scan_events').get() as { m: number | null }).m ?? 0) as number;
  },
  traysWithEventsAfter(db: Db, rowid: number, limit: number): string[] {
    return (client(db).prepare('select distinct tray_id as t from scan_events where rowid > ? limit ?').all(rowid, limit) as { t: string }[]).map((r) => r.t);
  },
  trays(db: Db, ids?: string[]): TrayInfo[] {
    const sql = 'select id, order_id as orderId, kind, quantity, released_at as releasedAt from trays';
    if (!ids) return client(db).prepare(sql).all() as TrayInfo[];
    const out: TrayInfo[] = [];
    const stmt = client(db).prepare(`${sql} where id = ?`);
    for (const id of ids) {
      const r = stmt.get(id) as TrayInfo | undefined;
      if (r) out.push(r);
    }
    return out;
  },
  /** cure minutes of every cure step: key order|kind|seq */
  cureSteps(db: Db, orderIds?: string[]): Map<string, number> {
    const m = new Map<string, number>();
    const sql = 'select order_id as o, traveller_kind as k, seq as s, cure_minutes as c from order_steps where cure_minutes > 0';
    const rows = (
      orderIds
        ? orderIds.flatMap((id) => client(db).prepare(`${sql} and order_id = ?`).all(id))
        : client(db).prepare(sql).all()
    ) as { o: string; k: string; s: number; c: number }[];
    for (const r of rows) m.set(`${r.o}|${r.k}|${r.s}`, r.c);
    return m;
  },
  eventsOfTray(db: Db, trayId: string): EventRow[] {
    return client(db).prepare(`select ${EVENT_COLUMNS} from scan_events where tray_id = ? order by occurred_at, rowid`).all(trayId) as EventRow[];
  },
  /** every tray id that has events, in order */
  trayIdsWithEvents(db: Db): string[] {
    return (client(db).prepare('select distinct tray_id as t from scan_events order by tray_id').raw(true).all() as [string][]).map((r) => r[0]);
  },
  /** the events of a range of trays (by id), grouped by tray in time order */
  eventsOfTrayRange(db: Db, firstId: string, lastId: string, upTo: number): EventRow[] {
    return client(db)
      .prepare(`select ${EVENT_COLUMNS} from scan_events where tray_id >= ? and tray_id <= ? and rowid <= ? order by tray_id, occurred_at, rowid`)
      .all(firstId, lastId, upTo) as EventRow[];
  },
  deleteRunsOfTray(db: Db, trayId: string) {
    client(db).prepare('delete from step_runs where tray_id = ?').run(trayId);
    client(db).prepare('delete from tray_flows where tray_id = ?').run(trayId);
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
    const stmt = client(db).prepare(`insert or replace into tray_flows (tray_id, order_id, released_at, started_at, inspected_at, packed_at, shipped_at, shipped_qty,
      last_finish_at, process_minutes, cure_minutes) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`);
    return (f) =>
      stmt.run(f.trayId, f.orderId, f.releasedAt, f.startedAt, f.inspectedAt, f.packedAt, f.shippedAt, f.shippedQty, f.lastFinishAt, f.processMinutes, f.cureMinutes);
  },
  inserter(db: Db): (r: StepRunInsert) => void {
    const stmt = client(db).prepare(`insert into step_runs (tray_id, order_id, traveller_kind, step_seq, station_kind, station_id, ready_at, started_at,
      finished_at, queue_minutes, process_minutes, cure_minutes, qty_in, good_qty, scrap_qty, rework_qty, scrap_reason, implicit)
      values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`);
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
      );
  },
  transaction<T>(db: Db, fn: () => T): T {
    return client(db).transaction(fn)();
  },
};
