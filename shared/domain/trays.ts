// Trays: how many pieces are released, how they are split into trays, and the rules for
// splitting and merging trays later. Pieces are never created or lost here.
import type { RoutingStep, TrayState } from './vocabulary';

/** Ordered quantity plus the overrun allowance, rounded up to a whole piece. */
export function releasedQuantity(quantity: number, overrunPct: number): number {
  if (!Number.isInteger(quantity) || quantity < 1) throw new RangeError('quantity must be a whole number above 0');
  if (!(overrunPct >= 0)) throw new RangeError('overrunPct cannot be negative');
  // round away float noise (e.g. 7 × 1.1 = 7.700000000000001) before rounding up
  const extra = Math.round(quantity * overrunPct * 1e6) / 1e8;
  return quantity + Math.ceil(extra);
}

/** Splits `total` pieces into trays of `traySize`; the last tray takes the remainder. */
export function splitIntoTrays(total: number, traySize: number): number[] {
  if (!Number.isInteger(total) || total < 1) throw new RangeError('total must be a whole number above 0');
  if (!Number.isInteger(traySize) || traySize < 1) throw new RangeError('traySize must be a whole number above 0');
  const trays: number[] = [];
  let left = total;
  while (left > 0) {
    const q = Math.min(traySize, left);
    trays.push(q);
    left -= q;
  }
  return trays;
}

/** A planner should not print thousands of travellers by mistake. */
export const MAX_TRAYS_PER_RELEASE = 500;

// ---------------------------------------------------------------------------------------
// Numbers printed on travellers (and typed by hand when a QR is unreadable)

/** A digit first, then upper case letters, digits, '-' and '.': all inside the QR alphanumeric character set. */
export const TRAY_NUMBER_PATTERN = /^[0-9][0-9A-Z.-]{0,19}$/;
export const TRAY_NUMBER_MAX_LENGTH = 20;

export function trayNumber(orderNumber: string, index: number): string {
  return `${orderNumber}-${String(index).padStart(2, '0')}`;
}

export function mouldNumber(orderNumber: string, side: 'front' | 'back'): string {
  return `${orderNumber}-M${side === 'front' ? 'F' : 'B'}`;
}

/** Children of a split get the parent's number with a suffix: 1042-03.1, 1042-03.2 … */
export function childTrayNumber(parentNumber: string, k: number): string {
  return `${parentNumber}.${k}`;
}

/** Normalises what someone typed or a scanner sent: trimmed, upper case. */
export function normaliseTrayNumber(text: string): string {
  return text.trim().toUpperCase();
}

// ---------------------------------------------------------------------------------------
// Split

export type SplitResult =
  { ok: true; remaining: number; parts: number[] } | { ok: false; code: 'bad_quantity' | 'nothing_left' | 'not_waiting' | 'on_hold'; message: string };

/**
 * Takes `parts` pieces off a tray into new trays; the rest stays on the original.
 * Only a tray that waits for its next step (not in process, not curing, not on hold) can be split.
 */
export function splitTray(tray: Pick<TrayState, 'quantity' | 'phase' | 'onHold'>, parts: readonly number[]): SplitResult {
  if (tray.phase !== 'waiting') {
    return { ok: false, code: 'not_waiting', message: 'Only a tray waiting for its next step can be split' };
  }
  if (tray.onHold) return { ok: false, code: 'on_hold', message: 'Release the hold before splitting the tray' };
  if (parts.length === 0 || parts.some((p) => !Number.isInteger(p) || p < 1)) {
    return { ok: false, code: 'bad_quantity', message: 'Each new tray needs a whole number of pieces above 0' };
  }
  const taken = parts.reduce((a, b) => a + b, 0);
  const remaining = tray.quantity - taken;
  if (remaining < 1) {
    return {
      ok: false,
      code: 'nothing_left',
      message: `The tray holds ${tray.quantity}; at least one piece must stay on it (asked for ${taken})`,
    };
  }
  return { ok: true, remaining, parts: [...parts] };
}

// ---------------------------------------------------------------------------------------
// Merge

export interface MergeCandidate {
  state: TrayState;
  orderId: string;
  routing: readonly RoutingStep[];
}

export type MergeResult =
  | { ok: true; quantity: number; cureReadyAt: string | null; waitingSince: string | null }
  | {
      ok: false;
      code: 'too_few' | 'not_trays' | 'different_orders' | 'not_waiting' | 'on_hold' | 'different_next_step';
      message: string;
    };

function remainingSignature(c: MergeCandidate): string {
  const seq = c.state.stepSeq ?? Number.POSITIVE_INFINITY;
  return c.routing
    .filter((s) => s.seq >= seq)
    .map((s) => `${s.stationKind}|${s.name}|${s.cureMinutes ?? ''}`)
    .join('>');
}

/**
 * Trays merge only when they belong to the same order, all wait (not in process or curing,
 * not on hold) and have the same next step and the same steps after it.
 */
export function canMerge(candidates: readonly MergeCandidate[]): MergeResult {
  if (candidates.length < 2) return { ok: false, code: 'too_few', message: 'Pick at least two trays to merge' };
  if (candidates.some((c) => c.state.kind !== 'tray')) {
    return { ok: false, code: 'not_trays', message: 'Mould travellers cannot be merged' };
  }
  const orderId = candidates[0].orderId;
  if (candidates.some((c) => c.orderId !== orderId)) {
    return { ok: false, code: 'different_orders', message: 'Only trays of the same order can be merged' };
  }
  const busy = candidates.find((c) => c.state.phase !== 'waiting');
  if (busy) return { ok: false, code: 'not_waiting', message: 'Every tray must be waiting for its next step' };
  if (candidates.some((c) => c.state.onHold)) {
    return { ok: false, code: 'on_hold', message: 'A tray on hold cannot be merged' };
  }
  const first = candidates[0];
  const sig = remainingSignature(first);
  if (candidates.some((c) => c.state.stepSeq !== first.state.stepSeq || remainingSignature(c) !== sig)) {
    return { ok: false, code: 'different_next_step', message: 'The trays must wait for the same next step' };
  }
  const quantity = candidates.reduce((a, c) => a + c.state.quantity, 0);
  // the merged tray may start only when every part may; it has waited since the oldest part
  const cures = candidates.map((c) => c.state.cureReadyAt).filter((x): x is string => !!x);
  const waits = candidates.map((c) => c.state.waitingSince).filter((x): x is string => !!x);
  return {
    ok: true,
    quantity,
    cureReadyAt: cures.length ? cures.reduce((a, b) => (Date.parse(a) >= Date.parse(b) ? a : b)) : null,
    waitingSince: waits.length ? waits.reduce((a, b) => (Date.parse(a) <= Date.parse(b) ? a : b)) : null,
  };
}
