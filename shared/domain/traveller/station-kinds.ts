// What each station kind is and does, in one table. Every rule that depends on the kind of a
// station (an oven cures, a press needs the moulds, the mould shop makes and checks tools, packing
// and dispatch move the order on, ovens and baths take loads) asks this table instead of naming
// kinds itself. Adding a station kind: add it to STATION_KINDS and give it a row here; the
// compiler then names every other place that needs it (translations, crew, scrap chances).
import type { CustomerStage } from '../stages';
import type { StationKind } from '../vocabulary';

/** The loads a supervisor makes of waiting trays: an oven load (one cure profile), a plating load (one finish). */
export const LOAD_KINDS = ['cure', 'plate'] as const;
export type LoadKind = (typeof LOAD_KINDS)[number];

export interface StationKindTraits {
  /** plain English name (the tablet has its own translations) */
  name: string;
  /** the customer stage the kind belongs to on the status page */
  stage: CustomerStage;
  /**
   * an oven: a step of this kind has a minimum cure time, the tray is `curing` from its start, and
   * the next step may not start before the time has run (the cure interlock)
   */
  cures: boolean;
  /** a start here needs the order's moulds (or cutting die) made and checked */
  needsMould: boolean;
  /** a step of a mould traveller: the tool is made (engraved or cut) or checked here */
  mouldShop: 'make' | 'check' | null;
  /** finishing a step of this kind moves the order on: packed, or dispatched (shipped) */
  milestone: 'packed' | 'dispatched' | null;
  /** trays waiting for this kind are grouped into loads of this kind */
  loads: LoadKind | null;
  /** a colour-numbered step ("Colour 2 of 3: fill"), with the word its name ends in; null for others */
  colourStep: string | null;
  /** comes after final inspection: fitting backs, bagging, packing, dispatch */
  afterInspection: boolean;
}

const base = { cures: false, needsMould: false, mouldShop: null, milestone: null, loads: null, colourStep: null, afterInspection: false } as const;

export const STATION_KIND_TRAITS: Record<StationKind, StationKindTraits> = {
  engrave: { ...base, name: 'mould engraving', stage: 'artwork_moulds', mouldShop: 'make' },
  mould_check: { ...base, name: 'mould check', stage: 'artwork_moulds', mouldShop: 'check' },
  strike: { ...base, name: 'die striking', stage: 'metal_forming', needsMould: true },
  cast: { ...base, name: 'zinc die casting', stage: 'metal_forming', needsMould: true },
  trim: { ...base, name: 'trimming', stage: 'metal_forming' },
  post: { ...base, name: 'post fitting', stage: 'metal_forming' },
  solder: { ...base, name: 'pin soldering', stage: 'metal_forming' },
  fill: { ...base, name: 'colour fill', stage: 'colour', colourStep: 'fill' },
  cure: { ...base, name: 'curing oven', stage: 'colour', cures: true, loads: 'cure', colourStep: 'cure' },
  stone: { ...base, name: 'stoning', stage: 'finishing_plating' },
  polish: { ...base, name: 'polishing', stage: 'finishing_plating' },
  sandblast: { ...base, name: 'sandblasting', stage: 'finishing_plating' },
  plate: { ...base, name: 'plating', stage: 'finishing_plating', loads: 'plate' },
  antique: { ...base, name: 'antique oxidising', stage: 'finishing_plating' },
  print: { ...base, name: 'screen printing', stage: 'finishing_plating' },
  epoxy: { ...base, name: 'epoxy', stage: 'finishing_plating' },
  inspect: { ...base, name: 'inspection', stage: 'inspection' },
  clutch: { ...base, name: 'clutch fitting', stage: 'packing', afterInspection: true },
  bag: { ...base, name: 'bagging', stage: 'packing', afterInspection: true },
  pack: { ...base, name: 'packing', stage: 'packing', milestone: 'packed', afterInspection: true },
  dispatch: { ...base, name: 'dispatch', stage: 'packing', milestone: 'dispatched', afterInspection: true },
};

const UNKNOWN: StationKindTraits = { ...base, name: 'another station', stage: 'metal_forming' };

/** The traits of a kind read from storage or the wire (an unknown kind has none of the special traits). */
export function kindTraits(kind: string | null | undefined): StationKindTraits {
  return kind != null && Object.hasOwn(STATION_KIND_TRAITS, kind) ? STATION_KIND_TRAITS[kind as StationKind] : UNKNOWN;
}

/** True for an oven kind: its steps carry a cure time and hold the next step until it has run. */
export const cures = (kind: string | null | undefined): boolean => kindTraits(kind).cures;

/** True when a start at a station of this kind needs the order's moulds ready. */
export const needsMould = (kind: string | null | undefined): boolean => kindTraits(kind).needsMould;

/** The kinds with a trait, in STATION_KINDS order (e.g. every oven kind, for SQL `in (...)`). */
export function kindsWhere(test: (t: StationKindTraits) => boolean): StationKind[] {
  return (Object.keys(STATION_KIND_TRAITS) as StationKind[]).filter((k) => test(STATION_KIND_TRAITS[k]));
}

/** Every oven kind: their calendar (ovens cure through nights and days off) is asked for first. */
export const OVEN_KINDS: readonly StationKind[] = kindsWhere((t) => t.cures);

/** The one station kind that does a load kind's work (the oven for `cure`, the bath for `plate`). */
export function loadStationKind(load: LoadKind): StationKind {
  return kindsWhere((t) => t.loads === load)[0];
}

export interface LoadKindTraits {
  /** "an oven load" */
  loadName: string;
  /** what the trays wait for: "the oven" */
  waitingFor: string;
  /** the prefix of a load's number */
  numberPrefix: string;
  /** what every tray of one load shares */
  groupedBy: 'cure profile' | 'finish';
  /** how a group key reads: "180 min cure", "antique gold" */
  label: (key: string) => string;
}

/** How each load kind is shown and numbered. */
export const LOAD_KIND_TRAITS: Record<LoadKind, LoadKindTraits> = {
  cure: { loadName: 'an oven load', waitingFor: 'the oven', numberPrefix: 'OV', groupedBy: 'cure profile', label: (key) => `${key} min cure` },
  plate: { loadName: 'a plating load', waitingFor: 'plating', numberPrefix: 'PL', groupedBy: 'finish', label: (key) => key.replace(/_/g, ' ') },
};

/** The kind where colours are filled, one step per colour. */
export const FILL_KIND: StationKind = kindsWhere((t) => t.colourStep != null && !t.cures)[0];

/** The oven kind: where cure steps are made (the colour cures and the epoxy cure of every default routing). */
export const OVEN_KIND: StationKind = kindsWhere((t) => t.cures)[0];
