// Where a traveller stands, read at a moment: one rule for the scan guards, WIP, the wall, loads,
// the tablet and the simulator. A tray whose cure has run its time still stands at the oven
// (phase `curing` in tray_states) but is ready: it waits for its next step from the moment the
// cure ended.
import type { TrayPhase, TrayState } from '../vocabulary';

const toMs = (t: Date | string | number) => (typeof t === 'number' ? t : typeof t === 'string' ? Date.parse(t) : t.getTime());

/** True when a tray in the oven has cured for its minimum time at `nowMs`. */
export function cureHasRun(phase: TrayPhase, cureReadyAtMs: number | null, nowMs: number): boolean {
  return phase === 'curing' && cureReadyAtMs != null && cureReadyAtMs <= nowMs;
}

/**
 * The phase to show: a tray whose cure has run its time stands at the oven but is ready, which
 * for WIP and the station screens means it is waiting for its next step.
 */
export function effectivePhase(state: Pick<TrayState, 'phase' | 'cureReadyAt'>, now: Date | string | number): TrayPhase {
  return cureHasRun(state.phase, state.cureReadyAt ? Date.parse(state.cureReadyAt) : null, toMs(now)) ? 'waiting' : state.phase;
}

/** What a floor count needs to know about one open traveller (times in ms, as tray_states keeps them). */
export interface FloorTraveller {
  phase: 'waiting' | 'in_process' | 'curing';
  /** kind of the current step (the one waited for, or in process) */
  stationKind: string | null;
  /** kind of the step after the current one */
  nextKind: string | null;
  waitingSince: number | null;
  cureReadyAt: number | null;
  releasedAt: number;
}

export interface FloorPlace {
  phase: 'waiting' | 'in_process' | 'curing';
  /** the station kind it counts under */
  kind: string;
  /** waiting: since when (ms) */
  waitingSince: number | null;
}

/**
 * Where a traveller counts on the floor now: waiting at the kind of its next step, or in
 * process / curing at the kind of the step it started. A cured tray waits for the step after
 * the cure from the moment the cure ended; a cured tray with no step after stays at the oven.
 */
export function floorPlace(t: FloorTraveller, nowMs: number): FloorPlace | null {
  if (cureHasRun(t.phase, t.cureReadyAt, nowMs)) {
    if (!t.nextKind) return t.stationKind ? { phase: 'curing', kind: t.stationKind, waitingSince: null } : null;
    return { phase: 'waiting', kind: t.nextKind, waitingSince: t.cureReadyAt };
  }
  if (!t.stationKind) return null;
  if (t.phase === 'waiting') return { phase: 'waiting', kind: t.stationKind, waitingSince: t.waitingSince ?? t.releasedAt };
  return { phase: t.phase, kind: t.stationKind, waitingSince: null };
}
