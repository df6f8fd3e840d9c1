// The scan guards: one pure state machine that the server, the tablet (offline) and the demo
// history simulator all use, so all three give the same answer for the same scan.
//
// How a step moves
// ----------------
// - A tray waits for the step `stepSeq` (phase `waiting`). A `start` at a station whose kind is
//   that step's kind puts it `in_process` at that station. A `finish` there closes the step with
//   good, scrap and rework counts and moves the good pieces on to wait for the next step.
// - Pieces are conserved: pieces in = good + scrap at every step. Rework pieces were reworked
//   at this step and ended up good: they are part of `goodQty` (0 <= rework <= good) and are
//   kept apart only so first-pass yield can count them as not passed. A tray whose good count
//   is 0 is `scrapped`; a tray that finishes its last step is `done`.
//
// How a cure step works
// ---------------------
// A cure step is started when the tray goes into the oven: phase `curing`, at the oven's
// station, with `cureReadyAt` = start + the step's `cureMinutes`. From `cureReadyAt` on the tray
// is ready: it still stands at the oven (phase `curing`, see `effectivePhase`) until either
//   - the oven operator scans it out (`finish` at a cure station, with counts, for pieces that
//     cracked in the oven); a finish before `cureReadyAt` is refused `curing` with the minutes
//     left; or
//   - the next step starts (the usual case: the filler takes the tray from the oven rack). The
//     cure step is then closed on its own at `cureReadyAt` with every piece good, and queue time
//     for the next step runs from `cureReadyAt`. A start before `cureReadyAt` is refused
//     `curing` with the minutes left.
// So the oven needs only one scan, and the interlock holds whichever way the tray leaves.
// A supervisor override lets an early cure finish or start through; the cure step then ends at
// the moment of the overridden scan.
//
// Overrides
// ---------
// An override names one guard (`wrong_station`, `curing` or `release`), one traveller and one
// station; the caller checks the traveller, the station, the expiry and that it is used once, the
// guard that its kind is the guard being passed. It lets through only that guard:
// - a `wrong_station` override does the awaited step at this station. It never skips a step, and
//   never stands in for a cure: a cure step is done in an oven, and a tray still curing needs
//   a `curing` override to leave early;
// - a `curing` override lets the next step start (or the oven finish) before the cure has run;
// - a `release` override lets an operator lift a hold.
// A scan that two guards refuse needs two scans (one override each); every other refusal stands
// whatever the override.
//
// Time
// ----
// `occurredAt` may not be more than 2 minutes ahead of the server clock, more than 7 days old,
// earlier than the traveller's release, or earlier than the traveller's last accepted event
// (history is append-only: a late event cannot be slotted in before later ones).

import type { RejectionCode, Role, RoutingStep, ScanType, StationKind, TrayState } from './vocabulary';
import { cures, kindsWhere } from './traveller/station-kinds';
import { effectivePhase } from './traveller/phase';
import { iso } from './time-zone';

export { effectivePhase };

export const MAX_AHEAD_MS = 2 * 60_000;
export const MAX_AGE_MS = 7 * 24 * 60 * 60_000;
const MINUTE_MS = 60_000;

/** Station kinds whose steps need the order's mould to be ready before a tray may start. */
export const MOULD_KINDS: readonly StationKind[] = kindsWhere((t) => t.needsMould);

/** Roles that may release a held tray without a separate override. */
export const RELEASE_ROLES: readonly Role[] = ['supervisor', 'admin'];

/** What the traveller-code check found for the scanned code (decided outside this module). */
export type TravellerVerdict =
  { status: 'valid' } | { status: 'unknown' } | { status: 'forged' } | { status: 'void'; currentRevision?: number | null; currentNumber?: string | null };

export interface GuardStation {
  id: string;
  kind: StationKind;
  name?: string;
}

export interface GuardEvent {
  type: ScanType;
  occurredAt: string;
  goodQty?: number | null;
  scrapQty?: number | null;
  reworkQty?: number | null;
  scrapReason?: string | null;
  note?: string | null;
}

/** The guards an override can name. */
export const OVERRIDE_KINDS = ['wrong_station', 'curing', 'release'] as const;
export type OverrideKind = (typeof OVERRIDE_KINDS)[number];

/** An override the caller has checked: a supervisor's, for this traveller and station, with a reason. */
export interface ValidOverride {
  id: string;
  supervisorId: string;
  reason: string;
  /** the one guard it lets through */
  kind: OverrideKind;
}

