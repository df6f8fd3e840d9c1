import type { AppDeps } from '../app-deps';
import { projectionRepository as repo, type OpenOrderRow, type StepRow, type TrayStateRow } from '../repositories/projection.repository';
import { reportsRepository } from '../repositories/reports.repository';
import { reportFactsService } from './report-facts.service';
import { calendarService } from './calendar.service';
import { projectTrays, queueTimesOf, type ProjectedStep, type QueueSamples, type QueueTimes, type TrayOutlook } from '@shared/domain/projection';
import { DAY, dayNumberOfDate, dateOfDayNumber, startOfLocalDate, type WorkingCalendar } from '@shared/domain/calendar';
import { seedOf } from '@shared/domain/stats';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import type { LateRiskOrder, OrderProjection } from '@shared/schemas/reports';

// Projected ship dates for open orders. Other features call:
//   projectionService.forOrder(deps, orderId)      -> OrderProjection | null
//   projectionService.forOrders(deps, orderIds?)   -> Map<orderId, OrderProjection>
//   projectionService.lateRisk(deps)               -> LateRiskOrder[] (late first)
// expectedAt is the projected ship date to show; p85At the date it ships by with 85 % confidence.

const HISTORY_DAYS = 90;
const SAMPLES_PER_KIND = 400;
const RUNS = 200;
const CACHE_MS = 60_000;
const MOULD_KINDS = new Set(['strike', 'cast']);

interface Cache {
  key: string;
  at: number;
  byOrder: Map<string, OrderProjection>;
  orders: OpenOrderRow[];
}
const caches = new WeakMap<object, Cache>();

function queueSamples(deps: AppDeps, cal: WorkingCalendar, now: number): QueueSamples {
  const out: Record<string, number[]> = {};
  for (const kind of STATION_KINDS) {
    const rows = reportsRepository.recentQueues(deps.db, kind, now - HISTORY_DAYS * DAY, SAMPLES_PER_KIND);
    if (rows.length) out[kind] = rows.map((r) => Math.max(0, cal.forStation(r.stationId, kind).workingMinutesBetween(r.readyAt, r.startedAt)));
  }
  return out;
}

