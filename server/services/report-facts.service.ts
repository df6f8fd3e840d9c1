import type { AppDeps } from '../app-deps';
import { reportFactsRepository as repo, type StepRunInsert } from '../repositories/report-facts.repository';
import { calendarService } from './calendar.service';
import { onFloorChanged } from './live-bus';
import { replayTravellers, trayFlowOf } from '@shared/domain/traveller';
import type { WorkingCalendar } from '@shared/domain/calendar';

// Keeps step_runs and tray_flows in step with the append-only scan log. The facts come from the
// traveller core: every order's events are replayed through the scan guards
// (shared/domain/traveller/replay.ts), and the steps the guards close are the step runs. An
// order's facts are rebuilt from all of its events whenever it has new ones, so a late event from
// an offline tablet, a split or a merge lands correctly. Queue and process times are kept in
// calendar minutes and in working minutes of the factory calendar: saving the calendar starts a
// full rebuild (calendarService.forget resets the cursor).

const CURSOR = 'step_runs';
/** more orders than this with new events: replay the whole log once instead */
const FULL_REBUILD_THRESHOLD = 500;
const ORDERS_PER_PAGE = 50;

function fillOrders(deps: AppDeps, orderIds: readonly string[], upTo: number, cal: WorkingCalendar) {
  const db = deps.db;
  const insert = repo.inserter(db);
  const insertFlow = repo.flowInserter(db);
  const factory = (from: number, to: number) => cal.factory.workingMinutesBetween(from, to);
  let refused = 0;
  // a page of orders at a time keeps memory flat on a year of events
  for (let i = 0; i < orderIds.length; i += ORDERS_PER_PAGE) {
    const page = orderIds.slice(i, i + ORDERS_PER_PAGE);
    const travellers = repo.travellers(db, page);
    const replay = replayTravellers(travellers, repo.eventsOfOrders(db, page, upTo));
    refused += replay.refused.length;
    for (const t of travellers) {
      const runs = replay.runs.get(t.id) ?? [];
      for (const r of runs) {
        const timeline = cal.forStation(r.stationId, r.stationKind);
        const row: StepRunInsert = {
          ...r,
          queueWorkingMinutes: r.startedAt == null ? null : timeline.workingMinutesBetween(Math.min(r.readyAt, r.startedAt), r.startedAt),
          processWorkingMinutes: r.startedAt == null ? null : timeline.workingMinutesBetween(r.startedAt, Math.max(r.startedAt, r.finishedAt)),
        };
        insert(row);
      }
      if (t.kind === 'tray' && runs.length) insertFlow(trayFlowOf(t, runs, factory));
    }
  }
  if (refused) deps.log.warn({ refused }, 'report facts: stored scans the guards refuse on replay were left out');
}

function rebuildAll(deps: AppDeps, upTo: number) {
  const db = deps.db;
  repo.deleteAllRuns(db);
  const orders = repo.ordersWithEvents(db);
  const cal = calendarService.calendar(deps);
  repo.withoutIndexes(db, () => fillOrders(deps, orders, upTo, cal));
}

function rebuildOrders(deps: AppDeps, orderIds: string[], upTo: number) {
  for (const id of orderIds) repo.deleteRunsOfOrder(deps.db, id);
  fillOrders(deps, orderIds, upTo, calendarService.calendar(deps));
}

const subscribed = new WeakSet<object>();
/** the background catch-up waits for this long a pause in the scans … */
const FOLLOW_QUIET_MS = 1_000;
/** … but never longer than this after the first scan it has not folded in */
const FOLLOW_MAX_WAIT_MS = 5_000;

export const reportFactsService = {
  /** the last scan event folded into step_runs (grows with the log; back to 0 before a full rebuild) */
  foldedUpTo(deps: AppDeps): number {
    return repo.cursor(deps.db, CURSOR);
  },

  /**
   * Brings step_runs and tray_flows up to date with the scan log. Cheap when nothing is new (one indexed
   * lookup); called before every report and after floor changes.
   */
  catchUp(deps: AppDeps, options: { full?: boolean } = {}): { orders: number; full: boolean } {
    const db = deps.db;
    const last = repo.cursor(db, CURSOR);
    const max = repo.maxEventRowid(db);
    if (max <= last && !options.full) return { orders: 0, full: false };
    return repo.transaction(db, () => {
      const orders = options.full ? [] : repo.ordersWithEventsAfter(db, last, FULL_REBUILD_THRESHOLD + 1);
      const full = options.full || orders.length > FULL_REBUILD_THRESHOLD || last === 0;
      if (full) rebuildAll(deps, max);
      else rebuildOrders(deps, orders, max);
      repo.setCursor(db, CURSOR, max, deps.now());
      return { orders: orders.length, full };
    });
  },

  /**
   * Keeps step_runs fresh in the background while the server runs. A burst of scans is folded in
   * once it pauses (a quiet second), or at the latest a few seconds after its first scan, so the
   * catch-up does not compete with every batch; every report still catches up before it reads.
   */
  follow(deps: AppDeps) {
    if (subscribed.has(deps.db)) return;
    subscribed.add(deps.db);
    let timer: NodeJS.Timeout | null = null;
    let firstChangeAt: number | null = null;
    const run = () => {
      timer = null;
      firstChangeAt = null;
      try {
        reportFactsService.catchUp(deps);
      } catch (error) {
        deps.log.warn({ err: error }, 'report facts catch-up failed');
      }
    };
    onFloorChanged(deps, () => {
      const now = Date.now();
      firstChangeAt ??= now;
      if (timer) clearTimeout(timer);
      const wait = Math.max(0, Math.min(FOLLOW_QUIET_MS, firstChangeAt + FOLLOW_MAX_WAIT_MS - now));
      timer = setTimeout(run, wait);
      timer.unref?.();
    });
  },
};
