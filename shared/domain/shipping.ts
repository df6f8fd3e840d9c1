// The arithmetic of the last two steps: how many finished pieces an order may ship, what a set
// of cartons holds, and when an order counts as shipped.
import type { RoutingStep, TrayPhase } from './vocabulary';
import { dateOfDayNumber, dayNumberOfDate, startOfLocalDate } from './time-zone';

/** Overrun allowance in pieces: ordered × percent, rounded up to a whole piece. */
export function overrunAllowance(ordered: number, overrunPct: number): number {
  if (!Number.isInteger(ordered) || ordered < 0) throw new RangeError('ordered must be a whole number ≥ 0');
  if (!Number.isFinite(overrunPct) || overrunPct < 0) throw new RangeError('overrunPct must be ≥ 0');
  // Work in hundredths to keep 5 % of 300 at exactly 15 (floating point gives 15.000000000000002).
  return Math.ceil(Math.round(ordered * overrunPct * 100) / 10000);
}

export type FinishedQuantityVerdict = 'under' | 'ok' | 'over_allowance';

export interface FinishedQuantityCheck {
  verdict: FinishedQuantityVerdict;
  ordered: number;
  made: number;
  /** ordered + overrun allowance: the most the customer expects to receive */
  maxExpected: number;
  /** pieces missing to reach the ordered quantity (0 unless under) */
  shortBy: number;
  /** pieces beyond ordered + allowance (0 unless over_allowance) */
  overBy: number;
  /** an under-quantity order waits for a decision (ship short, or make more) before it ships */
  needsDecision: boolean;
}

/**
 * The finished quantity against what was ordered: fewer good pieces than ordered needs a
 * decision before shipping; more than the overrun allowance is reported (the extra pieces
 * stay in the factory unless someone decides otherwise).
 */
export function checkFinishedQuantity(input: { ordered: number; overrunPct: number; made: number }): FinishedQuantityCheck {
  const { ordered, overrunPct, made } = input;
  if (!Number.isInteger(made) || made < 0) throw new RangeError('made must be a whole number ≥ 0');
  const maxExpected = ordered + overrunAllowance(ordered, overrunPct);
  const shortBy = Math.max(0, ordered - made);
  const overBy = Math.max(0, made - maxExpected);
  const verdict: FinishedQuantityVerdict = shortBy > 0 ? 'under' : overBy > 0 ? 'over_allowance' : 'ok';
  return { verdict, ordered, made, maxExpected, shortBy, overBy, needsDecision: verdict === 'under' };
}

export type ShipmentQuantityResult =
  { ok: true; pieces: number; remainingAfter: number } | { ok: false; code: 'more_than_made'; pieces: number; available: number };

/** A shipment may not carry more pieces than were made and not yet shipped. */
export function checkShipmentQuantity(input: { made: number; alreadyShipped: number; pieces: number }): ShipmentQuantityResult {
  const { made, alreadyShipped, pieces } = input;
  if (!Number.isInteger(pieces) || pieces <= 0) throw new RangeError('pieces must be a whole number > 0');
  const available = Math.max(0, made - alreadyShipped);
  if (pieces > available) return { ok: false, code: 'more_than_made', pieces, available };
  return { ok: true, pieces, remainingAfter: available - pieces };
}

export interface CartonLine {
  /** how many cartons of this kind */
  count: number;
  piecesPerCarton: number;
  /** weight of one carton of this line, packed (kg) */
  weightKg: number;
}

export interface CartonTotals {
  cartons: number;
  pieces: number;
  weightKg: number;
}

/** Totals of carton lines: cartons = Σ count, pieces = Σ count × pieces per carton, weight = Σ count × weight. */
export function cartonTotals(lines: readonly CartonLine[]): CartonTotals {
  let cartons = 0;
  let pieces = 0;
  let grams = 0;
  for (const l of lines) {
    if (!Number.isInteger(l.count) || l.count <= 0) throw new RangeError('carton count must be a whole number > 0');
    if (!Number.isInteger(l.piecesPerCarton) || l.piecesPerCarton <= 0) {
      throw new RangeError('pieces per carton must be a whole number > 0');
    }
    cartons += l.count;
    pieces += l.count * l.piecesPerCarton;
    // Sum in grams so 3 × 0.1 kg is 0.3 kg and not 0.30000000000000004.
    grams += l.count * Math.round(l.weightKg * 1000);
  }
  return { cartons, pieces, weightKg: grams / 1000 };
}

/**
 * Carton lines for `pieces` pieces at `piecesPerCarton` a carton: full cartons plus one part
 * carton for the remainder.
 */
export function planCartons(pieces: number, piecesPerCarton: number): { full: number; partPieces: number; cartons: number } {
  if (!Number.isInteger(pieces) || pieces < 0) throw new RangeError('pieces must be a whole number ≥ 0');
  if (!Number.isInteger(piecesPerCarton) || piecesPerCarton <= 0) throw new RangeError('pieces per carton must be > 0');
  const full = Math.floor(pieces / piecesPerCarton);
  const partPieces = pieces - full * piecesPerCarton;
  return { full, partPieces, cartons: full + (partPieces > 0 ? 1 : 0) };
}

