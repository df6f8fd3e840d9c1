// Writing the floor down: every scan an operator makes goes through the product's own guard
// (`evaluateScan`, with `now` = the moment of the scan), so the history can never hold a
// sequence the product would refuse, and each traveller's state is the guard's own. A scan the
// guard refuses is kept, unresolved, for the supervisor, as the scan service keeps it.
import type { GuardInput, ValidOverride } from '@shared/domain/guards';
import { evaluateScan } from '@shared/domain/guards';
import { refusalText } from '@shared/domain/scan-messages';
import type { ScanType } from '@shared/domain/vocabulary';
import { iso } from '@shared/domain/time-zone';
import { MINUTE } from '@shared/domain/calendar';
import type { Rng } from '../prng';
import { DEFAULT_REASON_CODES } from '../base';
import type { StationPool } from './station-pool';
import type { Live, OrderRun, SimEvent, SimOverride, SimPeople, SimRejection, SimStation } from './types';

const REASON_NAMES = new Map(DEFAULT_REASON_CODES.map((r) => [r.code, r.name]));
/** Refusal texts name a hold reason, as the scan service writes them. */
const named = (params: Record<string, string | number | null>) =>
  typeof params.holdReason === 'string' && REASON_NAMES.has(params.holdReason) ? { ...params, holdReason: REASON_NAMES.get(params.holdReason)! } : params;

export interface ScanOptions {
  userId?: string;
  good?: number;
  scrap?: number;
  rework?: number;
  reason?: string | null;
  note?: string | null;
  override?: SimOverride | null;
}

export class ScanWriter {
  readonly events: SimEvent[] = [];
  readonly rejections: SimRejection[] = [];
  private readonly reasonList: string[];

  constructor(
    private readonly rng: Rng,
    /** the end of the history: nothing is received after it */
    private readonly now: number,
    private readonly people: SimPeople,
    private readonly pool: StationPool,
    private readonly orders: ReadonlyMap<string, OrderRun>,
    reasonCodes: readonly { code: string }[],
  ) {
    this.reasonList = reasonCodes.map((r) => r.code);
  }

  private guardInput(
    t: Live,
    type: ScanType,
    at: number,
    station: SimStation,
    extra: Partial<GuardInput['event']>,
    userId: string,
    override: ValidOverride | null,
  ): GuardInput {
    const o = this.orders.get(t.orderId)!;
    return {
      state: t.state,
      routing: t.routing,
      station: { id: station.id, kind: station.kind, name: station.name },
      event: { type, occurredAt: iso(at), ...extra },
      now: at,
      mouldReady: o.mouldsReadyAt != null && o.mouldsReadyAt <= at,
      override,
      actorRole: this.people.roleOf.get(userId) ?? null,
      reasonCodes: this.reasonList,
    };
  }

  /** A scan the guard accepts: the traveller's state moves on and the event is written down. */
  scan(t: Live, type: ScanType, at: number, station: SimStation, opts: ScanOptions = {}) {
    const { rng } = this;
    if ((type === 'hold' || type === 'release') && at <= t.last) at = t.last + 1000;
    if (at < t.last) throw new Error(`demo history: ${t.number} ${type} at ${iso(at)} is before its last event ${iso(t.last)}`);
    const userId = opts.userId ?? this.pool.anyOperator(station.kind);
    const extra: Partial<GuardInput['event']> = {};
    if (type === 'finish')
      Object.assign(extra, { goodQty: opts.good, scrapQty: opts.scrap ?? 0, reworkQty: opts.rework ?? 0, scrapReason: opts.reason ?? null });
    if (type === 'hold') Object.assign(extra, { scrapReason: opts.reason ?? null, note: opts.note ?? null });
    const override = opts.override
      ? { id: opts.override.id, supervisorId: opts.override.supervisorId, reason: opts.override.reason, kind: opts.override.kind }
      : null;
    const qtyIn = t.state.quantity;
    const res = evaluateScan(this.guardInput(t, type, at, station, extra, userId, override));
    if (!res.ok) {
      throw new Error(`demo history: ${t.number} ${type} at ${station.code} ${iso(at)} refused: ${res.code} ${JSON.stringify(res.params)}`);
    }
    t.state = res.next;
    t.last = at;
    const id = rng.uuid();
    if (opts.override) opts.override.usedEventId = id;
    // most scans reach the server within seconds; now and then a tablet was offline for a while
    // (a traveller's scans still arrive in the order they happened)
    const receivedAt = Math.max(t.lastReceived, Math.min(this.now, at + (rng.chance(0.02) ? rng.int(5, 75) * MINUTE : rng.int(1, 25) * 1000)));
    t.lastReceived = receivedAt;
    const finish = type === 'finish';
    this.events.push({
      id,
      trayId: t.id,
      type,
      stepSeq: res.facts.stepSeq,
      stationId: station.id,
      stationKind: station.kind,
      deviceId: station.deviceId,
      userId,
      occurredAt: at,
      receivedAt,
      qtyIn: type === 'start' || finish ? qtyIn : null,
      goodQty: finish ? (opts.good ?? null) : null,
      scrapQty: finish ? (opts.scrap ?? 0) : null,
      reworkQty: finish ? (opts.rework ?? 0) : null,
      scrapReason: finish || type === 'hold' ? (opts.reason ?? null) : null,
      overrideId: opts.override?.id ?? null,
      note: opts.note ?? null,
    });
    return res;
  }

  /** A scan an operator tried that the guard refuses: kept, unresolved, for the supervisor.
   * False when the guard would accept it (nothing is written) or it lies outside the history. */
  refused(t: Live, type: ScanType, at: number, station: SimStation, extra: Partial<GuardInput['event']> = {}): boolean {
    const { rng } = this;
    if (at > this.now || at < t.last) return false;
    const userId = this.pool.anyOperator(station.kind);
    const res = evaluateScan(this.guardInput(t, type, at, station, extra, userId, null));
    if (res.ok) return false;
    const eventId = rng.uuid();
    this.rejections.push({
      id: rng.uuid(),
      eventId,
      trayId: t.id,
      stationId: station.id,
      deviceId: station.deviceId,
      userId,
      code: res.code,
      message: refusalText(res.code, named(res.params)),
      payload: { event: { id: eventId, code: t.number, stationId: station.id, type, occurredAt: iso(at), ...extra }, params: res.params },
      occurredAt: at,
      receivedAt: at + rng.int(1, 20) * 1000,
    });
    return true;
  }
}
