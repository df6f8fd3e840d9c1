// Where an order stands, told the way a customer or a sales person understands it: a short
// progress line of seven stages instead of twenty station steps.
import { STATION_KIND_TRAITS } from './traveller/station-kinds';
import { STATION_KINDS, STATION_KIND_NAMES, type OrderStatus, type RoutingStep, type StationKind, type TrayPhase, type TravellerKind } from './vocabulary';

export const CUSTOMER_STAGES = ['artwork_moulds', 'metal_forming', 'colour', 'finishing_plating', 'inspection', 'packing', 'shipped'] as const;
export type CustomerStage = (typeof CUSTOMER_STAGES)[number];

/** The names a customer reads on the status page. */
export const CUSTOMER_STAGE_NAMES: Record<CustomerStage, string> = {
  artwork_moulds: 'Artwork and moulds',
  metal_forming: 'Metal forming',
  colour: 'Colour',
  finishing_plating: 'Finishing and plating',
  inspection: 'Inspection',
  packing: 'Packing',
  shipped: 'Shipped',
};

/** What happens in each stage, in words a sales person can repeat on the phone. */
const STAGE_EXPLANATIONS: Record<CustomerStage, string> = {
  artwork_moulds: 'the artwork proof and the moulds are being prepared',
  metal_forming: 'the badges are being struck or cast from metal, trimmed and fitted with posts',
  colour: 'enamel colours are being filled and cured',
  finishing_plating: 'the badges are being stoned, polished, plated and printed',
  inspection: 'every badge is being inspected',
  packing: 'the badges are being fitted with backs, bagged and packed',
  shipped: 'the order has left the factory',
};

/**
 * Which customer stage each station kind belongs to. Clutch fitting and bagging come after
 * inspection in every routing, so they belong with packing; printing and epoxy come after
 * plating in hard enamel work, so they belong with finishing. Dispatch is the last packing
 * step: the order only counts as shipped when that step has finished.
 */
export const STAGE_OF_STATION_KIND = Object.fromEntries(Object.entries(STATION_KIND_TRAITS).map(([k, t]) => [k, t.stage])) as Record<
  StationKind,
  CustomerStage
>;

/** What the stage computation needs to know about one traveller (tray or mould). */
export interface TravellerProgress {
  kind: TravellerKind;
  phase: TrayPhase;
  /** seq of the step it waits for or is in; null when done */
  stepSeq: number | null;
  routing: Pick<RoutingStep, 'seq' | 'stationKind'>[];
  onHold?: boolean;
}

export interface OrderStage {
  /** the stage the order is in; `null` only for a cancelled order */
  stage: CustomerStage | null;
  /** the progress line: every stage before the current one is done; shipped is done once shipped */
  stages: { key: CustomerStage; name: string; done: boolean }[];
  cancelled: boolean;
}

const PRE_RELEASE: readonly OrderStatus[] = ['draft', 'awaiting_payment', 'awaiting_proof'];

/** True when a traveller has nothing left to do: finished, written off, or merged into another. */
export function travellerIsFinished(t: Pick<TravellerProgress, 'phase' | 'stepSeq'>): boolean {
  return t.phase === 'done' || t.phase === 'scrapped' || t.phase === 'merged' || t.stepSeq === null;
}

/** The steps a traveller has not finished yet (the one it is in counts as not finished). */
export function remainingSteps(t: TravellerProgress): Pick<RoutingStep, 'seq' | 'stationKind'>[] {
  if (travellerIsFinished(t)) return [];
  const from = t.stepSeq as number;
  return t.routing.filter((s) => s.seq >= from);
}

function stageIndex(stage: CustomerStage): number {
  return CUSTOMER_STAGES.indexOf(stage);
}

function line(current: number, shipped: boolean): OrderStage['stages'] {
  return CUSTOMER_STAGES.map((key, i) => ({
    key,
    name: CUSTOMER_STAGE_NAMES[key],
    done: key === 'shipped' ? shipped : shipped || i < current,
  }));
}

/**
 * The customer stage of an order: the earliest stage that still has unfinished work on any of
 * its travellers. Because the set of unfinished steps only ever shrinks, the stage never moves
 * backwards, even when a routing visits stages out of their usual order (soft enamel is plated
 * before its colours are filled).
 */
