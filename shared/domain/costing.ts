// Costing from the routing: what a quantity of a spec costs to make, piece by piece, and the
// price with the factory's margin. Pure functions; every rate comes from the settings.
//
// - material: outline area (longest side × height × outline factor) × thickness × density,
//   plus the striking or casting loss, at the metal's price; enamel paint per colour;
// - labour: each routing step's standard minutes (per tray, for the trays the pieces fill, and
//   per piece) × the station kind's rate, plus the office set-up of one order;
// - oven: each cure step is one oven cycle of its cure time; a load's energy is shared over the
//   pieces of this order in it (a small order pays a whole load);
// - plating: both faces and the edge × the finish's rate per dm²;
// - moulds: engraving hours by size × the engraver's rate, cutters and the steel block, once per
//   quote; none for a side whose stored mould a reorder reuses;
// - fittings and packaging per piece;
// - overrun: the extra pieces made are paid by the ordered ones;
// - margin: price = cost ÷ (1 − margin).
// Trays are counted as a fraction of a tray (never less than one), so a price does not jump
// where one more piece would open another tray.
import type { CostingSettings } from '@shared/schemas/costing';
import { standardMinutes, type BackingType, type Material, type Packaging, type Plating, type Process, type RoutingStep, type StationKind } from './vocabulary';
import { cures } from './traveller/station-kinds';

export interface CostingSpec {
  process: Process;
  material: Material;
  /** longest side, mm */
  sizeMm: number;
  /** the other side of the bounding box, mm */
  heightMm: number;
  thicknessMm: number;
  /** outline area ÷ bounding-box area; the settings' default when absent */
  outlineFactor?: number | null;
  colours: readonly unknown[];
  plating: Plating;
  backing: { type: BackingType; count: number };
  backLogo: boolean;
  packaging: Packaging;
  overrunPct: number;
}

export type MouldSide = 'front' | 'back';

export interface MouldCost {
  side: MouldSide;
  /** a reorder reuses the stored mould: nothing to engrave */
  reuse: boolean;
  hours: number;
  charge: number;
}

export interface StepCost {
  seq: number;
  name: string;
  stationKind: StationKind;
  /** standard minutes for all pieces made */
  minutes: number;
  cost: number;
}

/** Money per piece except `materialGrams` (grams per piece) and `moulds` (the one-off charge of the quote). */
export interface CostBreakdown {
  materialGrams: number;
  material: number;
  labour: number;
  oven: number;
  plating: number;
  moulds: number;
  fittings: number;
  packaging: number;
  margin: number;
}

export interface CostLine {
  quantity: number;
  /** pieces made for it, overrun included */
  madePieces: number;
  unitPrice: number;
  /** unitPrice × quantity */
  goodsTotal: number;
  /** the one-off mould charge (the same at every break) */
  mouldCharge: number;
  /** what the customer pays for this break: goods and moulds */
  total: number;
  /** cost per piece before margin */
  unitCost: number;
  breakdown: CostBreakdown;
  steps: StepCost[];
  ovenCycles: number;
}

export interface QuotePricing {
  currency: string;
  materialGrams: number;
  platedDm2: number;
  moulds: MouldCost[];
  mouldCharge: number;
  lines: CostLine[];
}

const round = (x: number, places: number) => {
  const f = 10 ** places;
  return Math.round((x + Number.EPSILON) * f) / f;
};
export const roundMoney = (x: number) => round(x, 2);

/** Outline area in mm²: the bounding box × the outline's share of it. */
export function outlineAreaMm2(
  spec: Pick<CostingSpec, 'sizeMm' | 'heightMm' | 'outlineFactor'>,
  settings: Pick<CostingSettings, 'defaultOutlineFactor'>,
): number {
  return spec.sizeMm * spec.heightMm * (spec.outlineFactor ?? settings.defaultOutlineFactor);
}

/** Volume of one piece in cm³. */
export function pieceVolumeCm3(
  spec: Pick<CostingSpec, 'sizeMm' | 'heightMm' | 'outlineFactor' | 'thicknessMm'>,
  settings: Pick<CostingSettings, 'defaultOutlineFactor'>,
): number {
  return (outlineAreaMm2(spec, settings) * spec.thicknessMm) / 1000;
}

/** Grams of metal in one finished piece (volume × density), before any loss. */
export function pieceMassGrams(
  spec: Pick<CostingSpec, 'sizeMm' | 'heightMm' | 'outlineFactor' | 'thicknessMm' | 'material'>,
  settings: Pick<CostingSettings, 'defaultOutlineFactor' | 'densities'>,
): number {
  return pieceVolumeCm3(spec, settings) * settings.densities[spec.material];
}

