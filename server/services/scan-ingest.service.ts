// The scan write path: POST /api/scans. Each batch is read in a few queries, every event guarded
// against the tray's state (shared/domain/guards.ts), written, and answered in the order sent;
// batches that arrive together share one transaction (group commit). Refusals that a late scan
// from another tablet makes right are tried again here too.
import { boundedPayload } from '@shared/domain/bounded-payload';
import crypto from 'node:crypto';
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import type { DeviceAuth, SessionUser } from '../http/api';
import {
  scansRepository,
  type OverrideRow,
  type RejectionInsert,
  type RejectionRow,
  type ScanEventInsert,
  type TrayRow,
} from '../repositories/scans.repository';
import { auditRepository } from '../repositories/audit.repository';
import { rowFromState, stateFromRow, trayStatesRepository } from '../repositories/tray-states.repository';
import { notifyFloorChanged } from './live-bus';
import { toRoutingStep } from './order-spec.service';
import { evaluateScan, lastEventTime, type GuardResult, type RefusalParams, type TravellerVerdict, type ValidOverride } from '@shared/domain/guards';
import { refusalText } from '@shared/domain/scan-messages';
import { parseTravellerCode, verifyTravellerCode } from '@shared/domain/traveller-code';
import { initialTrayState, type RejectionCode, type Role, type RoutingStep, type StationKind, type TrayState } from '@shared/domain/vocabulary';
import { scanEventSchema, type ScanEvent, type ScanResult, type ScanTray, type ScanBatchResponse } from '@shared/schemas/scans';

/** Refusals that a scan arriving late from another tablet can make right; they are tried again. */
export const RETRYABLE_CODES: readonly RejectionCode[] = ['wrong_station', 'not_started', 'already_started', 'on_hold'];

export interface ScanCaller {
  user: SessionUser | null;
  device: DeviceAuth | null;
}

/** Accepted scans, for listeners (the live wall, order status) that run in or after the batch's transaction. */
export interface AcceptedScan {
  eventId: string;
  trayId: string;
  orderId: string;
  type: ScanEvent['type'];
  stationId: string;
  stationKind: StationKind;
  occurredAt: number;
  state: TrayState;
}

/** A listener that runs inside each scan batch's transaction (keep it quick; throw only for a bug). */
export type ScanHook = (tx: DbLike, accepted: AcceptedScan[], deps: AppDeps) => void;

const hooks = new WeakMap<object, ScanHook[]>();

/**
 * Other features react to accepted scans through a hook instead of editing this service; createApp
 * adds the app's own (server/app.ts). Hooks belong to one database. Returns a remover.
 */
export function addScanHook(deps: Pick<AppDeps, 'db'>, hook: ScanHook): () => void {
  let list = hooks.get(deps.db);
  if (!list) hooks.set(deps.db, (list = []));
  if (!list.includes(hook)) list.push(hook);
  return () => {
    const i = list.indexOf(hook);
    if (i >= 0) list.splice(i, 1);
  };
}

export function traySummary(tray: TrayRow, state: TrayState, routing: readonly RoutingStep[]): ScanTray {
  const step = state.stepSeq == null ? undefined : routing.find((r) => r.seq === state.stepSeq);
  return {
    id: tray.id,
    number: tray.number,
    kind: tray.kind,
    phase: state.phase,
    stepSeq: state.stepSeq,
    stepName: step?.name ?? null,
    quantity: state.quantity,
    onHold: state.onHold,
    cureReadyAt: state.cureReadyAt,
  };
}

/** What a batch needs from the database, loaded in a few queries and cached for the batch. */
export class BatchData {
  readonly traysByNumber = new Map<string, TrayRow>();
  readonly traysById = new Map<string, TrayRow>();
  readonly states = new Map<string, TrayState>();
  readonly routings = new Map<string, RoutingStep[]>();
  readonly mouldReady = new Map<string, boolean>();
  readonly stations: Map<string, { id: string; code: string; name: string; kind: StationKind; active: boolean }>;
  readonly reasonCodes: string[];
  readonly reasonNames: Map<string, string>;
  readonly overrides = new Map<string, OverrideRow>();
  readonly usedOverrides = new Set<string>();

