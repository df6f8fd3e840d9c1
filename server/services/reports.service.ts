import { toCsv, type CsvCell } from '@shared/domain/csv-safety';
import type { AppDeps } from '../app-deps';
import { reportsRepository as repo, type FlowTrayRow, type ReportFilter } from '../repositories/reports.repository';
import { reportFactsService } from './report-facts.service';
import { calendarService } from './calendar.service';
import { badInput } from '../errors';
import { PERCENTILE_METHOD, quantileSorted, summarize, roundSummary, sortNumbers, type Summary } from '@shared/domain/stats';
import { DAY, dayNumberOfDate, dateOfDayNumber, localDate, startOfLocalDate, iso } from '@shared/domain/time-zone';
import { countPerBucket, cumulativeFlowOfItems, flowEfficiency, makeBuckets, wipOverTime } from '@shared/domain/flow';
import { pareto, rolledThroughputYield, stepYield, type StepCounts } from '@shared/domain/yield';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import type { CycleTimeReport, FlowReport, LeadTimeReport, OnTimeReport, ReportQuery, ReportWindow, YieldReport } from '@shared/schemas/reports';

const H = 3_600_000;
const MIN = 60_000;
const DEFAULT_DAYS = 90;
const MAX_DAYS = 3 * 366;

export const FLOW_STAGES = ['released', 'started', 'inspected', 'packed', 'shipped'] as const;

const r2 = (x: number) => Math.round(x * 100) / 100;
const r4 = (x: number | null) => (x === null ? null : Math.round(x * 10000) / 10000);

export interface Window {
  filter: ReportFilter;
  info: ReportWindow;
  tz: string;
}

function parseBound(tz: string, v: string, end: boolean): number {
  if (/^\d{4}-\d{2}-\d{2}$/.test(v)) {
    // a whole local day: "to" includes that day
    return end ? startOfLocalDate(tz, dateOfDayNumber(dayNumberOfDate(v) + 1)) : startOfLocalDate(tz, v);
  }
  return Date.parse(v);
}

export function windowOf(deps: AppDeps, q: ReportQuery): Window {
  const tz = calendarService.timeZone(deps);
  const now = deps.now();
  const to = q.to ? parseBound(tz, q.to, true) : now;
  const from = q.from ? parseBound(tz, q.from, false) : to - DEFAULT_DAYS * DAY;
  if (!(from < to)) throw badInput('The start of the period must be before its end.', [{ path: ['from'], message: 'After the end' }]);
  if (to - from > MAX_DAYS * DAY) throw badInput('Ask for at most three years at a time.', [{ path: ['from'], message: 'Too long a period' }]);
  return {
    tz,
    filter: { from, to, process: q.process, customerId: q.customerId, stationId: q.stationId },
    info: { from: iso(from), to: iso(to), timeZone: tz, percentileMethod: PERCENTILE_METHOD },
  };
}

function fresh(deps: AppDeps) {
  reportFactsService.catchUp(deps);
}