/** What shipping needs to know about one tray of an order. */
export interface TrayShipState {
  phase: TrayPhase;
  /** occurredAt of the finish scan of its dispatch step, when it has one */
  dispatchFinishedAt: string | null;
}

export interface ShippedVerdict {
  shipped: boolean;
  /** when the last tray's dispatch step finished: the end of the order's lead time */
  shippedAt: string | null;
  trays: number;
  dispatched: number;
  writtenOff: number;
  /** trays still to finish dispatch */
  open: number;
}

/**
 * An order is shipped when the dispatch step of its last tray has finished. Trays written off
 * (scrapped with a reason) or merged into another tray count as done. An order whose every
 * tray was written off has shipped nothing and is not shipped.
 */
export function orderShipped(trays: readonly TrayShipState[]): ShippedVerdict {
  let dispatched = 0;
  let writtenOff = 0;
  let latest: number | null = null;
  let latestIso: string | null = null;
  for (const t of trays) {
    if (t.phase === 'scrapped' || t.phase === 'merged') {
      writtenOff += 1;
      continue;
    }
    if (t.phase === 'done' && t.dispatchFinishedAt) {
      dispatched += 1;
      const ms = Date.parse(t.dispatchFinishedAt);
      if (Number.isNaN(ms)) throw new RangeError(`bad time: ${t.dispatchFinishedAt}`);
      if (latest === null || ms > latest) {
        latest = ms;
        latestIso = t.dispatchFinishedAt;
      }
    }
  }
  const open = trays.length - dispatched - writtenOff;
  const shipped = trays.length > 0 && open === 0 && dispatched > 0;
  return {
    shipped,
    shippedAt: shipped && latestIso ? new Date(latest as number).toISOString() : null,
    trays: trays.length,
    dispatched,
    writtenOff,
    open,
  };
}

/** What packing needs to know about one tray. */
export interface TrayPackState {
  phase: TrayPhase;
  stepSeq: number | null;
  quantity: number;
  routing: Pick<RoutingStep, 'seq' | 'stationKind'>[];
}

/** True when the tray has finished its pack step (or its whole routing). */
export function trayIsPacked(t: TrayPackState): boolean {
  if (t.phase === 'done') return true;
  if (t.phase === 'scrapped' || t.phase === 'merged' || t.stepSeq === null) return false;
  const pack = t.routing.filter((s) => s.stationKind === 'pack').map((s) => s.seq);
  // Without a pack step the tray is packed once it reaches dispatch.
  const dispatch = t.routing.find((s) => s.stationKind === 'dispatch')?.seq;
  const packedFrom = pack.length > 0 ? Math.max(...pack) + 1 : (dispatch ?? Number.POSITIVE_INFINITY);
  return t.stepSeq >= packedFrom;
}

/**
 * True when the tray's pieces are finished and counted for shipping: it stands at (or is past)
 * its first pack step, or at dispatch when its routing has no pack step.
 */
export function trayReachedPacking(t: TrayPackState): boolean {
  if (t.phase === 'done') return true;
  if (t.phase === 'scrapped' || t.phase === 'merged' || t.stepSeq === null) return false;
  const first = t.routing.filter((s) => s.stationKind === 'pack' || s.stationKind === 'dispatch').map((s) => s.seq);
  return first.length > 0 && t.stepSeq >= Math.min(...first);
}

/** How much of an order is packed and what is still on the floor. */
export function packingProgress<T extends TrayPackState>(
  trays: readonly T[],
): {
  packed: T[];
  onFloor: T[];
  packedPieces: number;
  onFloorPieces: number;
} {
  const packed: T[] = [];
  const onFloor: T[] = [];
  for (const t of trays) {
    if (t.phase === 'scrapped' || t.phase === 'merged') continue;
    (trayIsPacked(t) ? packed : onFloor).push(t);
  }
  const sum = (xs: T[]) => xs.reduce((a, t) => a + t.quantity, 0);
  return { packed, onFloor, packedPieces: sum(packed), onFloorPieces: sum(onFloor) };
}

/**
 * A tracking number as typed or scanned: hand scanners (keyboard wedge) may prefix an AIM
 * symbology identifier ("]C1" and the like) and send a group separator or line end; people
 * type spaces and lower case. What remains is compared for duplicates.
 */
export function normaliseTrackingNumber(raw: string): string {
  // Control characters (line ends, the GS1 group separator) are dropped one by one.
  let s = [...raw]
    .filter((c) => c.charCodeAt(0) > 0x1f && c.charCodeAt(0) !== 0x7f)
    .join('')
    .trim();
  if (/^\][A-Za-z][0-9A-Za-z]/.test(s)) s = s.slice(3);
  return s.replace(/\s+/g, '').toUpperCase();
}

/**
 * A projected ship time is past due when it falls after the end of the due date in the
 * factory's time zone (a due date is a whole local day).
 */
export function projectedPastDue(projectedAt: number, dueDate: string, timeZone: string): boolean {
  const dayAfter = dateOfDayNumber(dayNumberOfDate(dueDate) + 1);
  return projectedAt >= startOfLocalDate(timeZone, dayAfter);
}