function outlook(tray: TrayStateRow, steps: StepRow[], now: number, notBefore: number | null): TrayOutlook {
  const own = steps.filter((s) => s.kind === tray.kind);
  const std = (s: StepRow, qty: number): ProjectedStep => ({
    seq: s.seq,
    stationKind: s.stationKind,
    standardMinutes: s.trayMinutes + s.pieceMinutes * (tray.kind === 'mould' ? 1 : qty),
    cureMinutes: s.cureMinutes,
  });
  if (tray.phase === 'done' || tray.phase === 'scrapped' || tray.phase === 'merged') {
    return { trayId: tray.trayId, phase: tray.phase, steps: [], finishedAt: tray.lastEventAt ?? now };
  }
  let phase = tray.phase as TrayOutlook['phase'];
  let from = tray.stepSeq ?? 1;
  let waitingSince = tray.waitingSince;
  // a cure that has run out: the tray waits for the next step since the cure ended
  if (phase === 'curing' && tray.cureReadyAt != null && tray.cureReadyAt <= now) {
    phase = 'waiting';
    from += 1;
    waitingSince = tray.cureReadyAt;
  }
  const remaining = own.filter((s) => s.seq >= from).map((s) => std(s, tray.quantity));
  const first = remaining[0];
  const blockedByMould = phase === 'waiting' && first && MOULD_KINDS.has(first.stationKind) && notBefore != null;
  const cureReady = phase === 'waiting' ? tray.cureReadyAt : null;
  const limit = Math.max(cureReady ?? -Infinity, blockedByMould ? (notBefore as number) : -Infinity);
  return {
    trayId: tray.trayId,
    phase,
    steps: remaining,
    startedAt: tray.startedAt,
    waitingSince,
    cureReadyAt: Number.isFinite(limit) ? limit : null,
    onHold: !!tray.onHold,
  };
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function fmt(tz: string, ms: number): string {
  let f = formatters.get(tz);
  if (!f) formatters.set(tz, (f = new Intl.DateTimeFormat('en-GB', { timeZone: tz, weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' })));
  return f.format(ms);
}

function hours(min: number): string {
  const h = min / 60;
  return h < 10 ? `${Math.round(h * 10) / 10} h` : `${Math.round(h)} h`;
}

function projectOrder(deps: AppDeps, order: OpenOrderRow, cal: WorkingCalendar, samples: QueueSamples, queueTimes: QueueTimes, now: number): OrderProjection {
  const trays = repo.traysOf(deps.db, order.id);
  const steps = repo.stepsOf(deps.db, order.id);
  const opts = { now, calendar: cal, queueSamples: samples, queueTimes, runs: RUNS, seed: seedOf(order.id) };
  const moulds = trays.filter((t) => t.kind === 'mould');
  const mouldsOpen = moulds.filter((t) => !['done', 'scrapped', 'merged'].includes(t.phase));
  const mouldReady = mouldsOpen.length ? projectTrays(mouldsOpen.map((m) => outlook(m, steps, now, null)), opts).expectedAt : null;
  const pieces = trays.filter((t) => t.kind === 'tray');
  const p = projectTrays(
    pieces.map((t) => outlook(t, steps, now, mouldReady)),
    opts,
  );
  const dueEnd = startOfLocalDate(cal.timeZone, dateOfDayNumber(dayNumberOfDate(order.dueDate) + 1));
  const tz = cal.timeZone;
  let explanation: string;
  if (p.expectedAt === null) explanation = 'No trays on the floor yet, so there is nothing to project.';
  else if (p.remainingSteps === 0) explanation = 'Every tray has finished its steps.';
  else {
    explanation =
      `Expected ${fmt(tz, p.expectedAt)}, and by ${fmt(tz, p.p85At ?? p.expectedAt)} in 85 of 100 simulated runs. ` +
      `The slowest tray has ${p.remainingSteps} step${p.remainingSteps === 1 ? '' : 's'} left: ${hours(p.standardMinutes)} of standard work, ` +
      `${hours(p.queueMinutes)} of typical waiting (measured over the last ${HISTORY_DAYS} days)` +
      (p.cureMinutes > 0 ? ` and ${hours(p.cureMinutes)} of curing` : '') +
      `, laid on the working calendar${p.traysOnHold ? `; ${p.traysOnHold} tray${p.traysOnHold === 1 ? ' is' : 's are'} on hold` : ''}.`;
  }
  return {
    orderId: order.id,
    expectedAt: p.expectedAt === null ? null : new Date(p.expectedAt).toISOString(),
    p85At: p.p85At === null ? null : new Date(p.p85At).toISOString(),
    dueDate: order.dueDate,
    late: p.expectedAt !== null && p.expectedAt > dueEnd,
    explanation,
  };
}

function compute(deps: AppDeps): Cache {
  const key = repo.fingerprint(deps.db);
  const hit = caches.get(deps.db);
  const now = deps.now();
  if (hit && hit.key === key && now - hit.at < CACHE_MS) return hit;
  reportFactsService.catchUp(deps);
  const cal = calendarService.calendar(deps);
  const samples = queueSamples(deps, cal, now);
  const orders = repo.openOrders(deps.db);
  const byOrder = new Map<string, OrderProjection>();
  const queueTimes = queueTimesOf({ queueSamples: samples });
  for (const o of orders) byOrder.set(o.id, projectOrder(deps, o, cal, samples, queueTimes, now));
  const fresh = { key, at: now, byOrder, orders };
  caches.set(deps.db, fresh);
  return fresh;
}

export const projectionService = {
  forOrders(deps: AppDeps, orderIds?: string[]): Map<string, OrderProjection> {
    const all = compute(deps).byOrder;
    if (!orderIds) return all;
    return new Map(orderIds.filter((id) => all.has(id)).map((id) => [id, all.get(id) as OrderProjection]));
  },

  forOrder(deps: AppDeps, orderId: string): OrderProjection | null {
    return compute(deps).byOrder.get(orderId) ?? null;
  },

  /** Open orders whose expected date (late) or 85th-percentile date (at risk) passes the due date. */
  lateRisk(deps: AppDeps): LateRiskOrder[] {
    const c = compute(deps);
    const cal = calendarService.calendar(deps);
    const out: LateRiskOrder[] = [];
    for (const o of c.orders) {
      const p = c.byOrder.get(o.id);
      if (!p || !p.expectedAt) continue;
      const dueEnd = startOfLocalDate(cal.timeZone, dateOfDayNumber(dayNumberOfDate(o.dueDate) + 1));
      const expected = Date.parse(p.expectedAt);
      const p85 = Date.parse(p.p85At ?? p.expectedAt);
      if (p85 <= dueEnd) continue;
      out.push({
        ...p,
        number: o.number,
        customer: o.customer,
        title: o.title,
        status: o.status,
        slackHours: Math.round((cal.factory.workingMinutesBetween(dueEnd, expected) / 60) * 10) / 10,
        risk: expected > dueEnd ? 'late' : 'at_risk',
      });
    }
    return out.sort((a, b) => (a.risk === b.risk ? (b.slackHours ?? 0) - (a.slackHours ?? 0) : a.risk === 'late' ? -1 : 1));
  },
};