  constructor(
    private readonly db: DbLike,
    readonly travellerKey: Uint8Array,
  ) {
    this.stations = new Map(scansRepository.stations(db).map((s) => [s.id, { ...s, kind: s.kind as StationKind }]));
    this.reasonCodes = scansRepository.reasonCodes(db);
    this.reasonNames = scansRepository.reasonNames(db);
  }

  /** Refusal params with a hold reason's code replaced by its name, for texts people read. */
  named(params: RefusalParams): RefusalParams {
    const code = params.holdReason;
    return typeof code === 'string' && this.reasonNames.has(code) ? { ...params, holdReason: this.reasonNames.get(code)! } : params;
  }

  loadTrays(numbers: string[], ids: string[] = []) {
    const wantNumbers = numbers.filter((n) => !this.traysByNumber.has(n));
    const rows = scansRepository.traysByNumbers(this.db, [...new Set(wantNumbers)]);
    for (const id of ids) {
      if (this.traysById.has(id)) continue;
      const t = scansRepository.trayById(this.db, id);
      if (t) rows.push(t);
    }
    for (const t of rows) {
      this.traysByNumber.set(t.number, t);
      this.traysById.set(t.id, t);
    }
    const newIds = rows.map((t) => t.id).filter((id) => !this.states.has(id));
    for (const s of trayStatesRepository.byTrayIds(this.db, newIds)) this.states.set(s.trayId, stateFromRow(s));
    for (const t of rows) {
      // A traveller released before states were kept starts at its first step.
      if (!this.states.has(t.id)) {
        this.states.set(t.id, initialTrayState({ trayId: t.id, kind: t.kind, quantity: t.quantity, releasedAt: new Date(t.releasedAt).toISOString() }));
      }
    }
    const orderIds = [...new Set(rows.map((t) => t.orderId))].filter((o) => !this.routings.has(`${o}:tray`));
    for (const o of orderIds) {
      this.routings.set(`${o}:tray`, []);
      this.routings.set(`${o}:mould`, []);
      this.mouldReady.set(o, true);
    }
    for (const step of scansRepository.stepsByOrders(this.db, orderIds)) this.routings.get(`${step.orderId}:${step.travellerKind}`)!.push(toRoutingStep(step));
    for (const m of scansRepository.mouldsNotReady(this.db, orderIds)) this.mouldReady.set(m.orderId, !(m.notReady > 0));
  }

  loadOverrides(ids: string[]) {
    for (const o of scansRepository.overridesByIds(
      this.db,
      ids.filter((id) => !this.overrides.has(id)),
    ))
      this.overrides.set(o.id, o);
  }

  routing(tray: TrayRow): RoutingStep[] {
    return this.routings.get(`${tray.orderId}:${tray.kind}`) ?? [];
  }
}

interface Operator {
  id: string;
  role: Role;
}

export interface Evaluated {
  result: GuardResult;
  tray: TrayRow | null;
  before: TrayState | null;
  override: ValidOverride | null;
  stationKind: StationKind | null;
}

interface PreparedEvent {
  event: ScanEvent;
  operator: Operator | null;
  operatorProblem: string | null;
  /** the sending tablet's own station: it may record scans there only (null: not sent by a tablet) */
  tabletStation?: string | null;
}