export interface GuardInput {
  /** default: valid */
  traveller?: TravellerVerdict;
  /** null: no such traveller */
  state: TrayState | null;
  routing: readonly RoutingStep[];
  station: GuardStation;
  event: GuardEvent;
  /** the server clock (on a tablet: its own clock corrected by the measured offset) */
  now: Date | string | number;
  /** whether the traveller's order has its moulds ready; default true */
  mouldReady?: boolean;
  override?: ValidOverride | null;
  /** role of the person scanning; a supervisor may release without an override */
  actorRole?: Role | null;
  /** the admin's reason codes; when given, a scrap or hold reason must be one of them */
  reasonCodes?: readonly string[] | null;
}

export type RefusalParams = Record<string, string | number | null>;

export interface Refusal {
  ok: false;
  code: RejectionCode;
  params: RefusalParams;
  /** only for `curing` */
  minutesLeft?: number;
  /** a supervisor override would let this scan through */
  overridable: boolean;
}

/** A step closed by an accepted event. */
export interface StepRecord {
  seq: number;
  name: string;
  stationKind: StationKind;
  quantityIn: number;
  good: number;
  scrap: number;
  rework: number;
  scrapReason: string | null;
  startedAt: string | null;
  finishedAt: string;
  /** start → finish (for a cure step: time in the oven counted to the moment it closed) */
  processMinutes: number | null;
  /** true when a cure step closed on its own because the next step started */
  implicit: boolean;
}

export interface ScanFacts {
  /** the step this event applied to (after any override jump) */
  stepSeq: number | null;
  /** for a start: time the tray waited (last finish or cure ready → start) */
  queueMinutes?: number;
  /** for a start: when the tray became ready for the step it started (never after the start) */
  readyAt?: string;
  /** for a finish: start → finish */
  processMinutes?: number;
  /** steps this event closed, in order (an implicit cure close comes before a start) */
  completed: StepRecord[];
  /** refusals the override let through (empty: no override needed; at most one) */
  overridden: RejectionCode[];
  /** set when an overridden start did the awaited step at a station of another kind */
  substitutedKind?: StationKind;
}

export interface Acceptance {
  ok: true;
  next: TrayState;
  facts: ScanFacts;
}

export type GuardResult = Acceptance | Refusal;

function toMs(t: Date | string | number): number {
  if (t instanceof Date) return t.getTime();
  if (typeof t === 'number') return t;
  return Date.parse(t);
}

/** Whole minutes until `readyMs`, rounded up: 59 s left is "1 minute left". */
export function minutesUntil(fromMs: number, readyMs: number): number {
  return Math.max(0, Math.ceil((readyMs - fromMs) / MINUTE_MS));
}

/** A count as a refusal parameter: a number that JSON can carry (NaN and infinities become null). */
function num(n: unknown): number | null {
  return typeof n === 'number' && Number.isFinite(n) ? n : null;
}

function refuse(code: RejectionCode, params: RefusalParams = {}, overridable = false): Refusal {
  return { ok: false, code, params, overridable };
}

function stepAt(routing: readonly RoutingStep[], seq: number | null): RoutingStep | undefined {
  if (seq == null) return undefined;
  return routing.find((s) => s.seq === seq);
}

function lastStepSeq(routing: readonly RoutingStep[]): number {
  return routing.reduce((m, s) => Math.max(m, s.seq), 0);
}

/** The time of the traveller's last accepted event, derived when the state does not carry it. */
export function lastEventTime(state: TrayState): number {
  if (state.lastEventAt) return Date.parse(state.lastEventAt);
  let t = Date.parse(state.releasedAt);
  for (const v of [state.startedAt, state.waitingSince]) if (v) t = Math.max(t, Date.parse(v));
  return t;
}

/** The step a start at this moment would be waiting for (the step after a cure that is in the oven). */
export function awaitedStep(state: TrayState, routing: readonly RoutingStep[]): RoutingStep | undefined {
  if (state.phase === 'curing') return stepAt(routing, (state.stepSeq ?? 0) + 1);
  if (state.phase === 'waiting') return stepAt(routing, state.stepSeq);
  return undefined;
}

