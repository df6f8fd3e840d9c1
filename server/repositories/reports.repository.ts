import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

// Report queries: indexed aggregation over orders and the derived step_runs. Raw prepared
// statements returning plain rows keep a year of data (half a million step rows) fast.

export interface ReportFilter {
  from: number;
  to: number;
  process?: string;
  customerId?: string;
  stationId?: string;
}

const client = sqlClient;

function orderFilter(f: ReportFilter, alias = 'o'): { sql: string; args: unknown[] } {
  const parts: string[] = [];
  const args: unknown[] = [];
  if (f.process) {
    parts.push(`${alias}.process = ?`);
    args.push(f.process);
  }
  if (f.customerId) {
    parts.push(`${alias}.customer_id = ?`);
    args.push(f.customerId);
  }
  return { sql: parts.length ? ` and ${parts.join(' and ')}` : '', args };
}

export interface ShippedOrderRow {
  id: string;
  number: string;
  title: string;
  process: string;
  customer: string;
  releasedAt: number | null;
  shippedAt: number;
  dueDate: string;
}

export const reportsRepository = {
  shippedOrders(db: Db, f: ReportFilter): ShippedOrderRow[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select o.id, o.number, o.title, o.process, c.name as customer, o.released_at as releasedAt, o.shipped_at as shippedAt, o.due_date as dueDate
         from orders o join customers c on c.id = o.customer_id
         where o.shipped_at >= ? and o.shipped_at < ?${of.sql}
         order by o.shipped_at`,
      )
      .all(f.from, f.to, ...of.args) as ShippedOrderRow[];
  },

  /** [stationKind, queueMinutes, processMinutes] of steps finished in the window (raw arrays) */
  cycleRows(db: Db, f: ReportFilter): [string, number | null, number | null, number][] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    return client(db)
      .prepare(
        `select r.station_kind, r.queue_minutes, r.process_minutes, r.implicit from step_runs r${joinOrders}
         where r.finished_at >= ? and r.finished_at < ?${station}${of.sql}`,
      )
      .raw(true)
      .all(f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args) as [string, number | null, number | null, number][];
  },

  /** trays finished in the window with their summed process and cure minutes */
  finishedTrayFlow(db: Db, f: ReportFilter): { trayId: string; releasedAt: number; doneAt: number; process: number; cure: number }[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select t.id as trayId, t.released_at as releasedAt, s.last_event_at as doneAt,
           (select coalesce(sum(case when r.cure_minutes is null then r.process_minutes else 0 end), 0) from step_runs r where r.tray_id = t.id) as process,
           (select coalesce(sum(case when r.cure_minutes is not null then r.process_minutes else 0 end), 0) from step_runs r where r.tray_id = t.id) as cure
         from tray_states s join trays t on t.id = s.tray_id join orders o on o.id = t.order_id
         where s.phase = 'done' and t.kind = 'tray' and s.last_event_at >= ? and s.last_event_at < ?${of.sql}`,
      )
      .all(f.from, f.to, ...of.args) as { trayId: string; releasedAt: number; doneAt: number; process: number; cure: number }[];
  },

  /** trays in the window: released before its end and not gone before its start */
  flowTrays(db: Db, f: ReportFilter): { id: string; releasedAt: number; phase: string; lastEventAt: number | null; mergedIntoId: string | null }[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select t.id, t.released_at as releasedAt, s.phase, s.last_event_at as lastEventAt, t.merged_into_id as mergedIntoId
         from trays t join tray_states s on s.tray_id = t.id join orders o on o.id = t.order_id
         where t.kind = 'tray' and t.released_at < ?
           and not (s.phase in ('done', 'scrapped', 'merged') and s.last_event_at < ?)${of.sql}`,
      )
      .all(f.to, f.from, ...of.args) as { id: string; releasedAt: number; phase: string; lastEventAt: number | null; mergedIntoId: string | null }[];
  },

  /** milestone times per tray: first start, inspection, packing and dispatch finishes */
  milestones(db: Db, f: ReportFilter): { trayId: string; started: number | null; inspected: number | null; packed: number | null; shipped: number | null; shippedQty: number | null }[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select r.tray_id as trayId,
           min(r.started_at) as started,
           max(case when r.station_kind = 'inspect' then r.finished_at end) as inspected,
           max(case when r.station_kind = 'pack' then r.finished_at end) as packed,
           max(case when r.station_kind = 'dispatch' then r.finished_at end) as shipped,
           sum(case when r.station_kind = 'dispatch' then r.good_qty end) as shippedQty
         from step_runs r join trays t on t.id = r.tray_id join orders o on o.id = t.order_id
         where r.traveller_kind = 'tray' and t.released_at < ? and r.started_at < ?${of.sql}
         group by r.tray_id`,
      )
      .all(f.to, f.to, ...of.args) as { trayId: string; started: number | null; inspected: number | null; packed: number | null; shipped: number | null; shippedQty: number | null }[];
  },

  /** per station kind: pieces in, good, scrap, rework of tray steps finished in the window */
  stepYields(db: Db, f: ReportFilter): { stationKind: string; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    return client(db)
      .prepare(
        `select r.station_kind as stationKind, sum(r.qty_in) as inQty, sum(r.good_qty) as goodQty, sum(r.scrap_qty) as scrapQty, sum(r.rework_qty) as reworkQty
         from step_runs r${joinOrders}
         where r.traveller_kind = 'tray' and r.finished_at >= ? and r.finished_at < ?${station}${of.sql}
         group by r.station_kind`,
      )
      .all(f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args) as { stationKind: string; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[];
  },

  scrapByReason(db: Db, f: ReportFilter): { reason: string; name: string | null; qty: number }[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    return client(db)
      .prepare(
        `select coalesce(r.scrap_reason, 'unrecorded') as reason, rc.name as name, sum(r.scrap_qty) as qty
         from step_runs r${joinOrders} left join reason_codes rc on rc.code = r.scrap_reason
         where r.traveller_kind = 'tray' and r.scrap_qty > 0 and r.finished_at >= ? and r.finished_at < ?${station}${of.sql}
         group by coalesce(r.scrap_reason, 'unrecorded')`,
      )
      .all(f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args) as { reason: string; name: string | null; qty: number }[];
  },

  /** per shipped order and step: summed counts of its trays */
  orderStepCounts(db: Db, orderIds: string[]): { orderId: string; seq: number; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[] {
    if (!orderIds.length) return [];
    const stmt = client(db).prepare(
      `select order_id as orderId, step_seq as seq, sum(qty_in) as inQty, sum(good_qty) as goodQty, sum(scrap_qty) as scrapQty, sum(rework_qty) as reworkQty
       from step_runs where order_id = ? and traveller_kind = 'tray' group by step_seq`,
    );
    return orderIds.flatMap((id) => stmt.all(id) as { orderId: string; seq: number; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[]);
  },

  /** the latest queue times of one station kind (newest first), for projections */
  recentQueues(db: Db, stationKind: string, since: number, limit: number): { readyAt: number; startedAt: number; stationId: string | null }[] {
    return client(db)
      .prepare(
        `select ready_at as readyAt, started_at as startedAt, station_id as stationId from step_runs
         where station_kind = ? and finished_at >= ? and started_at is not null and traveller_kind = 'tray'
         order by finished_at desc limit ?`,
      )
      .all(stationKind, since, limit) as { readyAt: number; startedAt: number; stationId: string | null }[];
  },

  customers(db: Db): { id: string; name: string }[] {
    return client(db).prepare('select id, name from customers order by name').all() as { id: string; name: string }[];
  },
};