/** Decides one event against the batch's current view of its tray (no writes). */
function evaluate(data: BatchData, p: PreparedEvent, now: number): Evaluated {
  const { event } = p;
  const station = data.stations.get(event.stationId);
  if (!station || !station.active) {
    return { result: invalid('unknown_station'), tray: null, before: null, override: null, stationKind: null };
  }
  if (!p.operator) return { result: invalid(p.operatorProblem ?? 'operator_unknown'), tray: null, before: null, override: null, stationKind: station.kind };
  if (p.tabletStation !== undefined && p.tabletStation !== null && p.tabletStation !== station.id) {
    const own = data.stations.get(p.tabletStation);
    const number = parseTravellerCode(event.code)?.number;
    const tray = number ? (data.traysByNumber.get(number) ?? null) : null;
    return {
      result: {
        ok: false,
        code: 'station_not_allowed',
        params: { stationId: station.id, stationName: station.name, tabletStationId: p.tabletStation, tabletStationName: own?.name ?? null },
        overridable: false,
      },
      tray,
      before: tray ? (data.states.get(tray.id) ?? null) : null,
      override: null,
      stationKind: station.kind,
    };
  }

  const parsed = parseTravellerCode(event.code);
  const tray = parsed ? (data.traysByNumber.get(parsed.number) ?? null) : null;
  let verdict: TravellerVerdict = { status: 'valid' };
  if (!parsed || !tray) verdict = { status: 'unknown' };
  else {
    if (parsed.form === 'qr' && !macValid(data.travellerKey, event.code, parsed)) verdict = { status: 'forged' };
    else if (parsed.form === 'qr' && parsed.revision !== tray.revision)
      verdict = { status: 'void', currentRevision: tray.revision, currentNumber: tray.number };
  }
  const before = tray ? data.states.get(tray.id)! : null;

  let override: ValidOverride | null = null;
  if (event.overrideId) {
    const o = data.overrides.get(event.overrideId);
    // One traveller, one station, once, before it expires; the guard checks it names the guard passed.
    const usable =
      o &&
      tray &&
      o.trayId === tray.id &&
      o.stationId === event.stationId &&
      o.expiresAt >= now &&
      (!o.usedEventId || o.usedEventId === event.id) &&
      !data.usedOverrides.has(o.id);
    if (!usable)
      return {
        result: { ok: false, code: 'bad_override', params: { reason: 'invalid' }, overridable: false },
        tray,
        before,
        override: null,
        stationKind: station.kind,
      };
    override = { id: o.id, supervisorId: o.supervisorId, reason: o.reason, kind: o.kind };
  }

  const result = evaluateScan({
    traveller: verdict,
    state: before,
    routing: tray ? data.routing(tray) : [],
    station: { id: station.id, kind: station.kind, name: station.name },
    event,
    now,
    mouldReady: tray ? (data.mouldReady.get(tray.orderId) ?? true) : true,
    override,
    actorRole: p.operator.role,
    reasonCodes: data.reasonCodes,
  });
  return { result, tray, before, override, stationKind: station.kind };
}

/**
 * Whether a QR code's MAC is right. A tray is scanned at every step, so each code's answer is
 * remembered (per key; a bounded map) rather than computed again: the revision is still compared
 * with the tray's current one on every scan.
 */
const macCache = new WeakMap<Uint8Array, Map<string, boolean>>();
const MAC_CACHE_MAX = 50_000;
function macValid(key: Uint8Array, code: string, parsed: NonNullable<ReturnType<typeof parseTravellerCode>>): boolean {
  let cache = macCache.get(key);
  if (!cache) macCache.set(key, (cache = new Map()));
  const known = cache.get(code);
  if (known !== undefined) return known;
  // verified against its own revision: only the MAC is in question here
  const ok = verifyTravellerCode(parsed, key, parsed.form === 'qr' ? parsed.revision : 1).status !== 'bad_signature';
  if (cache.size >= MAC_CACHE_MAX) cache.delete(cache.keys().next().value!);
  cache.set(code, ok);
  return ok;
}

function invalid(reason: string): GuardResult {
  return { ok: false, code: 'invalid_event', params: { reason }, overridable: false };
}