function checkTime(state: TrayState, occurredMs: number, nowMs: number): Refusal | null {
  const at = iso(occurredMs);
  if (occurredMs > nowMs + MAX_AHEAD_MS) return refuse('bad_time', { reason: 'future', occurredAt: at, limit: iso(nowMs + MAX_AHEAD_MS) });
  if (occurredMs < nowMs - MAX_AGE_MS) return refuse('bad_time', { reason: 'too_old', occurredAt: at, limit: iso(nowMs - MAX_AGE_MS) });
  const released = Date.parse(state.releasedAt);
  if (occurredMs < released) return refuse('bad_time', { reason: 'before_release', occurredAt: at, limit: state.releasedAt });
  const last = lastEventTime(state);
  if (occurredMs < last) return refuse('bad_time', { reason: 'before_last_event', occurredAt: at, limit: iso(last) });
  return null;
}

function stepParams(step: RoutingStep | undefined, prefix = 'step'): RefusalParams {
  return {
    [`${prefix}Seq`]: step?.seq ?? null,
    [`${prefix}Name`]: step?.name ?? null,
    [`${prefix}Kind`]: step?.stationKind ?? null,
  };
}

function closeStep(
  step: RoutingStep,
  quantityIn: number,
  counts: { good: number; scrap: number; rework: number; reason: string | null },
  startedAt: string | null,
  finishedMs: number,
  implicit: boolean,
): StepRecord {
  return {
    seq: step.seq,
    name: step.name,
    stationKind: step.stationKind,
    quantityIn,
    good: counts.good,
    scrap: counts.scrap,
    rework: counts.rework,
    scrapReason: counts.reason,
    startedAt,
    finishedAt: iso(finishedMs),
    processMinutes: startedAt ? (finishedMs - Date.parse(startedAt)) / MINUTE_MS : null,
    implicit,
  };
}

/** The state after a step closes with `good` pieces: wait for the next step, done or scrapped. */
function afterClose(
  state: TrayState,
  routing: readonly RoutingStep[],
  step: RoutingStep,
  good: number,
  closedMs: number,
  cureReadyAt: string | null,
): TrayState {
  const base = { ...state, stationId: null, startedAt: null, quantity: good };
  if (good === 0) return { ...base, phase: 'scrapped', stepSeq: null, waitingSince: null, cureReadyAt: null };
  if (step.seq >= lastStepSeq(routing)) return { ...base, phase: 'done', stepSeq: null, waitingSince: null, cureReadyAt: null };
  return { ...base, phase: 'waiting', stepSeq: step.seq + 1, waitingSince: iso(closedMs), cureReadyAt };
}

/** Decide one scan. Pure: the same input always gives the same answer. */
export function evaluateScan(input: GuardInput): GuardResult {
  const verdict = input.traveller ?? { status: 'valid' };
  if (verdict.status === 'unknown') return refuse('unknown_tray');
  if (verdict.status === 'forged') return refuse('bad_signature');
  if (verdict.status === 'void') {
    return refuse('void_traveller', {
      currentRevision: verdict.currentRevision ?? null,
      currentNumber: verdict.currentNumber ?? null,
    });
  }
  const state = input.state;
  if (!state) return refuse('unknown_tray');

  const { event } = input;
  const occurredMs = Date.parse(event.occurredAt);
  const nowMs = toMs(input.now);
  if (Number.isNaN(occurredMs)) return refuse('bad_time', { reason: 'unreadable', occurredAt: event.occurredAt, limit: null });
  const timeRefusal = checkTime(state, occurredMs, nowMs);
  if (timeRefusal) return timeRefusal;

  if (state.phase === 'done' || state.phase === 'scrapped' || state.phase === 'merged') {
    return refuse('finished', { phase: state.phase });
  }
  const stamp = (s: TrayState): TrayState => ({ ...s, lastEventAt: iso(occurredMs) });

  switch (event.type) {
    case 'hold':
      return hold(input, state, occurredMs, stamp);
    case 'release':
      return release(input, state, stamp);
    case 'start':
      return start(input, state, occurredMs, stamp);
    case 'finish':
      return finish(input, state, occurredMs, stamp);
  }
}

type Stamp = (s: TrayState) => TrayState;

function noFacts(stepSeq: number | null): ScanFacts {
  return { stepSeq, completed: [], overridden: [] };
}

function reasonKnown(input: GuardInput, reason: string): boolean {
  return !input.reasonCodes || input.reasonCodes.includes(reason);
}

