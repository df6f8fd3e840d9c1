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

export interface CycleStatisticsRow {
  stationKind: string;
  n: number;
  mean: number;
  /** 0-based rank -> value */
  orderStatistics: Map<number, number>;
}

export interface FlowTrayRow {
  id: string;
  releasedAt: number;
  phase: string;
  lastEventAt: number | null;
  mergedIntoId: string | null;
  started: number | null;
  inspected: number | null;
  packed: number | null;
  shipped: number | null;
  shippedQty: number | null;
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

  /**
   * Per station kind: n and mean of queue or process minutes of steps finished in the window, and
   * the order statistics at the given 0-based ranks (SQLite sorts; only a few values come back).
   * A cure closed on its own counts as process time only for the cure kind itself.
   */
  cycleStatistics(db: Db, f: ReportFilter, measure: 'queue' | 'process', percentiles: readonly number[]): CycleStatisticsRow[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    const column = measure === 'queue' ? 'r.queue_minutes' : 'r.process_minutes';
    const extra = measure === 'process' ? " and (r.implicit = 0 or r.station_kind = 'cure')" : '';
    const ranks = percentiles.flatMap((p) => [`cast((n - 1) * ${p} as integer)`, `min(cast((n - 1) * ${p} as integer) + 1, n - 1)`]).join(', ');
    const args = [f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args];
    const source = `select r.station_kind as k, ${column} as x from step_runs r${joinOrders}
      where r.finished_at >= ? and r.finished_at < ? and ${column} is not null${extra}${station}${of.sql}`;
    const totals = client(db)
      .prepare(`select k, count(*) as n, avg(x) as mean from (${source}) group by k`)
      .all(...args) as { k: string; n: number; mean: number }[];
    const stats = client(db)
      .prepare(
        `select k, i, x from (
           select k, x, row_number() over (partition by k order by x) - 1 as i, count(*) over (partition by k) as n from (${source})
         ) where i in (${ranks})`,
      )
      .raw(true)
      .all(...args) as [string, number, number][];
    const byKind = new Map<string, Map<number, number>>();
    for (const [k, i, x] of stats) {
      let m = byKind.get(k);
      if (!m) byKind.set(k, (m = new Map()));
      m.set(i, x);
    }
    return totals.map((t) => ({ stationKind: t.k, n: t.n, mean: t.mean, orderStatistics: byKind.get(t.k) ?? new Map() }));
  },

  /** trays finished in the window with their summed process and cure minutes */
  finishedTrayFlow(db: Db, f: ReportFilter): { trayId: string; releasedAt: number; doneAt: number; process: number; cure: number }[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = fl.order_id' : '';
    return client(db)
      .prepare(
        `select fl.tray_id as trayId, fl.released_at as releasedAt, s.last_event_at as doneAt, fl.process_minutes as process, fl.cure_minutes as cure
         from tray_states s join tray_flows fl on fl.tray_id = s.tray_id${joinOrders}
         where s.phase = 'done' and s.last_event_at >= ? and s.last_event_at < ?${of.sql}`,
      )
      .all(f.from, f.to, ...of.args) as { trayId: string; releasedAt: number; doneAt: number; process: number; cure: number }[];
  },

  /** trays in the window (released before its end, not gone before its start) with their milestones */
  flowTrays(db: Db, f: ReportFilter): FlowTrayRow[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select t.id, t.released_at as releasedAt, s.phase, s.last_event_at as lastEventAt, t.merged_into_id as mergedIntoId,
           fl.started_at as started, fl.inspected_at as inspected, fl.packed_at as packed, fl.shipped_at as shipped, fl.shipped_qty as shippedQty
         from trays t join tray_states s on s.tray_id = t.id join orders o on o.id = t.order_id left join tray_flows fl on fl.tray_id = t.id
         where t.kind = 'tray' and t.released_at < ?
           and not (s.phase in ('done', 'scrapped', 'merged') and s.last_event_at < ?)${of.sql}`,
      )
      .all(f.to, f.from, ...of.args) as FlowTrayRow[];
  },

  /** milestones of particular trays (merge targets outside the window) */
  flowsOf(db: Db, trayIds: string[]): FlowTrayRow[] {
    const stmt = client(db).prepare(
      `select t.id, t.released_at as releasedAt, s.phase, s.last_event_at as lastEventAt, t.merged_into_id as mergedIntoId,
         fl.started_at as started, fl.inspected_at as inspected, fl.packed_at as packed, fl.shipped_at as shipped, fl.shipped_qty as shippedQty
       from trays t join tray_states s on s.tray_id = t.id left join tray_flows fl on fl.tray_id = t.id where t.id = ?`,
    );
    return trayIds.map((id) => stmt.get(id) as FlowTrayRow | undefined).filter((x): x is FlowTrayRow => !!x);
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

  /** per order shipped in the window and per step: the summed counts of its trays */
  shippedOrderStepCounts(db: Db, f: ReportFilter): { orderId: string; seq: number; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[] {
    const of = orderFilter(f);
    return client(db)
      .prepare(
        `select r.order_id as orderId, r.step_seq as seq, sum(r.qty_in) as inQty, sum(r.good_qty) as goodQty, sum(r.scrap_qty) as scrapQty, sum(r.rework_qty) as reworkQty
         from orders o join step_runs r on r.order_id = o.id
         where o.shipped_at >= ? and o.shipped_at < ? and r.traveller_kind = 'tray'${of.sql}
         group by r.order_id, r.step_seq`,
      )
      .all(f.from, f.to, ...of.args) as { orderId: string; seq: number; inQty: number; goodQty: number; scrapQty: number; reworkQty: number }[];
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