/**
 * The row an accepted event appends. A cure step that closes on its own when the next step starts
 * gets no row of its own: the log keeps only what people scanned, and the report facts derive
 * the close from the cure time (server/services/report-facts.service.ts, same rule as the guards).
 */
function eventRows(e: Evaluated & { result: Extract<GuardResult, { ok: true }> }, p: PreparedEvent, deviceId: string | null, now: number): ScanEventInsert[] {
  const { event } = p;
  const { facts } = e.result;
  const rows: ScanEventInsert[] = [];
  const own = facts.completed.find((c) => !c.implicit);
  rows.push({
    id: event.id,
    trayId: e.tray!.id,
    type: event.type,
    stepSeq: facts.stepSeq,
    stationId: event.stationId,
    stationKind: e.stationKind,
    deviceId,
    userId: p.operator!.id,
    occurredAt: Date.parse(event.occurredAt),
    receivedAt: now,
    qtyIn: event.type === 'start' || event.type === 'finish' ? (own?.quantityIn ?? e.before!.quantity) : null,
    goodQty: own ? own.good : null,
    scrapQty: own ? own.scrap : null,
    reworkQty: own ? own.rework : null,
    scrapReason: event.type === 'hold' ? (event.scrapReason ?? null) : (own?.scrapReason ?? null),
    overrideId: e.override?.id ?? null,
    note: event.note ?? null,
  });
  return rows;
}

export function refusalResult(id: string, e: Evaluated, data: BatchData): ScanResult {
  const r = e.result as Extract<GuardResult, { ok: false }>;
  return {
    id,
    status: 'rejected',
    code: r.code,
    message: refusalText(r.code, data.named(r.params)),
    ...(r.minutesLeft != null ? { minutesLeft: r.minutesLeft } : {}),
    params: r.params,
    ...(e.tray && e.before ? { tray: traySummary(e.tray, e.before, data.routing(e.tray)) } : {}),
  };
}

function rejectionRow(
  p: PreparedEvent | null,
  raw: unknown,
  e: Evaluated | null,
  code: RejectionCode,
  params: Record<string, unknown>,
  deviceId: string | null,
  userId: string | null,
  now: number,
): RejectionInsert {
  const event = p?.event;
  const rawId = typeof (raw as { id?: unknown })?.id === 'string' ? (raw as { id: string }).id.slice(0, 100) : '';
  const occurred = event ? Date.parse(event.occurredAt) : NaN;
  return {
    id: crypto.randomUUID(),
    eventId: event?.id ?? rawId,
    trayId: e?.tray?.id ?? null,
    stationId: event?.stationId ?? null,
    deviceId,
    userId,
    code,
    message: refusalText(code, params as Record<string, string | number | null>),
    payload: { event: event ?? boundedPayload(raw), params },
    occurredAt: Number.isNaN(occurred) ? null : occurred,
    receivedAt: now,
  };
}

/** Who scanned: the operator the tablet names (proved by a sign-in on that tablet), else the caller. */
function resolveOperators(db: DbLike, events: ScanEvent[], caller: ScanCaller): Map<ScanEvent, { operator: Operator | null; problem: string | null }> {
  const out = new Map<ScanEvent, { operator: Operator | null; problem: string | null }>();
  const claimed = [...new Set(events.map((e) => e.operatorId).filter((x): x is string => !!x && x !== caller.user?.id))];
  const people = new Map(scansRepository.usersByIds(db, claimed).map((u) => [u.id, u]));
  const sessions = caller.device ? scansRepository.deviceSessions(db, caller.device.id, claimed) : [];
  const self: Operator | null = caller.user ? { id: caller.user.id, role: caller.user.role } : null;
  for (const e of events) {
    if (!e.operatorId || e.operatorId === caller.user?.id) {
      out.set(e, self ? { operator: self, problem: null } : { operator: null, problem: 'operator_unknown' });
      continue;
    }
    const person = people.get(e.operatorId);
    const at = Date.parse(e.occurredAt);
    const signedInHere = sessions.some((s) => s.userId === e.operatorId && s.createdAt - 2 * 60_000 <= at && at <= s.expiresAt);
    if (person && person.active && signedInHere) out.set(e, { operator: { id: person.id, role: person.role as Role }, problem: null });
    else if (self) out.set(e, { operator: self, problem: null });
    else out.set(e, { operator: null, problem: 'operator_not_signed_in_here' });
  }
  return out;
}

