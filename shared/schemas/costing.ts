// The rates a quote is priced with. Every rate is an admin setting (settings key `costing`);
// the defaults below are what a new factory starts with. Where each default comes from is said
// beside it: a published value, "common practice", "from memory" (recalled, not checked against
// a source) or "demo" (an invented figure for the demo factory, to be replaced by the factory's own).
import { z } from 'zod';
import { BACKING_TYPES, MATERIALS, PACKAGINGS, PLATINGS, STATION_KINDS } from '@shared/domain/vocabulary';

const money = z.number().min(0, 'A rate cannot be negative').max(1_000_000);
const pct = (max: number) => z.number().min(0, 'Cannot be negative').max(max);
const record = <K extends string>(keys: readonly K[], value: z.ZodType<number>) =>
  z.strictObject(Object.fromEntries(keys.map((k) => [k, value])) as Record<K, z.ZodType<number>>);

export const costingSettingsSchema = z.strictObject({
  /** ISO 4217 code every price is in */
  currency: z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as USD'),
  /** g/cm³ per material */
  densities: record(MATERIALS, z.number().positive('A density must be above 0').max(25)),
  /** money per kg of metal bought */
  materialPricePerKg: record(MATERIALS, money),
  /** share of the metal lost to the sheet skeleton when blanks are struck, percent */
  strikeLossPct: pct(300),
  /** share of the metal lost to sprues, runners and dross when parts are cast, percent */
  castLossPct: pct(300),
  /** outline area ÷ bounding-box area when a spec does not give its own */
  defaultOutlineFactor: z.number().min(0.1).max(1),
  /** thickness of a part whose order gives none (an order made without a quote), mm */
  defaultThicknessMm: z.number().positive().max(20),
  /** enamel paint per colour per piece, money */
  enamelPerColourPerPiece: money,
  /** money per working hour, per station kind */
  labourRatePerHour: record(STATION_KINDS, money),
  /** tray size the per-tray standard minutes are shared over */
  traySize: z.number().int().min(1).max(10_000),
  /** office work per order (artwork, proof, release, paperwork), minutes and rate */
  orderSetupMinutes: z.number().min(0).max(10_000),
  orderSetupRatePerHour: money,
  /** energy one oven load draws per hour of cure, kWh */
  ovenKwhPerLoadHour: z.number().min(0).max(1_000),
  /** electricity tariff, money per kWh */
  tariffPerKwh: money,
  /** pieces one oven load holds */
  ovenPiecesPerLoad: z.number().int().min(1).max(1_000_000),
  /** money per dm² of plated surface, per finish */
  platingPerDm2: record(PLATINGS, money),
  /** engraving hours of a front mould: base + per mm of the longest side */
  mouldHoursBase: z.number().min(0).max(500),
  mouldHoursPerMm: z.number().min(0).max(50),
  /** a back mould's engraving hours as a share of the front's */
  backMouldFactor: z.number().min(0).max(5),
  /** cutters worn per mould, and their price */
  cuttersPerMould: z.number().int().min(0).max(50),
  cutterPrice: money,
  /** the steel block of one mould */
  mouldBlockPrice: money,
  /** money per fitting (each piece carries `backing.count` of them) */
  fittingPrice: record(BACKING_TYPES, money),
  /** money per piece, per packaging */
  packagingPrice: record(PACKAGINGS, money),
  /** the factory's margin as a share of the price, percent (price = cost ÷ (1 − margin)) */
  marginPct: z.number().min(0).max(90),
});
export type CostingSettings = z.infer<typeof costingSettingsSchema>;

/** PUT /api/admin/costing: any part of the settings; what is left out keeps its value. */
export const costingSettingsPatchSchema = z
  .strictObject({
    ...costingSettingsSchema.shape,
    densities: costingSettingsSchema.shape.densities.partial(),
    materialPricePerKg: costingSettingsSchema.shape.materialPricePerKg.partial(),
    labourRatePerHour: costingSettingsSchema.shape.labourRatePerHour.partial(),
    platingPerDm2: costingSettingsSchema.shape.platingPerDm2.partial(),
    fittingPrice: costingSettingsSchema.shape.fittingPrice.partial(),
    packagingPrice: costingSettingsSchema.shape.packagingPrice.partial(),
  })
  .partial();
