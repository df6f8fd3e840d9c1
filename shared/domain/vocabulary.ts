// The words of the trade that client and server share. Pure data: no I/O, no Drizzle.
import { STATION_KIND_TRAITS } from './traveller/station-kinds';

export const ROLES = ['operator', 'supervisor', 'planner', 'manager', 'sales', 'admin'] as const;

/** The languages a person can read the app in. */
export const LOCALES = ['en', 'zh-CN'] as const;
export type Locale = (typeof LOCALES)[number];
export type Role = (typeof ROLES)[number];

export const STATION_KINDS = [
  'engrave',
  'mould_check',
  'strike',
  'cast',
  'trim',
  'post',
  'solder',
  'fill',
  'cure',
  'stone',
  'polish',
  'sandblast',
  'plate',
  'antique',
  'print',
  'epoxy',
  'inspect',
  'clutch',
  'bag',
  'pack',
  'dispatch',
] as const;
export type StationKind = (typeof STATION_KINDS)[number];

/** Plain English names of the station kinds (the tablet has its own translations). */
export const STATION_KIND_NAMES = Object.fromEntries(Object.entries(STATION_KIND_TRAITS).map(([k, t]) => [k, t.name])) as Record<StationKind, string>;

export const PROCESSES = ['hard_enamel', 'soft_enamel', 'die_struck', 'printed', 'die_cast_3d'] as const;
export type Process = (typeof PROCESSES)[number];

export const MATERIALS = ['iron', 'brass', 'copper', 'zinc_alloy'] as const;
export type Material = (typeof MATERIALS)[number];

export const PLATINGS = [
  'gold',
  'silver',
  'nickel',
  'black_nickel',
  'copper',
  'antique_gold',
  'antique_silver',
  'antique_copper',
  'antique_bronze',
  'dyed',
  'rainbow',
] as const;
export type Plating = (typeof PLATINGS)[number];

/** Antique finishes: plated, darkened by oxidising, then relief-polished so the raised metal shines (common practice). */
export const ANTIQUE_PLATINGS: readonly Plating[] = ['antique_gold', 'antique_silver', 'antique_copper', 'antique_bronze'];

export const BACKING_TYPES = ['butterfly_clutch', 'rubber_clutch', 'locking_clutch', 'magnet', 'safety_pin', 'screw_nut', 'none'] as const;
export type BackingType = (typeof BACKING_TYPES)[number];

export const PACKAGINGS = ['bulk', 'individual_bag', 'backing_card', 'gift_box'] as const;
export type Packaging = (typeof PACKAGINGS)[number];

export const ORDER_STATUSES = [
  'draft',
  'awaiting_payment',
  'awaiting_proof',
  'released',
  'in_production',
  'packed',
  'shipped',
  'on_hold',
  'cancelled',
] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];

export const TRAVELLER_KINDS = ['tray', 'mould'] as const;
export type TravellerKind = (typeof TRAVELLER_KINDS)[number];

export const SCAN_TYPES = ['start', 'finish', 'hold', 'release'] as const;
export type ScanType = (typeof SCAN_TYPES)[number];

/** Where a traveller stands right now (kept in tray_states, updated with each accepted event). */
export const TRAY_PHASES = ['waiting', 'in_process', 'curing', 'done', 'scrapped', 'merged'] as const;
export type TrayPhase = (typeof TRAY_PHASES)[number];

export const REJECTION_CODES = [
  'unknown_tray',
  'void_traveller',
  'bad_signature',
  'wrong_station',
  'not_started',
  'already_started',
  'curing',
  'quantity_mismatch',
  'on_hold',
  'mould_not_ready',
  'bad_time',
  'not_on_hold',
  'finished',
  'scrap_reason_missing',
  'bad_override',
  /** the event itself is malformed (fails the wire schema); the rest of its batch still goes through */
  'invalid_event',
  /** the tablet may record scans only at its own station */
  'station_not_allowed',
  /** not a scan: a run of wrong badge + PIN checks on a tablet, for supervisors to look into */
  'badge_failures',
] as const;
export type RejectionCode = (typeof REJECTION_CODES)[number];

/** One step of a traveller's routing, as stored on the order and sent over the wire. */
export interface RoutingStep {
  seq: number; // 1-based, contiguous
  name: string; // e.g. "Colour 2 of 3: fill"
  stationKind: StationKind;
  /** standard minutes per tray (set-up, handling) */
  trayMinutes: number;
  /** standard minutes per piece */
  pieceMinutes: number;
  /** minimum cure time for cure steps (minutes); the next step may not start before it has run out */
  cureMinutes?: number | null;
  /** 1-based colour number for fill/cure steps of enamel colours */
  colour?: number | null;
}

/**
 * Standard minutes of a step: its tray minutes (set-up, handling) for each tray plus its piece
 * minutes for each piece. The one place this sum is written: a tray of `pieces` pieces by
 * default, or `trays` trays (a fraction when the pieces half-fill the last one) holding `pieces`.
 */
export function standardMinutes(step: Pick<RoutingStep, 'trayMinutes' | 'pieceMinutes'>, pieces: number, trays = 1): number {
  return step.trayMinutes * trays + step.pieceMinutes * pieces;
}

/** The current state of one traveller: what the guards need to decide on the next scan. */
export interface TrayState {
  trayId: string;
  kind: TravellerKind;
  phase: TrayPhase;
  /** seq of the step it waits for or is in; null when done */
  stepSeq: number | null;
  /** pieces that entered the current step */
  quantity: number;
  /** station where the current step started (in_process or curing) */
  stationId: string | null;
  startedAt: string | null; // ISO
  /** when the last finish happened (queue time starts here) */
  waitingSince: string | null; // ISO
  /** earliest time the next step may start, after a cure step (ISO) */
  cureReadyAt: string | null;
  onHold: boolean;
  holdReason: string | null;
  releasedAt: string; // ISO, the traveller's release; events may not be earlier
  /** time of the last accepted event (ISO); a later event may not be earlier. Absent: derived from the fields above */
  lastEventAt?: string | null;
}

/** The state of a traveller just released to the floor: waiting for its first step. */
export function initialTrayState(input: { trayId: string; kind: TravellerKind; quantity: number; releasedAt: string }): TrayState {
  return {
    trayId: input.trayId,
    kind: input.kind,
    phase: 'waiting',
    stepSeq: 1,
    quantity: input.quantity,
    stationId: null,
    startedAt: null,
    waitingSince: input.releasedAt,
    cureReadyAt: null,
    onHold: false,
    holdReason: null,
    releasedAt: input.releasedAt,
  };
}