type ParsedEvent = { raw: unknown; event: ScanEvent; issues?: undefined } | { raw: unknown; event: null; issues: string[] };

function parseEvents(rawEvents: unknown[]): ParsedEvent[] {
  return rawEvents.map((raw) => {
    const r = scanEventSchema.safeParse(raw);
    return r.success ? { raw, event: r.data } : { raw, event: null, issues: r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).slice(0, 5) };
  });
}

interface QueuedBatch {
  rawEvents: unknown[];
  caller: ScanCaller;
  resolve: (r: ScanBatchResponse) => void;
  reject: (e: unknown) => void;
}
const groups = new WeakMap<object, QueuedBatch[]>();

function flushGroup(deps: AppDeps) {
  const items = groups.get(deps.db) ?? [];
  groups.delete(deps.db);
  const now = deps.now();
  const outcomes: ({ ok: { results: ScanResult[]; accepted: AcceptedScan[] } } | { error: unknown })[] = [];
  try {
    deps.db.transaction(
      (tx) => {
        for (const item of items) {
          outcomes.push(scansRepository.inSavepoint(tx, () => processBatch(tx, deps, parseEvents(item.rawEvents), item.caller, now)));
        }
      },
      { behavior: 'immediate' },
    );
  } catch (error) {
    for (const item of items) item.reject(error);
    return;
  }
  notifyFloorChanged(deps);
  const serverTime = new Date(now).toISOString();
  items.forEach((item, i) => {
    const o = outcomes[i];
    if ('ok' in o) item.resolve({ results: o.ok.results, serverTime });
    else item.reject(o.error);
  });
}