export type CostingSettingsPatch = z.infer<typeof costingSettingsPatchSchema>;

export const DEFAULT_COSTING_SETTINGS: CostingSettings = {
  currency: 'USD',
  // CRC Handbook of Chemistry and Physics: iron 7.874, copper 8.96 g/cm³; cartridge brass C26000
  // 8.53 g/cm³ (copper-alloy producer data sheets); Zamak 3 (ASTM B86) 6.6 g/cm³. From memory as
  // recorded in our reference list; check against the handbook before relying on them.
  densities: { iron: 7.874, brass: 8.53, copper: 8.96, zinc_alloy: 6.6 },
  // From memory: rough 2026 prices of sheet and ingot; set the factory's own buying prices.
  materialPricePerKg: { iron: 1.2, brass: 8.5, copper: 10.5, zinc_alloy: 3.6 },
  // From memory: struck blanks leave a skeleton of roughly a third of the sheet; a cast
  // shot loses under a tenth once sprues and runners are remelted.
  strikeLossPct: 35,
  castLossPct: 8,
  // Computed: a disc fills π/4 of its bounding square.
  defaultOutlineFactor: Math.round((Math.PI / 4) * 10_000) / 10_000,
  // From memory: struck and cast badges are commonly about 1.2 to 2 mm thick.
  defaultThicknessMm: 1.5,
  enamelPerColourPerPiece: 0.004, // demo
  // Demo: invented hourly rates; set the factory's own.
  labourRatePerHour: {
    engrave: 14,
    mould_check: 10,
    strike: 7,
    cast: 8,
    trim: 5,
    post: 5,
    solder: 6,
    sandblast: 5.5,
    antique: 6,
    fill: 5.5,
    cure: 4,
    stone: 5,
    polish: 5.5,
    plate: 8,
    print: 6.5,
    epoxy: 5,
    inspect: 5,
    clutch: 4.5,
    bag: 4,
    pack: 4,
    dispatch: 5,
  },
  traySize: 100, // the tray size orders use before a planner picks one
  orderSetupMinutes: 120, // demo
  orderSetupRatePerHour: 15, // demo
  ovenKwhPerLoadHour: 4, // from memory: a small electric box oven draws about 4 kW
  tariffPerKwh: 0.12, // demo
  ovenPiecesPerLoad: 3000, // demo
  // Demo: invented rates per dm²; precious finishes cost more (common practice).
  platingPerDm2: {
    gold: 0.9,
    silver: 0.6,
    nickel: 0.25,
    black_nickel: 0.35,
    copper: 0.25,
    antique_gold: 0.75,
    antique_silver: 0.55,
    antique_copper: 0.4,
    antique_bronze: 0.4,
    dyed: 0.3,
    rainbow: 1.2,
  },
  // Demo: a 25 mm front mould takes 2 + 25 × 0.08 = 4 h, the engraving time of the default
  // mould routing; five or six cutters per mould is common practice.
  mouldHoursBase: 2,
  mouldHoursPerMm: 0.08,
  backMouldFactor: 0.75,
  cuttersPerMould: 6,
  cutterPrice: 4,
  mouldBlockPrice: 15,
  // Demo: invented prices of fittings and packaging.
  fittingPrice: { butterfly_clutch: 0.03, rubber_clutch: 0.03, locking_clutch: 0.12, magnet: 0.25, safety_pin: 0.05, screw_nut: 0.15, none: 0 },
  packagingPrice: { bulk: 0, individual_bag: 0.02, backing_card: 0.08, gift_box: 0.6 },
  marginPct: 30, // demo
};

/** Stored settings over the defaults: a key missing from the stored value takes its default. */
export function mergeCostingSettings(base: CostingSettings, patch: CostingSettingsPatch | null | undefined): CostingSettings {
  if (!patch) return base;
  return {
    ...base,
    ...patch,
    densities: { ...base.densities, ...patch.densities },
    materialPricePerKg: { ...base.materialPricePerKg, ...patch.materialPricePerKg },
    labourRatePerHour: { ...base.labourRatePerHour, ...patch.labourRatePerHour },
    platingPerDm2: { ...base.platingPerDm2, ...patch.platingPerDm2 },
    fittingPrice: { ...base.fittingPrice, ...patch.fittingPrice },
    packagingPrice: { ...base.packagingPrice, ...patch.packagingPrice },
  };
}
