import { describe, expect, it } from 'vitest';
import { compareCost, costLine, mouldCosts, outlinePerimeterMm, pieceMassGrams, pieceVolumeCm3, platedAreaDm2, priceQuote, type CostingSpec } from './costing';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting } from './routing';
import { DEFAULT_COSTING_SETTINGS as S } from '@shared/schemas/costing';

const disc = { sizeMm: 30, heightMm: 30, thicknessMm: 2, outlineFactor: Math.PI / 4 };

function spec(over: Partial<CostingSpec> = {}): CostingSpec {
  return {
    process: 'hard_enamel',
    material: 'iron',
    sizeMm: 25,
    heightMm: 25,
    thicknessMm: 1.5,
    outlineFactor: null,
    colours: [{ name: 'Red' }, { name: 'White' }, { name: 'Navy' }],
    plating: 'gold',
    backing: { type: 'butterfly_clutch', count: 1 },
    backLogo: false,
    packaging: 'individual_bag',
    overrunPct: 5,
    ...over,
  };
}

function routingOf(s: CostingSpec) {
  return expandRouting(DEFAULT_ROUTING_TEMPLATES[s.process], { ...s, printing: false, epoxy: false, secondPlating: null, sandblast: false });
}

function price(s: CostingSpec, quantities: number[], reuse = {}) {
  return priceQuote({ spec: s, routing: routingOf(s), quantities, reuseMoulds: reuse, settings: S });
}

describe('material of a hand-computed disc', () => {
  // Computed: a disc 30 mm across and 2 mm thick is π × 15² × 2 mm³ = 1.4137 cm³.
  it('has the volume of π r² t', () => {
    expect(pieceVolumeCm3(disc, S)).toBeCloseTo(1.4137, 4);
  });

  // Density of iron 7.874 g/cm³: CRC Handbook of Chemistry and Physics → 1.4137 × 7.874 = 11.13 g.
  it('weighs 11.13 g in iron (CRC Handbook density) within 1 %', () => {
    const g = pieceMassGrams({ ...disc, material: 'iron' }, S);
    expect(Math.abs(g - 11.13) / 11.13).toBeLessThan(0.01);
  });

  // Zamak 3 (ASTM B86) about 6.6 g/cm³ → 1.4137 × 6.6 = 9.33 g.
  it('weighs 9.33 g in Zamak 3 (ASTM B86 density) within 1 %', () => {
    const g = pieceMassGrams({ ...disc, material: 'zinc_alloy' }, S);
    expect(Math.abs(g - 9.33) / 9.33).toBeLessThan(0.01);
  });

  // Computed: both faces 2 × 706.86 mm² plus the edge π × 30 × 2 = 188.50 mm² → 0.16022 dm².
  it('plates both faces and the edge', () => {
    expect(outlinePerimeterMm(disc)).toBeCloseTo(Math.PI * 30, 6);
    expect(platedAreaDm2(disc, S)).toBeCloseTo(0.16022, 4);
  });

  it('takes the default outline factor (a disc, π/4) when the spec gives none', () => {
    expect(pieceMassGrams({ ...disc, outlineFactor: null, material: 'iron' }, S)).toBeCloseTo(11.13, 1);
  });
});

describe('colours', () => {
  // Common practice: every hard-enamel colour is one more fill and one more oven cure.
  it('every colour added raises labour, oven time and the unit price', () => {
    let last = price(spec({ colours: [], process: 'die_struck' }), [500]).lines[0];
    for (let n = 1; n <= 8; n++) {
      const colours = Array.from({ length: n }, (_, i) => ({ name: `C${i + 1}` }));
      const line = price(spec({ colours }), [500]).lines[0];
      expect(line.ovenCycles).toBe(n);
      if (n > 1) {
        expect(line.breakdown.labour).toBeGreaterThan(last.breakdown.labour);
        expect(line.breakdown.oven).toBeGreaterThan(last.breakdown.oven);
      }
      expect(line.unitPrice).toBeGreaterThan(last.unitPrice);
      last = line;
    }
  });

  it('raises the price of soft enamel too (one fill each, one bake)', () => {
    const two = price(spec({ process: 'soft_enamel', colours: [{ name: 'A' }, { name: 'B' }] }), [1000]).lines[0];
    const three = price(spec({ process: 'soft_enamel', colours: [{ name: 'A' }, { name: 'B' }, { name: 'C' }] }), [1000]).lines[0];
    expect(three.unitPrice).toBeGreaterThan(two.unitPrice);
    expect(three.ovenCycles).toBe(1);
  });
});