/** One batch inside a transaction: read what it needs in a few queries, decide each event, write. */
function processBatch(tx: DbLike, deps: AppDeps, parsed: ParsedEvent[], caller: ScanCaller, now: number): { results: ScanResult[]; accepted: AcceptedScan[] } {
  const deviceId = caller.device?.id ?? null;
  // A tablet records scans at its own station only. (A tablet always has a station; a device
  // without one is a wall, which may not post scans at all.)
  const tabletStation = caller.device?.kind === 'tablet' ? (caller.device.stationId ?? '') : null;
  const accepted: AcceptedScan[] = [];
  const data = new BatchData(tx, deps.keys.traveller);
  const valid = parsed.filter((p) => p.event).map((p) => p.event!);
  const ids = valid.map((e) => e.id);
  const already = new Set(trayStatesRepository.acceptedIds(tx, ids));
  const refusedBefore = new Map(scansRepository.rejectionsByEventIds(tx, ids).map((r) => [r.eventId, r]));
  const numbers = valid.map((e) => parseTravellerCode(e.code)?.number).filter((n): n is string => !!n);
  data.loadTrays(numbers);
  data.loadOverrides(valid.map((e) => e.overrideId).filter((x): x is string => !!x));
  const operators = resolveOperators(tx, valid, caller);

  const seen = new Set<string>();
  const results: ScanResult[] = [];
  const newEvents: ScanEventInsert[] = [];
  const newRejections: RejectionInsert[] = [];
  const resultIndexByEvent = new Map<string, number>();
  const touched = new Set<string>();

  for (const p of parsed) {
    if (!p.event) {
      const rawId = typeof (p.raw as { id?: unknown })?.id === 'string' ? (p.raw as { id: string }).id : '';
      const params = { reason: 'schema', issues: (p as { issues?: string[] }).issues?.join('; ') ?? null };
      newRejections.push(rejectionRow(null, p.raw, null, 'invalid_event', params, deviceId, caller.user?.id ?? null, now));
      results.push({ id: rawId, status: 'rejected', code: 'invalid_event', message: refusalText('invalid_event', params), params });
      continue;
    }
    const event = p.event;
    if (already.has(event.id)) {
      results.push({ id: event.id, status: 'duplicate' });
      continue;
    }
    if (seen.has(event.id)) {
      const first = results[resultIndexByEvent.get(event.id)!];
      results.push({ id: event.id, status: 'duplicate', ...(first?.status === 'rejected' ? { code: first.code, message: first.message } : {}) });
      continue;
    }
    const before = refusedBefore.get(event.id);
    if (before) {
      // Refused earlier (and perhaps accepted later on a retry): the same answer again.
      results.push(
        before.resolution === 'accepted_late' || before.resolution === 'accepted_on_retry'
          ? { id: event.id, status: 'duplicate' }
          : { id: event.id, status: 'duplicate', code: before.code as RejectionCode, message: before.message },
      );
      continue;
    }
    seen.add(event.id);
    const op = operators.get(event)!;
    const prepared: PreparedEvent = { event, operator: op.operator, operatorProblem: op.problem, tabletStation };
    const e = evaluate(data, prepared, now);
    if (e.result.ok) {
      const ok = e.result;
      newEvents.push(...eventRows({ ...e, result: ok }, prepared, deviceId, now));
      data.states.set(e.tray!.id, ok.next);
      touched.add(e.tray!.id);
      if (e.override && ok.facts.overridden.length) {
        data.usedOverrides.add(e.override.id);
        scansRepository.useOverride(tx, e.override.id, event.id);
        auditRepository.record(tx, now, {
          userId: e.override.supervisorId,
          action: 'scan.override',
          entity: 'tray',
          entityId: e.tray!.id,
          detail: {
            eventId: event.id,
            kind: e.override.kind,
            overridden: ok.facts.overridden,
            stationId: event.stationId,
            reason: e.override.reason,
            operatorId: prepared.operator!.id,
          },
        });
      }
      accepted.push(acceptedScan(e.tray!, event, e.stationKind!, ok.next));
      results.push({ id: event.id, status: 'accepted', tray: traySummary(e.tray!, ok.next, data.routing(e.tray!)) });
    } else {
      const r = e.result;
      newRejections.push(rejectionRow(prepared, p.raw, e, r.code, data.named(r.params), deviceId, prepared.operator?.id ?? caller.user?.id ?? null, now));
      results.push(refusalResult(event.id, e, data));
    }
    resultIndexByEvent.set(event.id, results.length - 1);
  }

  trayStatesRepository.insertEvents(tx, newEvents);
  scansRepository.insertRejections(tx, newRejections);

  // Scans that arrived late from another tablet may make earlier refusals right: try them again.
  const late = retryOpenRefusals(tx, data, [...touched], now, accepted);
  for (const [eventId, tray] of late) {
    const i = resultIndexByEvent.get(eventId);
    if (i != null && results[i].status === 'rejected') results[i] = { id: eventId, status: 'accepted', tray };
    touched.add(tray.id);
  }

  for (const trayId of touched) {
    const tray = data.traysById.get(trayId)!;
    trayStatesRepository.put(tx, rowFromState(data.states.get(trayId)!, data.routing(tray), now));
  }
  const startedOrders = [...new Set(accepted.filter((a) => a.type === 'start').map((a) => a.orderId))];
  scansRepository.markOrderInProduction(tx, startedOrders, now);
  for (const hook of hooks.get(deps.db) ?? []) hook(tx, accepted, deps);
  return { results, accepted };
}