/**
 * The outline's perimeter in mm, taken as the ellipse inscribed in the bounding box
 * (Ramanujan's first approximation; exact for a circle).
 */
export function outlinePerimeterMm(spec: Pick<CostingSpec, 'sizeMm' | 'heightMm'>): number {
  const a = spec.sizeMm / 2;
  const b = spec.heightMm / 2;
  return Math.PI * (3 * (a + b) - Math.sqrt((3 * a + b) * (a + 3 * b)));
}

/** Plated surface of one piece in dm²: both faces and the edge. */
export function platedAreaDm2(
  spec: Pick<CostingSpec, 'sizeMm' | 'heightMm' | 'outlineFactor' | 'thicknessMm'>,
  settings: Pick<CostingSettings, 'defaultOutlineFactor'>,
): number {
  const mm2 = 2 * outlineAreaMm2(spec, settings) + outlinePerimeterMm(spec) * spec.thicknessMm;
  return mm2 / 10_000;
}

/** Striking or casting loss of the routing's forming step, as a share (0.35 = 35 %). */
export function formingLoss(routing: readonly Pick<RoutingStep, 'stationKind'>[], settings: Pick<CostingSettings, 'strikeLossPct' | 'castLossPct'>): number {
  if (routing.some((s) => s.stationKind === 'cast')) return settings.castLossPct / 100;
  if (routing.some((s) => s.stationKind === 'strike')) return settings.strikeLossPct / 100;
  return 0;
}

/** Engraving hours of one mould side. */
export function mouldHours(spec: Pick<CostingSpec, 'sizeMm'>, side: MouldSide, settings: CostingSettings): number {
  const front = settings.mouldHoursBase + settings.mouldHoursPerMm * spec.sizeMm;
  return side === 'front' ? front : front * settings.backMouldFactor;
}

/**
 * Moulds of a quote: a front mould, and a back mould when there is a back logo; a side whose
 * stored mould is reused costs nothing.
 */
export function mouldCosts(spec: Pick<CostingSpec, 'sizeMm' | 'backLogo'>, reuse: Partial<Record<MouldSide, boolean>>, settings: CostingSettings): MouldCost[] {
  const sides: MouldSide[] = spec.backLogo ? ['front', 'back'] : ['front'];
  return sides.map((side) => {
    if (reuse[side]) return { side, reuse: true, hours: 0, charge: 0 };
    const hours = mouldHours(spec, side, settings);
    const charge = hours * settings.labourRatePerHour.engrave + settings.cuttersPerMould * settings.cutterPrice + settings.mouldBlockPrice;
    return { side, reuse: false, hours: round(hours, 2), charge: roundMoney(charge) };
  });
}

/** Trays the made pieces fill, as a fraction, at least one. */
export function trayShare(madePieces: number, traySize: number): number {
  return Math.max(1, madePieces / traySize);
}

/** Standard minutes and labour cost of each routing step for `madePieces`. */
export function stepCosts(routing: readonly RoutingStep[], madePieces: number, settings: CostingSettings): StepCost[] {
  const trays = trayShare(madePieces, settings.traySize);
  return routing.map((s) => {
    const minutes = standardMinutes(s, madePieces, trays);
    return {
      seq: s.seq,
      name: s.name,
      stationKind: s.stationKind,
      minutes: round(minutes, 2),
      cost: (minutes / 60) * settings.labourRatePerHour[s.stationKind],
    };
  });
}

/**
 * Oven cost of all cure cycles for `madePieces`: a load's energy is shared over the pieces of
 * this order in it, so an order smaller than a load pays a whole load and a larger one pays
 * its share of full loads.
 */
export function ovenCost(routing: readonly RoutingStep[], madePieces: number, settings: CostingSettings): { cycles: number; cost: number } {
  const cureSteps = routing.filter((s) => cures(s.stationKind));
  const piecesPerLoad = Math.min(madePieces, settings.ovenPiecesPerLoad);
  let cost = 0;
  for (const c of cureSteps) {
    const loadCost = settings.ovenKwhPerLoadHour * ((c.cureMinutes ?? 0) / 60) * settings.tariffPerKwh;
    cost += (loadCost / piecesPerLoad) * madePieces;
  }
  return { cycles: cureSteps.length, cost };
}