describe('quantity breaks', () => {
  const breaks = [100, 250, 500, 1000, 2500, 5000, 10000];
  for (const s of [spec(), spec({ process: 'die_cast_3d', material: 'zinc_alloy', colours: [{ name: 'A' }] }), spec({ process: 'printed', colours: [] })]) {
    it(`the unit price falls with quantity (${s.process})`, () => {
      const lines = price(s, breaks).lines;
      for (let i = 1; i < lines.length; i++) expect(lines[i].unitPrice).toBeLessThan(lines[i - 1].unitPrice);
    });
  }

  it('the parts of the breakdown add up to the unit price', () => {
    for (const l of price(spec(), breaks).lines) {
      const b = l.breakdown;
      expect(b.material + b.labour + b.oven + b.plating + b.fittings + b.packaging + b.margin).toBeCloseTo(l.unitPrice, 3);
      expect(l.goodsTotal).toBeCloseTo(l.unitPrice * l.quantity, 2);
    }
  });

  it('keeps the margin as a share of the price', () => {
    const l = price(spec(), [1000]).lines[0];
    expect(l.breakdown.margin / l.unitPrice).toBeCloseTo(S.marginPct / 100, 2);
  });

  it('pays for the overrun: 10 % extra pieces cost more per ordered piece than none', () => {
    const none = price(spec({ overrunPct: 0 }), [1000]).lines[0];
    const ten = price(spec({ overrunPct: 10 }), [1000]).lines[0];
    expect(ten.unitPrice).toBeGreaterThan(none.unitPrice);
    expect(ten.madePieces).toBe(1100);
  });
});

describe('moulds', () => {
  it('are charged once, the same at every break', () => {
    const q = price(spec(), [100, 500, 1000, 5000]);
    expect(q.mouldCharge).toBeGreaterThan(0);
    for (const l of q.lines) {
      expect(l.breakdown.moulds).toBe(q.mouldCharge);
      expect(l.total).toBeCloseTo(l.goodsTotal + q.mouldCharge, 2);
    }
  });

  it('a back logo adds a back mould', () => {
    const front = mouldCosts({ sizeMm: 25, backLogo: false }, {}, S);
    const both = mouldCosts({ sizeMm: 25, backLogo: true }, {}, S);
    expect(front.map((m) => m.side)).toEqual(['front']);
    expect(both.map((m) => m.side)).toEqual(['front', 'back']);
    // demo defaults: a 25 mm front mould takes 2 + 25 × 0.08 = 4 engraving hours
    expect(front[0].hours).toBe(4);
    expect(front[0].charge).toBe(4 * S.labourRatePerHour.engrave + S.cuttersPerMould * S.cutterPrice + S.mouldBlockPrice);
  });

  it('a reorder that reuses its stored moulds pays none', () => {
    const q = price(spec({ backLogo: true }), [500, 1000], { front: true, back: true });
    expect(q.mouldCharge).toBe(0);
    for (const l of q.lines) expect(l.total).toBe(l.goodsTotal);
    const onlyFront = price(spec({ backLogo: true }), [500], { front: true });
    expect(onlyFront.mouldCharge).toBe(onlyFront.moulds.find((m) => m.side === 'back')!.charge);
  });

  it('the unit price does not include the moulds', () => {
    const fresh = price(spec(), [1000]).lines[0];
    const reused = price(spec(), [1000], { front: true }).lines[0];
    expect(reused.unitPrice).toBe(fresh.unitPrice);
  });
});

describe('quoted against actual', () => {
  it('an order made exactly as quoted has no variance; slower steps and scrap show where it went', () => {
    const s = spec();
    const routing = routingOf(s);
    const quoted = costLine(s, routing, 1000, 0, S);
    const asQuoted = quoted.steps.map((q) => ({
      seq: q.seq,
      name: q.name,
      stationKind: q.stationKind,
      minutes: q.minutes,
      scrap: 0,
      cureCycles: q.stationKind === 'cure' ? 1 : 0,
      cureMinutes: routing.find((r) => r.seq === q.seq)!.cureMinutes ?? null,
    }));
    const same = compareCost({ quoted, quantity: 1000, actualSteps: asQuoted, spec: s, routing, settings: S });
    expect(Math.abs(same.variance)).toBeLessThan(0.5);
    const fill = asQuoted.find((a) => a.stationKind === 'fill')!;
    const slower = asQuoted.map((a) => (a.seq === fill.seq ? { ...a, minutes: a.minutes + 120, scrap: 10 } : a));
    const c = compareCost({ quoted, quantity: 1000, actualSteps: slower, spec: s, routing, settings: S });
    const step = c.steps.find((x) => x.seq === fill.seq)!;
    // two extra hours at the fill rate, plus ten scrapped pieces' metal
    const metal = ((pieceMassGrams(s, S) * (1 + S.strikeLossPct / 100)) / 1000) * S.materialPricePerKg.iron;
    expect(step.variance).toBeCloseTo(2 * S.labourRatePerHour.fill + 10 * metal, 1);
    expect(c.variance).toBeCloseTo(same.variance + 2 * S.labourRatePerHour.fill + 10 * metal, 1);
  });
});
