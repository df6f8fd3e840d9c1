// Projected ship dates for the sales view, the status page and the late-risk digest.
//
// The dates come from the projection service (measured queue times, the working calendar,
// sampled runs). For an order that service does not cover, the simple projection here is
// used: each open tray's remaining standard minutes plus a fixed queue allowance per step, on
// the factory's working calendar when the caller gives it (else the default week, ovens
// continuous). It needs no history.
import type { AppDeps } from '../app-deps';
import { compileCalendar, defaultCalendarConfig, type WorkingCalendar } from '@shared/domain/calendar';
import { projectTrays, type TrayOutlook } from '@shared/domain/projection';
import { standardMinutes, type TrayPhase } from '@shared/domain/vocabulary';
import { shippingRepository } from '../repositories/shipping.repository';
import { projectionService } from './projection.service';
import { projectionRepository } from '../repositories/projection.repository';
import { projectionNoteEnglish, type ProjectionNote } from '@shared/domain/projection-note';

/** Queue allowance per remaining step when nothing better is known (minutes of working time). */
export const SIMPLE_QUEUE_MINUTES = 60;

export interface ShipDate {
  /** expected finish of the order's last tray (epoch ms); null before release */
  expectedAt: number | null;
  /** one line for the screen: how the date was made (English) */
  basis: string;
  /** the same as a code and its numbers, for screens in any language */
  note: ProjectionNote;
}

export interface ProjectionTraveller {
  id: string;
  kind: 'tray' | 'mould';
  phase: TrayPhase;
  stepSeq: number | null;
  quantity: number;
  onHold: boolean;
  startedAt: number | null;
  waitingSince: number | null;
  cureReadyAt: number | null;
  lastEventAt: number | null;
}

export interface ProjectionStep {
  travellerKind: 'tray' | 'mould';
  seq: number;
  stationKind: string;
  trayMinutes: number;
  pieceMinutes: number;
  cureMinutes: number | null;
}

const calendars = new Map<string, WorkingCalendar>();
function calendarFor(timeZone: string): WorkingCalendar {
  let c = calendars.get(timeZone);
  if (!c) calendars.set(timeZone, (c = compileCalendar(defaultCalendarConfig(timeZone))));
  return c;
}

const SIMPLE_NOTE: ProjectionNote = { code: 'simple', params: { queueMinutes: SIMPLE_QUEUE_MINUTES } };
export const BASIS_TEXT = projectionNoteEnglish(SIMPLE_NOTE, 'UTC');

/** The projected finish of one order from its travellers and routing. */
export function projectOrder(
  input: { status: string; travellers: ProjectionTraveller[]; steps: ProjectionStep[] },
  now: number,
  timeZone: string,
  calendar: WorkingCalendar = calendarFor(timeZone),
): ShipDate {
  const open = ['released', 'in_production', 'packed', 'on_hold'];
  if (!open.includes(input.status) || input.travellers.length === 0) return { expectedAt: null, basis: BASIS_TEXT, note: SIMPLE_NOTE };
  const routing = { tray: input.steps.filter((s) => s.travellerKind === 'tray'), mould: input.steps.filter((s) => s.travellerKind === 'mould') };
  const outlooks: TrayOutlook[] = input.travellers.map((t) => {
    const remaining = t.stepSeq == null ? [] : routing[t.kind].filter((s) => s.seq >= (t.stepSeq as number));
    return {
      trayId: t.id,
      phase: t.phase,
      steps: remaining.map((s) => ({
        seq: s.seq,
        stationKind: s.stationKind,
        standardMinutes: standardMinutes(s, t.quantity),
        cureMinutes: s.cureMinutes,
      })),
      startedAt: t.startedAt,
      waitingSince: t.waitingSince,
      cureReadyAt: t.cureReadyAt,
      finishedAt: t.lastEventAt,
      onHold: t.onHold,
    };
  });
  const p = projectTrays(outlooks, { now, calendar, queueSamples: {}, runs: 0, defaultQueueMinutes: SIMPLE_QUEUE_MINUTES });
  return { expectedAt: p.expectedAt, basis: BASIS_TEXT, note: SIMPLE_NOTE };
}

/** Ship dates of these orders from the projection service (orders it does not cover are left out). */
export function measuredShipDates(deps: AppDeps, orderIds: string[]): Map<string, ShipDate> {
  const out = new Map<string, ShipDate>();
  if (orderIds.length === 0) return out;
  // only orders on the floor have a projection: asking for others (an order being entered, paid
  // for or approved) must not run the whole floor's simulation
  const open = new Set(projectionRepository.openOrders(deps.db).map((o) => o.id));
  if (!orderIds.some((id) => open.has(id))) return out;
  try {
    for (const [id, p] of projectionService.forOrders(deps, orderIds)) {
      if (p.expectedAt != null) out.set(id, { expectedAt: Date.parse(p.expectedAt), basis: p.explanation, note: p.explanationNote });
    }
  } catch (err) {
    // The simple projection stands in; a sales screen must not fail because of a projection.
    deps.log.warn({ err: (err as Error).message }, 'projection service failed; using the simple projection');
  }
  return out;
}

export const shipDateService = {
  timeZone: (deps: AppDeps) => shippingRepository.factory(deps.db).timeZone,
  projectOrder,
  measuredShipDates,
};