function acceptedScan(tray: TrayRow, event: ScanEvent, stationKind: StationKind, state: TrayState): AcceptedScan {
  return {
    eventId: event.id,
    trayId: tray.id,
    orderId: tray.orderId,
    type: event.type,
    stationId: event.stationId,
    stationKind,
    occurredAt: Date.parse(event.occurredAt),
    state,
  };
}

/** The event a refusal kept, when it is a well-formed one. */
export function storedEvent(row: Pick<RejectionRow, 'payload'>): ScanEvent | null {
  const parsed = scanEventSchema.safeParse((row.payload as { event?: unknown } | null)?.event);
  return parsed.success ? parsed.data : null;
}

/**
 * A refused scan evaluated again against the batch's current view, by the operator it was refused
 * to. When it passes now, its event row is written and the batch's state of the tray moves on;
 * the caller resolves the refusal.
 */
export function evaluateAgain(tx: DbLike, data: BatchData, event: ScanEvent, row: Pick<RejectionRow, 'userId' | 'deviceId'>, now: number): Evaluated {
  const operator = row.userId ? scansRepository.usersByIds(tx, [row.userId])[0] : undefined;
  const prepared: PreparedEvent = { event, operator: operator ? { id: operator.id, role: operator.role as Role } : null, operatorProblem: 'operator_unknown' };
  const e = evaluate(data, prepared, now);
  if (e.result.ok) {
    trayStatesRepository.insertEvents(tx, eventRows({ ...e, result: e.result }, prepared, row.deviceId, now));
    data.states.set(e.tray!.id, e.result.next);
  }
  return e;
}

/**
 * Open refusals of the touched trays (wrong station, not started, already started, on hold) whose
 * time is not before the tray's last event are evaluated again, oldest first, until none passes.
 * A refusal that passes now is appended as accepted and marked `accepted_late`.
 */
function retryOpenRefusals(tx: DbLike, data: BatchData, trayIds: string[], now: number, accepted: AcceptedScan[]): Map<string, ScanTray> {
  const done = new Map<string, ScanTray>();
  if (!trayIds.length) return done;
  let pending = scansRepository.openRetryable(tx, trayIds, RETRYABLE_CODES);
  for (let pass = 0; pass < 5 && pending.length; pass++) {
    let progressed = false;
    const left: typeof pending = [];
    for (const row of pending) {
      const state = row.trayId ? data.states.get(row.trayId) : undefined;
      if (!state || row.occurredAt == null || row.occurredAt < lastEventTime(state)) continue;
      const event = storedEvent(row);
      if (!event || event.overrideId) continue;
      const e = evaluateAgain(tx, data, event, row, now);
      if (!e.result.ok) {
        left.push(row);
        continue;
      }
      const ok = e.result;
      scansRepository.resolveRejection(tx, row.id, { resolvedAt: now, resolvedBy: null, resolution: 'accepted_late' });
      accepted.push(acceptedScan(e.tray!, event, e.stationKind!, ok.next));
      done.set(event.id, traySummary(e.tray!, ok.next, data.routing(e.tray!)));
      progressed = true;
    }
    if (!progressed) break;
    pending = left;
  }
  return done;
}

export const scanIngestService = {
  /**
   * POST /api/scans: the batch is validated event by event, guarded and written in one
   * transaction; each event is answered in the order sent. An event already stored (accepted or
   * refused) is a `duplicate` and changes nothing. Group commit: batches that arrive while the previous commit is being made are
   * written together in one transaction (each in its own savepoint, so one failing batch never
   * takes the others down), and share one sync to disk. Every caller still gets only its own
   * answers, after the commit that made them durable.
   */
  submitQueued(deps: AppDeps, rawEvents: unknown[], caller: ScanCaller): Promise<ScanBatchResponse> {
    return new Promise((resolve, reject) => {
      let group = groups.get(deps.db);
      if (!group) {
        group = [];
        groups.set(deps.db, group);
        setImmediate(() => flushGroup(deps));
      }
      group.push({ rawEvents, caller, resolve, reject });
    });
  },
};