/** The cost (and price) of one quantity of the spec. */
export function costLine(spec: CostingSpec, routing: readonly RoutingStep[], quantity: number, mouldCharge: number, settings: CostingSettings): CostLine {
  if (!Number.isInteger(quantity) || quantity < 1) throw new RangeError('quantity must be a whole number above 0');
  // The allowance as a fraction of pieces: the price of a break never depends on rounding up one piece.
  const made = quantity * (1 + spec.overrunPct / 100);
  const grams = pieceMassGrams(spec, settings);
  const metalKgPerPiece = (grams * (1 + formingLoss(routing, settings))) / 1000;
  const materialPerMade = metalKgPerPiece * settings.materialPricePerKg[spec.material] + spec.colours.length * settings.enamelPerColourPerPiece;
  const steps = stepCosts(routing, made, settings);
  const setup = (settings.orderSetupMinutes / 60) * settings.orderSetupRatePerHour;
  const labourTotal = steps.reduce((sum, s) => sum + s.cost, 0) + setup;
  const oven = ovenCost(routing, made, settings);
  const platingPerMade = platedAreaDm2(spec, settings) * settings.platingPerDm2[spec.plating];
  const fittingsPerMade = settings.fittingPrice[spec.backing.type] * spec.backing.count;
  const packagingPerPiece = settings.packagingPrice[spec.packaging];

  const perPiece = {
    material: (materialPerMade * made) / quantity,
    labour: labourTotal / quantity,
    oven: oven.cost / quantity,
    plating: (platingPerMade * made) / quantity,
    fittings: (fittingsPerMade * made) / quantity,
    // only the pieces delivered are packed
    packaging: packagingPerPiece,
  };
  const unitCost = perPiece.material + perPiece.labour + perPiece.oven + perPiece.plating + perPiece.fittings + perPiece.packaging;
  const unitPrice = round(unitCost / (1 - settings.marginPct / 100), 3);
  const breakdown: CostBreakdown = {
    materialGrams: round(grams, 2),
    material: round(perPiece.material, 4),
    labour: round(perPiece.labour, 4),
    oven: round(perPiece.oven, 4),
    plating: round(perPiece.plating, 4),
    moulds: roundMoney(mouldCharge),
    fittings: round(perPiece.fittings, 4),
    packaging: round(perPiece.packaging, 4),
    margin: 0,
  };
  // the margin is what is left of the rounded price, so the parts add up to it
  breakdown.margin = round(
    unitPrice - (breakdown.material + breakdown.labour + breakdown.oven + breakdown.plating + breakdown.fittings + breakdown.packaging),
    4,
  );
  const goodsTotal = roundMoney(unitPrice * quantity);
  return {
    quantity,
    madePieces: Math.ceil(made - 1e-9),
    unitPrice,
    goodsTotal,
    mouldCharge: roundMoney(mouldCharge),
    total: roundMoney(goodsTotal + mouldCharge),
    unitCost: round(unitCost, 4),
    breakdown,
    steps: steps.map((s) => ({ ...s, cost: roundMoney(s.cost) })),
    ovenCycles: oven.cycles,
  };
}

/** A whole quote: every quantity break of one spec, the moulds charged once. */
export function priceQuote(input: {
  spec: CostingSpec;
  routing: readonly RoutingStep[];
  quantities: readonly number[];
  reuseMoulds: Partial<Record<MouldSide, boolean>>;
  settings: CostingSettings;
}): QuotePricing {
  const { spec, routing, settings } = input;
  const moulds = mouldCosts(spec, input.reuseMoulds, settings);
  const mouldCharge = roundMoney(moulds.reduce((sum, m) => sum + m.charge, 0));
  return {
    currency: settings.currency,
    materialGrams: round(pieceMassGrams(spec, settings), 2),
    platedDm2: round(platedAreaDm2(spec, settings), 4),
    moulds,
    mouldCharge,
    lines: input.quantities.map((q) => costLine(spec, routing, q, mouldCharge, settings)),
  };
}

// ---------------------------------------------------------------------------------------
// Quoted against actual

export interface ActualStepInput {
  seq: number;
  name: string;
  stationKind: StationKind;
  /** working minutes measured between start and finish scans, all trays */
  minutes: number;
  /** pieces scrapped at this step */
  scrap: number;
  /** oven cycles run for this step (cure steps: one per tray load) */
  cureCycles: number;
  cureMinutes: number | null;
}

export interface StepVariance {
  seq: number;
  name: string;
  stationKind: StationKind;
  quotedMinutes: number;
  actualMinutes: number;
  quotedCost: number;
  actualCost: number;
  variance: number;
  scrap: number;
}