export function orderStage(input: { status: OrderStatus; travellers: TravellerProgress[] }): OrderStage {
  const { status, travellers } = input;
  if (status === 'cancelled') {
    return { stage: null, stages: line(0, false).map((s) => ({ ...s, done: false })), cancelled: true };
  }
  if (status === 'shipped') {
    return { stage: 'shipped', stages: line(stageIndex('shipped'), true), cancelled: false };
  }
  if (PRE_RELEASE.includes(status) || travellers.length === 0) {
    return { stage: 'artwork_moulds', stages: line(0, false), cancelled: false };
  }
  let current = Number.POSITIVE_INFINITY;
  for (const t of travellers) {
    for (const step of remainingSteps(t)) {
      current = Math.min(current, stageIndex(STAGE_OF_STATION_KIND[step.stationKind]));
    }
  }
  if (!Number.isFinite(current)) {
    // Every traveller is finished but the order is not marked shipped yet (the status update
    // follows the last dispatch scan): it is still at packing, and not yet shipped.
    current = stageIndex('packing');
  }
  const stage = CUSTOMER_STAGES[current];
  return { stage, stages: line(current, false), cancelled: false };
}

export interface StageDescriptionInput {
  status: OrderStatus;
  travellers: TravellerProgress[];
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** Where an order stands as a code and its numbers, for screens in any language. */
export type StageNote =
  | { code: 'cancelled' | 'draft' | 'awaiting_payment' | 'awaiting_proof' | 'shipped' }
  | {
      code: 'in_stage';
      params: {
        stage: CustomerStage;
        /** trays waiting at or in each kind of station, in the usual order of a routing */
        at: { kind: StationKind; trays: number }[];
        dispatched: number;
        /** moulds still being made */
        moulds: number;
        /** trays on hold (when the order itself is not) */
        held: number;
        orderOnHold: boolean;
      };
    };

/** The facts `describeStage` puts into words. */
export function stageNote(input: StageDescriptionInput): StageNote {
  const { status, travellers } = input;
  if (status === 'cancelled' || status === 'draft' || status === 'awaiting_payment' || status === 'awaiting_proof' || status === 'shipped') {
    return { code: status };
  }
  const { stage } = orderStage({ status, travellers });
  const at = new Map<StationKind, number>();
  let finished = 0;
  let held = 0;
  for (const t of travellers) {
    if (t.kind !== 'tray') continue;
    if (travellerIsFinished(t)) {
      if (t.phase === 'done') finished += 1;
      continue;
    }
    const step = t.routing.find((s) => s.seq === t.stepSeq);
    if (!step) continue;
    if (t.onHold) held += 1;
    at.set(step.stationKind, (at.get(step.stationKind) ?? 0) + 1);
  }
  // In the order a routing usually runs, so the sentence reads from the back of the floor to the front.
  const kinds = [...at.keys()].sort((a, b) => STATION_KINDS.indexOf(a) - STATION_KINDS.indexOf(b));
  return {
    code: 'in_stage',
    params: {
      stage: stage ?? 'artwork_moulds',
      at: kinds.map((kind) => ({ kind, trays: at.get(kind)! })),
      dispatched: finished,
      moulds: travellers.filter((t) => t.kind === 'mould' && !travellerIsFinished(t)).length,
      held: status === 'on_hold' ? 0 : held,
      orderOnHold: status === 'on_hold',
    },
  };
}

const WHOLE_SENTENCES = {
  cancelled: 'Cancelled: this order will not be made.',
  draft: 'Artwork and moulds: the order is entered and waits to be released to the floor.',
  awaiting_payment: 'Artwork and moulds: waiting for the payment before production can start.',
  awaiting_proof: 'Artwork and moulds: waiting for the customer to approve the artwork proof.',
  shipped: 'Shipped: the order has left the factory.',
} as const;

/**
 * The stage in plain words for sales: the stage, what it means, and where the trays stand
 * ("Colour: enamel colours are being filled and cured. 3 trays at colour fill, 1 tray at curing
 * oven, 2 trays at polishing.").
 */
export function describeStage(input: StageDescriptionInput): string {
  const note = stageNote(input);
  if (note.code !== 'in_stage') return WHOLE_SENTENCES[note.code];
  const p = note.params;
  let text = `${CUSTOMER_STAGE_NAMES[p.stage]}: ${STAGE_EXPLANATIONS[p.stage]}.`;
  const parts = p.at.map((a) => `${plural(a.trays, 'tray', 'trays')} at ${STATION_KIND_NAMES[a.kind]}`);
  if (p.dispatched > 0) parts.push(`${plural(p.dispatched, 'tray', 'trays')} dispatched`);
  if (p.moulds > 0) parts.push(`${plural(p.moulds, 'mould', 'moulds')} in the making`);
  if (parts.length > 0) text += ` ${capitalise(parts.join(', '))}.`;
  if (p.orderOnHold) text += ' The order is on hold.';
  else if (p.held > 0) text += ` ${capitalise(plural(p.held, 'tray is', 'trays are'))} on hold.`;
  return text;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
