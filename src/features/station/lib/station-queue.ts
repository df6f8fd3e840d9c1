// A station's lists on the tablet, worked out from the travellers it has cached: in process here,
// in this station's oven, and waiting for this station (a tray still curing elsewhere whose next
// step is here counts as waiting, with the minutes until its cure is done). Pure: the screen
// hands in each traveller's state as the tablet sees it and the moment to measure from.
import { awaitedStep } from '@shared/domain/guards';
import type { StationKind, TrayState } from '@shared/domain/vocabulary';
import type { TrayCard } from '@shared/schemas/scans';

export interface QueueItem {
  number: string;
  card: TrayCard;
  state: TrayState;
  /** minutes in process, waiting, or left until the cure is done (negative: ready) */
  minutes: number;
}

export interface StationQueueLists {
  /** longest in process first */
  inProcess: QueueItem[];
  /** soonest ready first */
  curing: QueueItem[];
  /** longest waiting first (a curing tray by when its cure is done) */
  waiting: QueueItem[];
}

const minutesSince = (now: number, at: string | null) => (at ? (now - Date.parse(at)) / 60_000 : 0);
const minutesUntil = (now: number, at: string | null) => (at ? (Date.parse(at) - now) / 60_000 : 0);
/** when a waiting tray became ready for this station */
const waitKey = (i: QueueItem) => Date.parse((i.state.phase === 'curing' ? i.state.cureReadyAt : i.state.waitingSince) ?? i.state.releasedAt);
/** held trays are not ready for anyone: they go last, whatever they waited */
const heldLast = (a: QueueItem, b: QueueItem) => Number(a.state.onHold) - Number(b.state.onHold);

export function stationQueue(
  trays: readonly { number: string; card: TrayCard; state: TrayState | null }[],
  station: { id: string; kind: StationKind },
  now: number,
): StationQueueLists {
  const inProcess: QueueItem[] = [];
  const curing: QueueItem[] = [];
  const waiting: QueueItem[] = [];
  for (const { number, card, state } of trays) {
    if (!state) continue;
    const here = state.stationId === station.id;
    const next = () => awaitedStep(state, card.routing)?.stationKind === station.kind;
    if (state.phase === 'in_process' && here) inProcess.push({ number, card, state, minutes: minutesSince(now, state.startedAt) });
    else if (state.phase === 'curing' && here) curing.push({ number, card, state, minutes: minutesUntil(now, state.cureReadyAt) });
    else if (state.phase === 'curing' && next()) waiting.push({ number, card, state, minutes: minutesUntil(now, state.cureReadyAt) });
    else if (state.phase === 'waiting' && next()) waiting.push({ number, card, state, minutes: minutesSince(now, state.waitingSince) });
  }
  inProcess.sort((a, b) => heldLast(a, b) || b.minutes - a.minutes);
  curing.sort((a, b) => heldLast(a, b) || a.minutes - b.minutes);
  waiting.sort((a, b) => heldLast(a, b) || waitKey(a) - waitKey(b));
  return { inProcess, curing, waiting };
}

/** Trays in this station's oven that have just turned ready (not held, not announced before). */
export function newlyCured(curing: readonly QueueItem[], announced: ReadonlySet<string>): QueueItem[] {
  return curing.filter((i) => i.minutes <= 0 && !i.state.onHold && !announced.has(i.number));
}
