import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import { cures } from '@shared/domain/traveller';

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
/** every station kind, so the kind/time index can serve a whole window */
const KINDS = STATION_KINDS.map((k) => `'${k}'`).join(', ');

/**
 * Yield counts of a set of runs, summed as stepRunYieldCounts (shared/domain/traveller/replay.ts)
 * adds one run: a run a split sent back for rework, or a step done again after it, brings no new
 * pieces in; the first counts all its good pieces as reworked, both lose their scrap from the good.
 */
const YIELD_SUMS = `sum(case when r.pass = 'first' then r.qty_in else 0 end),
  sum(case when r.pass = 'first' then r.good_qty else r.good_qty - r.qty_in end),
  sum(r.scrap_qty),
  sum(case when r.pass = 'rework' then r.good_qty else r.rework_qty end)`;

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

export interface FinishedTrayFlowRow {
  trayId: string;
  releasedAt: number;
  doneAt: number;
  process: number;
  cure: number;
  processWorking: number;
  cureWorking: number;
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

/** Two lists of numbers filled side by side in typed buffers that double when full. */
class GrowingPairs {
  private calendar = new Float64Array(4096);
  private working = new Float64Array(4096);
  private n = 0;
  push(calendar: number, working: number) {
    if (this.n === this.calendar.length) {
      const c = new Float64Array(this.n * 2);
      c.set(this.calendar);
      this.calendar = c;
      const w = new Float64Array(this.n * 2);
      w.set(this.working);
      this.working = w;
    }
    this.calendar[this.n] = calendar;
    this.working[this.n++] = working;
  }
  done(): { calendar: Float64Array; working: Float64Array } {
    return { calendar: this.calendar.subarray(0, this.n), working: this.working.subarray(0, this.n) };
  }
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
   * Queue and process minutes of one station kind's steps finished in the window, each in
   * calendar minutes and in working minutes of the station's calendar, as flat lists (one
   * covering-index range scan for both measures, no row objects). A cure closed on its own counts
   * as process time only for the cure kind itself.
   */
  cycleValues(db: Db, f: ReportFilter, stationKind: string): Record<'queue' | 'process', { calendar: Float64Array; working: Float64Array }> {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    const implicitIsProcess = cures(stationKind);
    const rows = client(db)
      .prepare(
        `select r.queue_minutes, r.queue_working_minutes, r.process_minutes, r.process_working_minutes, r.implicit from step_runs r${joinOrders}
         where r.station_kind = ? and r.finished_at >= ? and r.finished_at < ?${station}${of.sql}`,
      )
      .raw(true)
      .iterate(stationKind, f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args);
    // straight into typed buffers: no array of boxed numbers for half a million values
    const queue = new GrowingPairs();
    const process = new GrowingPairs();
    for (const [qc, qw, pc, pw, implicit] of rows as Iterable<[number | null, number | null, number | null, number | null, number]>) {
      if (qc != null && qw != null) queue.push(qc, qw);
      if (pc != null && pw != null && (implicitIsProcess || !implicit)) process.push(pc, pw);
    }
    return { queue: queue.done(), process: process.done() };
  },

  /** trays finished in the window with their summed process and cure minutes, in calendar and in working minutes */
  finishedTrayFlow(db: Db, f: ReportFilter): FinishedTrayFlowRow[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = fl.order_id' : '';
    return client(db)
      .prepare(
        `select fl.tray_id as trayId, fl.released_at as releasedAt, s.last_event_at as doneAt, fl.process_minutes as process, fl.cure_minutes as cure,
           fl.process_working_minutes as processWorking, fl.cure_working_minutes as cureWorking
         from tray_states s join tray_flows fl on fl.tray_id = s.tray_id${joinOrders}
         where s.phase = 'done' and s.last_event_at >= ? and s.last_event_at < ?${of.sql}`,
      )
      .all(f.from, f.to, ...of.args) as FinishedTrayFlowRow[];
  },

  /** trays in the window (released before its end, not gone before its start) with their milestones */
  flowTrays(db: Db, f: ReportFilter): FlowTrayRow[] {
    const of = orderFilter(f);
    const filtered = of.sql ? ` and exists (select 1 from trays t join orders o on o.id = t.order_id where t.id = s.tray_id${of.sql})` : '';
    return client(db)
      .prepare(
        `select s.tray_id as id, s.released_at as releasedAt, s.phase, s.last_event_at as lastEventAt,
           case when s.phase = 'merged' then (select t.merged_into_id from trays t where t.id = s.tray_id) end as mergedIntoId,
           fl.started_at as started, fl.inspected_at as inspected, fl.packed_at as packed, fl.shipped_at as shipped, fl.shipped_qty as shippedQty
         from tray_states s left join tray_flows fl on fl.tray_id = s.tray_id
         where s.kind = 'tray' and s.released_at < ?
           and not (s.phase in ('done', 'scrapped', 'merged') and s.last_event_at < ?)${filtered}`,
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
        `select r.station_kind, ${YIELD_SUMS}
         from step_runs r${joinOrders}
         where r.station_kind in (${KINDS}) and r.finished_at >= ? and r.finished_at < ? and r.traveller_kind = 'tray'${station}${of.sql}
         group by r.station_kind`,
      )
      .raw(true)
      .all(f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args)
      .map((row) => {
        const [stationKind, inQty, goodQty, scrapQty, reworkQty] = row as [string, number, number, number, number];
        return { stationKind, inQty, goodQty, scrapQty, reworkQty };
      });
  },

  scrapByReason(db: Db, f: ReportFilter): { reason: string; name: string | null; qty: number }[] {
    const of = orderFilter(f);
    const joinOrders = of.sql ? ' join orders o on o.id = r.order_id' : '';
    const station = f.stationId ? ' and r.station_id = ?' : '';
    return client(db)
      .prepare(
        `select coalesce(r.scrap_reason, 'unrecorded') as reason, rc.name as name, sum(r.scrap_qty) as qty
         from step_runs r${joinOrders} left join reason_codes rc on rc.code = r.scrap_reason
         where r.scrap_qty > 0 and r.finished_at >= ? and r.finished_at < ? and r.traveller_kind = 'tray'${station}${of.sql}
         group by coalesce(r.scrap_reason, 'unrecorded')`,
      )
      .all(f.from, f.to, ...(f.stationId ? [f.stationId] : []), ...of.args) as { reason: string; name: string | null; qty: number }[];
  },

  /** per order shipped in the window and per step: the summed counts of its trays, as
   * [orderId, seq, in, good, scrap, rework] rows (plain arrays: a year is a hundred thousand rows) */
  shippedOrderStepCounts(db: Db, f: ReportFilter): [string, number, number, number, number, number][] {
    const of = orderFilter(f);
    // the IN list is probed in order id order against the (order, step) index, so the grouping
    // needs no sort
    return client(db)
      .prepare(
        `select r.order_id, r.step_seq, ${YIELD_SUMS}
         from step_runs r
         where r.order_id in (select o.id from orders o where o.shipped_at >= ? and o.shipped_at < ?${of.sql}) and r.traveller_kind = 'tray'
         group by r.order_id, r.step_seq`,
      )
      .raw(true)
      .all(f.from, f.to, ...of.args) as [string, number, number, number, number, number][];
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

  /** The time of the latest scan on the floor (null on an empty floor): where the data ends. */
  lastScanAt(db: Db): number | null {
    return (client(db).prepare('select max(occurred_at) at from scan_events').get() as { at: number | null }).at;
  },

  customers(db: Db): { id: string; name: string }[] {
    return client(db).prepare('select id, name from customers order by name').all() as { id: string; name: string }[];
  },
};