export const reportsService = {
  leadTime(deps: AppDeps, q: ReportQuery): LeadTimeReport {
    const w = windowOf(deps, q);
    const cal = calendarService.calendar(deps);
    const rows = repo.shippedOrders(deps.db, w.filter).filter((o) => o.releasedAt != null);
    const orders = rows.map((o) => {
      const released = o.releasedAt as number;
      return {
        orderId: o.id,
        number: o.number,
        customer: o.customer,
        title: o.title,
        process: o.process,
        releasedAt: iso(released),
        shippedAt: iso(o.shippedAt),
        calendarHours: r2((o.shippedAt - released) / H),
        workingHours: r2(cal.factory.workingMinutesBetween(released, o.shippedAt) / 60),
        dueDate: o.dueDate,
        onTime: localDate(w.tz, o.shippedAt) <= o.dueDate,
      };
    });
    const weeks = makeBuckets(w.tz, w.filter.from, w.filter.to, 'week');
    const trend = weeks.map((b) => {
      const inWeek = rows.map((o, i) => ({ o, i })).filter(({ o }) => o.shippedAt >= b.start && o.shippedAt < b.end);
      const hours = sortNumbers(inWeek.map(({ i }) => orders[i].calendarHours));
      return {
        week: b.label,
        n: hours.length,
        p50: hours.length ? r2(quantileSorted(hours, 0.5)) : null,
        p85: hours.length ? r2(quantileSorted(hours, 0.85)) : null,
        onTime: inWeek.filter(({ i }) => orders[i].onTime).length,
      };
    });
    return {
      window: w.info,
      orders,
      summary: roundSummary(summarize(orders.map((o) => o.calendarHours))),
      summaryWorkingHours: roundSummary(summarize(orders.map((o) => o.workingHours))),
      trend,
    };
  },

  cycleTime(deps: AppDeps, q: ReportQuery): CycleTimeReport {
    fresh(deps);
    const w = windowOf(deps, q);
    type Pair = { calendar: Summary; working: Summary };
    const queue = new Map<string, Pair>();
    const process = new Map<string, Pair>();
    const pair = (v: { calendar: Float64Array; working: Float64Array }): Pair => ({
      calendar: roundSummary(summarize(v.calendar)),
      working: roundSummary(summarize(v.working)),
    });
    for (const kind of STATION_KINDS) {
      const { queue: q, process: p } = repo.cycleValues(deps.db, w.filter, kind);
      if (q.calendar.length) queue.set(kind, pair(q));
      if (p.calendar.length) process.set(kind, pair(p));
    }
    const empty = { n: 0, p50: null, p85: null, p95: null, mean: null };
    const order = (k: string) => {
      const i = STATION_KINDS.indexOf(k as (typeof STATION_KINDS)[number]);
      return i < 0 ? 99 : i;
    };
    const stations = [...new Set([...queue.keys(), ...process.keys()])]
      .sort((a, b) => order(a) - order(b))
      .map((stationKind) => {
        const p = process.get(stationKind);
        const q = queue.get(stationKind);
        return {
          stationKind,
          process: p?.calendar ?? empty,
          queue: q?.calendar ?? empty,
          processWorking: p?.working ?? empty,
          queueWorking: q?.working ?? empty,
        };
      });

    // Flow efficiency in one unit at a time: process over flow in working minutes of the factory
    // calendar (the headline), and both in calendar minutes beside it. Cure is apart in both.
    const cal = calendarService.calendar(deps);
    const trays = w.filter.stationId ? [] : repo.finishedTrayFlow(deps.db, w.filter);
    const sums = { process: 0, cure: 0, flow: 0, processWorking: 0, cureWorking: 0, flowWorking: 0 };
    for (const t of trays) {
      sums.process += t.process;
      sums.cure += t.cure;
      sums.flow += (t.doneAt - t.releasedAt) / MIN;
      sums.processWorking += t.processWorking;
      sums.cureWorking += t.cureWorking;
      sums.flowWorking += cal.factory.workingMinutesBetween(t.releasedAt, t.doneAt);
    }
    const figures = (processMinutes: number, cureMinutes: number, flowMinutes: number) => {
      const fe = flowEfficiency({ processMinutes, cureMinutes, flowMinutes });
      return {
        processMinutes: r2(processMinutes),
        cureMinutes: r2(cureMinutes),
        flowMinutes: r2(flowMinutes),
        flowEfficiency: r4(fe.flowEfficiency),
        cureShare: r4(fe.cureShare),
      };
    };
    return {
      window: w.info,
      stations,
      flowEfficiency: {
        trays: trays.length,
        unit: 'working_minutes',
        cureValueAdding: false,
        working: figures(sums.processWorking, sums.cureWorking, sums.flowWorking),
        calendar: figures(sums.process, sums.cure, sums.flow),
      },
    };
  },

  flow(deps: AppDeps, q: ReportQuery): FlowReport {
    fresh(deps);
    const w = windowOf(deps, q);
    const now = deps.now();
    const end = Math.min(w.filter.to, now); // only history
    const buckets = makeBuckets(w.tz, w.filter.from, end, q.bucket);
    const trays = repo.flowTrays(deps.db, w.filter);
    const byId = new Map(trays.map((t) => [t.id, t]));
    const missing = [...new Set(trays.filter((t) => t.phase === 'merged' && t.mergedIntoId && !byId.has(t.mergedIntoId)).map((t) => t.mergedIntoId as string))];
    for (const m of repo.flowsOf(deps.db, missing)) byId.set(m.id, m);
    // one row of first-arrival times per tray (NaN: not there yet); a year is tens of thousands
    const rows: Float64Array[] = [];
    const exitAt = new Float64Array(trays.length).fill(Number.NaN);
    const exitQty = new Float64Array(trays.length);
    trays.forEach((t, k) => {
      if (t.phase === 'scrapped') return; // left the flow without shipping
      let m: FlowTrayRow = t;
      // a tray merged into another for packing goes on inside it
      if (t.phase === 'merged' && t.mergedIntoId) {
        const target = byId.get(t.mergedIntoId);
        if (!target) return;
        m = {
          ...t,
          started: t.started ?? target.started,
          inspected: t.inspected ?? target.inspected,
          packed: t.packed ?? target.packed,
          shipped: target.shipped,
          shippedQty: 0,
        };
      }
      rows.push(Float64Array.of(t.releasedAt, m.started ?? Number.NaN, m.inspected ?? Number.NaN, m.packed ?? Number.NaN, m.shipped ?? Number.NaN));
      if (m.shipped != null) {
        exitAt[k] = m.shipped;
        exitQty[k] = m.shippedQty ?? 0;
      }
    });
    const cfd = cumulativeFlowOfItems(
      rows,
      FLOW_STAGES.length,
      buckets.map((b) => Math.min(b.end, end)),
    );
    // trays already shipped before the window are not in `trays`: every line starts from that base
    const shippedTimes = Array.from(exitAt).filter((x) => !Number.isNaN(x));
    const trayCounts = countPerBucket(shippedTimes, buckets);
    const pieces = buckets.map(() => 0);
    exitAt.forEach((at, k) => {
      if (Number.isNaN(at)) return;
      const i = buckets.findIndex((b) => at >= b.start && at < b.end);
      if (i >= 0) pieces[i] += exitQty[k];
    });
    const orders = countPerBucket(
      repo.shippedOrders(deps.db, w.filter).map((o) => o.shippedAt),
      buckets,
    );
    const wip = wipOverTime(
      trays.map((t, k) => ({
        start: t.releasedAt,
        end: !Number.isNaN(exitAt[k]) ? exitAt[k] : t.phase === 'scrapped' || t.phase === 'done' || t.phase === 'merged' ? (t.lastEventAt ?? null) : null,
      })),
      buckets,
      end,
    );
    return {
      window: w.info,
      bucket: q.bucket,
      stages: [...FLOW_STAGES],
      buckets: buckets.map((b, i) => ({
        label: b.label,
        start: iso(b.start),
        end: iso(Math.min(b.end, end)),
        cumulative: cfd[i],
        trays: trayCounts[i],
        pieces: pieces[i],
        orders: orders[i],
        wipAverage: r2(wip[i].average),
        wipAtEnd: wip[i].atEnd,
      })),
    };
  },

  onTime(deps: AppDeps, q: ReportQuery): OnTimeReport {
    const w = windowOf(deps, q);
    const rows = repo.shippedOrders(deps.db, w.filter);
    const buckets = makeBuckets(w.tz, w.filter.from, w.filter.to, q.bucket);
    const out = buckets.map((b) => {
      const inB = rows.filter((o) => o.shippedAt >= b.start && o.shippedAt < b.end);
      const onTime = inB.filter((o) => localDate(w.tz, o.shippedAt) <= o.dueDate).length;
      return { label: b.label, shipped: inB.length, onTime, share: inB.length ? r4(onTime / inB.length) : null };
    });
    const onTime = rows.filter((o) => localDate(w.tz, o.shippedAt) <= o.dueDate).length;
    return { window: w.info, bucket: q.bucket, buckets: out, total: { shipped: rows.length, onTime, share: rows.length ? r4(onTime / rows.length) : null } };
  },

  yield(deps: AppDeps, q: ReportQuery): YieldReport {
    fresh(deps);
    const w = windowOf(deps, q);
    const kindOrder = (k: string) => {
      const i = STATION_KINDS.indexOf(k as (typeof STATION_KINDS)[number]);
      return i < 0 ? 99 : i;
    };
    const steps = repo
      .stepYields(deps.db, w.filter)
      .sort((a, b) => kindOrder(a.stationKind) - kindOrder(b.stationKind))
      .map((s, i) => {
        const y = stepYield({ seq: i + 1, ...s });
        return {
          stationKind: s.stationKind,
          inQty: y.inQty,
          firstPassQty: y.firstPassQty,
          goodQty: y.goodQty,
          scrapQty: y.scrapQty,
          reworkQty: y.reworkQty,
          firstPassYield: r4(y.firstPassYield),
          finalYield: r4(y.finalYield),
        };
      });
    const shipped = repo.shippedOrders(deps.db, w.filter);
    const byOrder = new Map<string, StepCounts[]>();
    for (const [orderId, seq, inQty, goodQty, scrapQty, reworkQty] of repo.shippedOrderStepCounts(deps.db, w.filter)) {
      let rows = byOrder.get(orderId);
      if (!rows) byOrder.set(orderId, (rows = []));
      rows.push({ seq, inQty, goodQty, scrapQty, reworkQty });
    }
    const orders = shipped.map((o) => {
      const rows = byOrder.get(o.id) ?? [];
      const r = rolledThroughputYield(rows);
      const first = rows.length ? rows.reduce((a, b) => (a.seq < b.seq ? a : b)) : null;
      const last = rows.length ? rows.reduce((a, b) => (a.seq > b.seq ? a : b)) : null;
      return {
        orderId: o.id,
        number: o.number,
        customer: o.customer,
        shippedAt: iso(o.shippedAt),
        steps: rows.length,
        inQty: first?.inQty ?? 0,
        goodQty: last?.goodQty ?? 0,
        reworkQty: rows.reduce((s, x) => s + x.reworkQty, 0),
        rolledThroughputYield: r4(r.rty),
        finalYield: r4(r.finalYield),
      };
    });
    const scrapRows = repo.scrapByReason(deps.db, w.filter);
    const names = new Map(scrapRows.map((s) => [s.reason, s.name ?? s.reason]));
    const scrap = pareto(scrapRows.map((s) => ({ reason: s.reason, qty: s.qty }))).map((p) => ({
      reason: p.reason,
      name: names.get(p.reason) ?? p.reason,
      qty: p.qty,
      share: r4(p.share) as number,
      cumulativeShare: r4(p.cumulativeShare) as number,
    }));
    return { window: w.info, steps, orders, scrap, rework: { qty: steps.reduce((s, x) => s + x.reworkQty, 0) } };
  },

  /**
   * The filters' choices, and the last factory day with scans: the report pages open on the four
   * weeks that end there, not on weeks without data.
   */
  filters(deps: AppDeps) {
    const last = repo.lastScanAt(deps.db);
    const lastDataDay = last == null ? null : localDate(calendarService.timeZone(deps), Math.min(last, deps.now()));
    return { customers: repo.customers(deps.db), lastDataDay };
  },
};