function hold(input: GuardInput, state: TrayState, _occurredMs: number, stamp: Stamp): GuardResult {
  if (state.onHold) return refuse('on_hold', { holdReason: state.holdReason });
  const reason = input.event.scrapReason?.trim() || null;
  const note = input.event.note?.trim() || null;
  if (!reason && !note) return refuse('scrap_reason_missing', { for: 'hold', scrap: null });
  if (reason && !reasonKnown(input, reason)) return refuse('scrap_reason_missing', { for: 'hold', scrap: null, reason });
  const next = stamp({ ...state, onHold: true, holdReason: reason ?? note });
  return { ok: true, next, facts: noFacts(state.stepSeq) };
}

function release(input: GuardInput, state: TrayState, stamp: Stamp): GuardResult {
  if (!state.onHold) return refuse('not_on_hold');
  const bySupervisor = input.actorRole != null && RELEASE_ROLES.includes(input.actorRole);
  if (!bySupervisor && input.override?.kind !== 'release') return refuse('bad_override', { reason: 'release_needs_supervisor' });
  const next = stamp({ ...state, onHold: false, holdReason: null });
  return { ok: true, next, facts: noFacts(state.stepSeq) };
}

function start(input: GuardInput, state: TrayState, occurredMs: number, stamp: Stamp): GuardResult {
  const { station, routing } = input;
  if (state.onHold) return refuse('on_hold', { holdReason: state.holdReason });
  const current = stepAt(routing, state.stepSeq);
  if (!current) return refuse('finished', { phase: state.phase });

  if (state.phase === 'in_process') {
    return refuse('already_started', { ...stepParams(current), stationId: state.stationId, startedAt: state.startedAt });
  }
  if (state.phase === 'curing' && station.kind === current.stationKind) {
    return refuse('already_started', { ...stepParams(current), stationId: state.stationId, startedAt: state.startedAt });
  }

  // The step this start is for: the waiting step, or the step after the cure in the oven.
  const awaited = awaitedStep(state, routing);
  if (!awaited) return refuse('finished', { phase: state.phase });

  const overridden: RejectionCode[] = [];
  const target = awaited;
  let substitutedKind: StationKind | undefined;

  if (station.kind !== awaited.stationKind) {
    const params = { ...stepParams(awaited, 'expected'), stationKind: station.kind, stationName: station.name ?? null, action: 'start' };
    // A cure is done in an oven: no override makes another station stand in for it.
    if (cures(awaited.stationKind)) return refuse('wrong_station', params, false);
    if (input.override?.kind !== 'wrong_station') return refuse('wrong_station', params, true);
    overridden.push('wrong_station');
    substitutedKind = station.kind;
  }

  if (state.kind === 'tray' && MOULD_KINDS.includes(target.stationKind) && input.mouldReady === false) {
    return refuse('mould_not_ready', stepParams(target));
  }

  // The cure interlock: the cure in the oven (or the one just taken out) must have run its time.
  const readyMs = state.cureReadyAt ? Date.parse(state.cureReadyAt) : null;
  const early = readyMs != null && occurredMs < readyMs;
  if (early && input.override?.kind !== 'curing') {
    const minutesLeft = minutesUntil(occurredMs, readyMs);
    const cureStep = state.phase === 'curing' ? current : stepAt(routing, awaited.seq - 1);
    return {
      ...refuse('curing', { minutesLeft, readyAt: state.cureReadyAt, ...stepParams(cureStep, 'cure'), ...stepParams(awaited) }, true),
      minutesLeft,
    };
  }
  if (early) overridden.push('curing');

  const completed: StepRecord[] = [];
  let waitingFromMs = state.waitingSince ? Date.parse(state.waitingSince) : occurredMs;
  if (state.phase === 'curing') {
    // The cure step closes on its own, every piece good, when its time ran out (or now, if overridden early).
    const closedMs = readyMs != null ? Math.min(readyMs, occurredMs) : occurredMs;
    completed.push(closeStep(current, state.quantity, { good: state.quantity, scrap: 0, rework: 0, reason: null }, state.startedAt, closedMs, true));
    waitingFromMs = closedMs;
  }

  const isCure = cures(target.stationKind) && cures(station.kind);
  const cureMinutes = isCure ? (target.cureMinutes ?? 0) : 0;
  const next = stamp({
    ...state,
    phase: isCure ? 'curing' : 'in_process',
    stepSeq: target.seq,
    stationId: station.id,
    startedAt: iso(occurredMs),
    waitingSince: null,
    cureReadyAt: isCure ? iso(occurredMs + cureMinutes * MINUTE_MS) : null,
  });
  return {
    ok: true,
    next,
    facts: {
      stepSeq: target.seq,
      queueMinutes: Math.max(0, (occurredMs - waitingFromMs) / MINUTE_MS),
      readyAt: iso(Math.min(waitingFromMs, occurredMs)),
      completed,
      overridden,
      ...(substitutedKind ? { substitutedKind } : {}),
    },
  };
}