export interface CostComparison {
  quoted: number;
  actual: number;
  variance: number;
  steps: StepVariance[];
  /** labour, oven and scrap parts of the actual cost */
  actualParts: { labour: number; oven: number; scrap: number; material: number };
}

/**
 * The quoted cost of an order's make against the cost measured on the floor, both at the same
 * rates (so a variance is the floor's, not a changed rate's). Each step counts its labour, and a
 * cure step also its oven energy (quoted: the loads the quote counted; actual: the cycles run);
 * the actual side also pays for scrapped pieces (their metal). A step run that the quote did not
 * have (the routing was changed after the quote) is shown with nothing quoted. Material,
 * plating, fittings and packaging are taken as quoted: the scans do not measure them.
 */
export function compareCost(input: {
  quoted: CostLine;
  quantity: number;
  actualSteps: readonly ActualStepInput[];
  spec: CostingSpec;
  routing: readonly RoutingStep[];
  settings: CostingSettings;
}): CostComparison {
  const { quoted, quantity, settings } = input;
  const q = quoted.breakdown;
  const fixedParts = (q.material + q.plating + q.fittings + q.packaging) * quantity;
  const quotedTotal = quoted.unitCost * quantity;
  const grams = pieceMassGrams(input.spec, settings);
  const metalPerPiece = ((grams * (1 + formingLoss(input.routing, settings))) / 1000) * settings.materialPricePerKg[input.spec.material];
  const loadCost = (cureMinutes: number | null | undefined) => settings.ovenKwhPerLoadHour * ((cureMinutes ?? 0) / 60) * settings.tariffPerKwh;
  // the quote's oven energy per cure step, as ovenCost counts it for the pieces made
  const made = quantity * (1 + input.spec.overrunPct / 100);
  const piecesPerLoad = Math.min(made, settings.ovenPiecesPerLoad);
  const routingBySeq = new Map(input.routing.map((r) => [r.seq, r]));
  const quotedOven = (seq: number, stationKind: StationKind) => {
    const r = routingBySeq.get(seq);
    return cures(stationKind) && r ? (loadCost(r.cureMinutes) / piecesPerLoad) * made : 0;
  };
  let labour = 0;
  let oven = 0;
  let scrapCost = 0;
  const bySeq = new Map(input.actualSteps.map((s) => [s.seq, s]));
  const quotedSeqs = new Set(quoted.steps.map((s) => s.seq));
  const extra: StepCost[] = input.actualSteps
    .filter((a) => !quotedSeqs.has(a.seq))
    .map((a) => ({ seq: a.seq, name: a.name, stationKind: a.stationKind, minutes: 0, cost: 0 }));
  const rows = [...quoted.steps.map((s) => ({ ...s, cost: s.cost + quotedOven(s.seq, s.stationKind) })), ...extra].sort((a, b) => a.seq - b.seq);
  const steps: StepVariance[] = rows.map((qs) => {
    const a = bySeq.get(qs.seq);
    const rate = settings.labourRatePerHour[qs.stationKind];
    const actualLabour = ((a?.minutes ?? 0) / 60) * rate;
    labour += actualLabour;
    let stepOven = 0;
    if (a && a.cureCycles > 0) {
      // each cycle the order's trays ran is a load's energy, as the quote counts whole loads
      stepOven = a.cureCycles * loadCost(a.cureMinutes);
      oven += stepOven;
    }
    const scrap = a?.scrap ?? 0;
    const stepScrap = scrap * metalPerPiece;
    scrapCost += stepScrap;
    const actualCost = actualLabour + stepOven + stepScrap;
    return {
      seq: qs.seq,
      name: qs.name,
      stationKind: qs.stationKind,
      quotedMinutes: round(qs.minutes, 1),
      actualMinutes: round(a?.minutes ?? 0, 1),
      quotedCost: roundMoney(qs.cost),
      actualCost: roundMoney(actualCost),
      variance: roundMoney(actualCost - qs.cost),
      scrap,
    };
  });
  const setup = (settings.orderSetupMinutes / 60) * settings.orderSetupRatePerHour;
  const actual = fixedParts + labour + setup + oven + scrapCost;
  return {
    quoted: roundMoney(quotedTotal),
    actual: roundMoney(actual),
    variance: roundMoney(actual - quotedTotal),
    steps,
    actualParts: { labour: roundMoney(labour + setup), oven: roundMoney(oven), scrap: roundMoney(scrapCost), material: roundMoney(fixedParts) },
  };
}