// ---- CSV ------------------------------------------------------------------------------

type Cell = CsvCell;
// every CSV goes through the one writer that escapes cells that would be formulas
const csv = toCsv;
const s = (x: { n: number; p50: number | null; p85: number | null; p95: number | null; mean: number | null }) => [x.n, x.p50, x.p85, x.p95, x.mean];

export const reportsCsv = {
  leadTime(r: LeadTimeReport): string {
    return csv(
      ['order', 'customer', 'title', 'process', 'released_at', 'shipped_at', 'calendar_hours', 'working_hours', 'due_date', 'on_time'],
      r.orders.map((o) => [
        o.number,
        o.customer,
        o.title,
        o.process,
        o.releasedAt,
        o.shippedAt,
        o.calendarHours,
        o.workingHours,
        o.dueDate,
        o.onTime ? 'yes' : 'no',
      ]),
    );
  },
  cycleTime(r: CycleTimeReport): string {
    const cols = (name: string, unit: string) => [`${name}_n`, `${name}_p50_${unit}`, `${name}_p85_${unit}`, `${name}_p95_${unit}`, `${name}_mean_${unit}`];
    return csv(
      ['station_kind', ...cols('process', 'min'), ...cols('queue', 'min'), ...cols('process_working', 'working_min'), ...cols('queue_working', 'working_min')],
      r.stations.map((k) => [k.stationKind, ...s(k.process), ...s(k.queue), ...s(k.processWorking), ...s(k.queueWorking)]),
    );
  },
  flow(r: FlowReport): string {
    return csv(
      ['bucket_start', ...r.stages.map((x) => `cumulative_${x}`), 'trays_shipped', 'pieces_shipped', 'orders_shipped', 'wip_average_trays', 'wip_at_end_trays'],
      r.buckets.map((b) => [b.label, ...b.cumulative, b.trays, b.pieces, b.orders, b.wipAverage, b.wipAtEnd]),
    );
  },
  onTime(r: OnTimeReport): string {
    return csv(
      ['bucket_start', 'shipped', 'on_time', 'on_time_share'],
      r.buckets.map((b) => [b.label, b.shipped, b.onTime, b.share]),
    );
  },
  yield(r: YieldReport): string {
    const rows: Cell[][] = [
      ...r.steps.map((x) => [
        'step',
        x.stationKind,
        x.inQty,
        x.firstPassQty,
        x.goodQty,
        x.scrapQty,
        x.reworkQty,
        x.firstPassYield,
        x.finalYield,
        null,
        null,
        null,
      ]),
      ...r.orders.map((o) => ['order', o.number, o.inQty, null, o.goodQty, null, o.reworkQty, null, o.finalYield, o.rolledThroughputYield, null, null]),
      ...r.scrap.map((x) => ['scrap', x.reason, null, null, null, x.qty, null, null, null, null, x.share, x.cumulativeShare]),
    ];
    return csv(
      [
        'section',
        'name',
        'in_qty',
        'first_pass_qty',
        'good_qty',
        'scrap_qty',
        'rework_qty',
        'first_pass_yield',
        'final_yield',
        'rolled_throughput_yield',
        'scrap_share',
        'cumulative_share',
      ],
      rows,
    );
  },
};