function finish(input: GuardInput, state: TrayState, occurredMs: number, stamp: Stamp): GuardResult {
  const { station, routing, event } = input;
  if (state.onHold) return refuse('on_hold', { holdReason: state.holdReason });
  const current = stepAt(routing, state.stepSeq);
  if (!current) return refuse('finished', { phase: state.phase });

  if (state.phase === 'waiting') return refuse('not_started', { ...stepParams(current), stationKind: station.kind });

  const overridden: RejectionCode[] = [];
  const here = station.id === state.stationId || station.kind === current.stationKind;
  if (!here) {
    const after = stepAt(routing, current.seq + 1);
    if (state.phase === 'curing' && after && station.kind === after.stationKind) {
      return refuse('not_started', { ...stepParams(after), stationKind: station.kind });
    }
    // A cure is finished at its oven only; a wrong-station override cannot take a tray out of it.
    const overridable = state.phase !== 'curing';
    if (!overridable || input.override?.kind !== 'wrong_station') {
      return refuse(
        'wrong_station',
        { ...stepParams(current, 'expected'), stationKind: station.kind, stationName: station.name ?? null, action: 'finish' },
        overridable,
      );
    }
    overridden.push('wrong_station');
  }

  let cureReadyAt: string | null = null;
  if (state.phase === 'curing') {
    const readyMs = state.cureReadyAt ? Date.parse(state.cureReadyAt) : occurredMs;
    if (occurredMs < readyMs) {
      if (input.override?.kind !== 'curing') {
        const minutesLeft = minutesUntil(occurredMs, readyMs);
        return {
          ...refuse('curing', { minutesLeft, readyAt: state.cureReadyAt, ...stepParams(current, 'cure'), ...stepParams(current) }, true),
          minutesLeft,
        };
      }
      overridden.push('curing');
      cureReadyAt = iso(occurredMs);
    } else {
      cureReadyAt = state.cureReadyAt;
    }
  }

  // Counts are whole, not negative, and conserve the pieces: good + scrap = pieces in, rework
  // within good. Checked here for every caller (tablet, server, simulator), not only by the wire schema.
  const quantityIn = state.quantity;
  const scrap = event.scrapQty ?? 0;
  const good = event.goodQty ?? quantityIn - scrap;
  const rework = event.reworkQty ?? 0;
  const whole = (n: number) => typeof n === 'number' && Number.isSafeInteger(n) && n >= 0;
  if (!whole(good) || !whole(scrap) || !whole(rework) || good > quantityIn || good + scrap !== quantityIn || rework > good) {
    return refuse('quantity_mismatch', { quantityIn, good: num(good), scrap: num(scrap), rework: num(rework) });
  }
  const reason = event.scrapReason?.trim() || null;
  if (scrap > 0 && !reason) return refuse('scrap_reason_missing', { for: 'scrap', scrap });
  if (scrap > 0 && reason && !reasonKnown(input, reason)) return refuse('scrap_reason_missing', { for: 'scrap', scrap, reason });

  const record = closeStep(current, quantityIn, { good, scrap, rework, reason: scrap > 0 ? reason : null }, state.startedAt, occurredMs, false);
  const next = stamp(afterClose(state, routing, current, good, occurredMs, cureReadyAt));
  return {
    ok: true,
    next,
    facts: {
      stepSeq: current.seq,
      processMinutes: record.processMinutes ?? undefined,
      completed: [record],
      overridden,
    },
  };
}

/** Apply a list of scans in order (the demo simulator and tests use it); refused scans leave the state as it was. */
export function applyScans(state: TrayState, steps: ReadonlyArray<Omit<GuardInput, 'state'>>): { state: TrayState; results: GuardResult[] } {
  let current = state;
  const results: GuardResult[] = [];
  for (const s of steps) {
    const r = evaluateScan({ ...s, state: current });
    results.push(r);
    if (r.ok) current = r.next;
  }
  return { state: current, results };
}
