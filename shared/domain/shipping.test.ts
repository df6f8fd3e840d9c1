import { describe, expect, it } from 'vitest';
import { sum } from 'simple-statistics';
import {
  cartonTotals,
  checkFinishedQuantity,
  checkShipmentQuantity,
  normaliseTrackingNumber,
  orderShipped,
  overrunAllowance,
  packingProgress,
  planCartons,
  projectedPastDue,
  trayIsPacked,
  trayReachedPacking,
  type TrayPackState,
} from './shipping';
import type { StationKind } from './vocabulary';

describe('overrun allowance', () => {
  // Overrun allowance about +5 %, range 0–10 % (references: trade defaults, common practice).
  it('is 5 % of 300 = 15 pieces, exactly (no floating point residue)', () => {
    expect(overrunAllowance(300, 5)).toBe(15);
  });
  it('rounds a part piece up: 5 % of 110 = 5.5 → 6', () => {
    expect(overrunAllowance(110, 5)).toBe(6);
  });
  it('is 0 at 0 % and 10 of 100 at the 10 % end of the usual range', () => {
    expect(overrunAllowance(100, 0)).toBe(0);
    expect(overrunAllowance(100, 10)).toBe(10);
  });
  it('refuses a negative or fractional ordered quantity', () => {
    expect(() => overrunAllowance(-1, 5)).toThrow(RangeError);
    expect(() => overrunAllowance(1.5, 5)).toThrow(RangeError);
  });
});

describe('finished quantity against ordered and allowance', () => {
  // 500 ordered at +5 % → up to 525 expected (computed from the common-practice default).
  it('flags under-quantity for a decision', () => {
    const c = checkFinishedQuantity({ ordered: 500, overrunPct: 5, made: 488 });
    expect(c).toMatchObject({ verdict: 'under', shortBy: 12, overBy: 0, maxExpected: 525, needsDecision: true });
  });
  it('accepts exactly the ordered quantity and exactly the allowance', () => {
    expect(checkFinishedQuantity({ ordered: 500, overrunPct: 5, made: 500 }).verdict).toBe('ok');
    expect(checkFinishedQuantity({ ordered: 500, overrunPct: 5, made: 525 }).verdict).toBe('ok');
  });
  it('reports pieces beyond the allowance without asking for a decision', () => {
    const c = checkFinishedQuantity({ ordered: 500, overrunPct: 5, made: 530 });
    expect(c).toMatchObject({ verdict: 'over_allowance', overBy: 5, needsDecision: false });
  });
});

describe('shipment quantity', () => {
  it('allows partial shipments up to what was made', () => {
    expect(checkShipmentQuantity({ made: 520, alreadyShipped: 0, pieces: 300 })).toEqual({ ok: true, pieces: 300, remainingAfter: 220 });
    expect(checkShipmentQuantity({ made: 520, alreadyShipped: 300, pieces: 220 })).toEqual({ ok: true, pieces: 220, remainingAfter: 0 });
  });
  it('refuses shipping more than was made', () => {
    expect(checkShipmentQuantity({ made: 520, alreadyShipped: 300, pieces: 221 })).toEqual({
      ok: false,
      code: 'more_than_made',
      pieces: 221,
      available: 220,
    });
  });
  it('refuses an empty shipment as bad input', () => {
    expect(() => checkShipmentQuantity({ made: 10, alreadyShipped: 0, pieces: 0 })).toThrow(RangeError);
  });
});

describe('carton arithmetic', () => {
  const lines = [
    { count: 4, piecesPerCarton: 100, weightKg: 2.35 },
    { count: 1, piecesPerCarton: 25, weightKg: 0.7 },
  ];
  it('counts cartons, pieces (count × pieces per carton) and weight (count × weight)', () => {
    const t = cartonTotals(lines);
    expect(t.cartons).toBe(5);
    expect(t.pieces).toBe(425);
    expect(t.weightKg).toBe(10.1);
    // Cross-check with a general-purpose library (simple-statistics' sum, Kahan-compensated).
    expect(t.pieces).toBe(sum(lines.map((l) => l.count * l.piecesPerCarton)));
    expect(t.weightKg).toBeCloseTo(sum(lines.map((l) => l.count * l.weightKg)), 9);
  });
  it('keeps decimal weights exact: 3 × 0.1 kg = 0.3 kg', () => {
    expect(cartonTotals([{ count: 3, piecesPerCarton: 1, weightKg: 0.1 }]).weightKg).toBe(0.3);
  });
  it('refuses zero or fractional counts', () => {
    expect(() => cartonTotals([{ count: 0, piecesPerCarton: 100, weightKg: 1 }])).toThrow(RangeError);
    expect(() => cartonTotals([{ count: 1, piecesPerCarton: 2.5, weightKg: 1 }])).toThrow(RangeError);
  });
  it('plans full cartons and one part carton', () => {
    expect(planCartons(425, 100)).toEqual({ full: 4, partPieces: 25, cartons: 5 });
    expect(planCartons(400, 100)).toEqual({ full: 4, partPieces: 0, cartons: 4 });
    expect(planCartons(0, 100)).toEqual({ full: 0, partPieces: 0, cartons: 0 });
    // Identity: full × per carton + part = pieces, for a spread of values.
    for (const [p, per] of [
      [1, 1],
      [999, 50],
      [1001, 250],
      [37, 40],
    ]) {
      const r = planCartons(p, per);
      expect(r.full * per + r.partPieces).toBe(p);
      expect(r.partPieces).toBeLessThan(per);
    }
  });
});

describe('when an order counts as shipped', () => {
  it('is shipped when the dispatch step of its last tray finishes; shippedAt is that time', () => {
    const v = orderShipped([
      { phase: 'done', dispatchFinishedAt: '2025-03-04T09:15:00.000Z' },
      { phase: 'done', dispatchFinishedAt: '2025-03-05T14:02:00.000Z' },
      { phase: 'done', dispatchFinishedAt: '2025-03-03T16:40:00.000Z' },
    ]);
    expect(v).toMatchObject({ shipped: true, shippedAt: '2025-03-05T14:02:00.000Z', dispatched: 3, open: 0 });
  });
  it('is not shipped while one tray is still on the floor', () => {
    const v = orderShipped([
      { phase: 'done', dispatchFinishedAt: '2025-03-04T09:15:00.000Z' },
      { phase: 'waiting', dispatchFinishedAt: null },
    ]);
    expect(v).toMatchObject({ shipped: false, shippedAt: null, open: 1 });
  });
  it('counts trays written off (or merged into another) as done', () => {
    const v = orderShipped([
      { phase: 'done', dispatchFinishedAt: '2025-03-04T09:15:00+02:00' },
      { phase: 'scrapped', dispatchFinishedAt: null },
      { phase: 'merged', dispatchFinishedAt: null },
    ]);
    expect(v).toMatchObject({ shipped: true, shippedAt: '2025-03-04T07:15:00.000Z', writtenOff: 2 });
  });
  it('an order with every tray written off has shipped nothing', () => {
    expect(orderShipped([{ phase: 'scrapped', dispatchFinishedAt: null }]).shipped).toBe(false);
    expect(orderShipped([]).shipped).toBe(false);
  });
});

describe('packing progress', () => {
  const kinds: StationKind[] = ['strike', 'inspect', 'bag', 'pack', 'dispatch'];
  const routing = kinds.map((stationKind, i) => ({ seq: i + 1, stationKind }));
  const t = (stepSeq: number | null, quantity: number, phase: TrayPackState['phase'] = 'waiting') => ({
    phase: stepSeq === null && phase === 'waiting' ? ('done' as const) : phase,
    stepSeq,
    quantity,
    routing,
  });
  it('a tray is packed once its pack step has finished', () => {
    expect(trayIsPacked(t(4, 100, 'in_process'))).toBe(false);
    expect(trayIsPacked(t(5, 100))).toBe(true);
    expect(trayIsPacked(t(null, 100))).toBe(true);
  });
  it('without a pack step, a tray is packed when it reaches dispatch', () => {
    const r = [
      { seq: 1, stationKind: 'inspect' as const },
      { seq: 2, stationKind: 'dispatch' as const },
    ];
    expect(trayIsPacked({ phase: 'waiting', stepSeq: 1, quantity: 5, routing: r })).toBe(false);
    expect(trayIsPacked({ phase: 'waiting', stepSeq: 2, quantity: 5, routing: r })).toBe(true);
  });
  it('counts pieces as finished once the tray stands at packing', () => {
    expect(trayReachedPacking(t(3, 100))).toBe(false);
    expect(trayReachedPacking(t(4, 100))).toBe(true);
    expect(trayReachedPacking(t(5, 100))).toBe(true);
    expect(trayReachedPacking(t(null, 100))).toBe(true);
    expect(trayReachedPacking(t(4, 100, 'scrapped'))).toBe(false);
  });
  it('shows what is still on the floor of a partly packed order', () => {
    const p = packingProgress([t(5, 100), t(null, 120), t(2, 90), t(4, 80, 'in_process'), t(3, 40, 'scrapped')]);
    expect(p.packedPieces).toBe(220);
    expect(p.onFloorPieces).toBe(170);
    expect(p.onFloor.map((x) => x.stepSeq)).toEqual([2, 4]);
  });
});

describe('tracking numbers as typed or scanned', () => {
  it('drops a scanner symbology prefix, control characters, spaces and case', () => {
    // AIM symbology identifiers "]C1" (GS1-128) and group separator (ASCII 29): from memory.
    expect(normaliseTrackingNumber(']C1 1z 999 aa1 0123456784\r\n')).toBe('1Z999AA10123456784');
    expect(normaliseTrackingNumber('JD01 4600 0038\u001d')).toBe('JD0146000038');
    expect(normaliseTrackingNumber('  ab-123  ')).toBe('AB-123');
  });
});

describe('projected ship time against the due date', () => {
  // A due date is a whole local day. Asia/Shanghai is UTC+8 all year, no daylight saving (IANA tz database).
  it('is on time up to the end of the due date in the factory time zone', () => {
    const endOfDueDay = Date.parse('2025-06-10T16:00:00Z'); // 2025-06-11 00:00 in Shanghai
    expect(projectedPastDue(endOfDueDay - 60_000, '2025-06-10', 'Asia/Shanghai')).toBe(false);
    expect(projectedPastDue(endOfDueDay, '2025-06-10', 'Asia/Shanghai')).toBe(true);
  });
  it('crosses month ends', () => {
    expect(projectedPastDue(Date.parse('2025-01-31T23:59:00Z'), '2025-01-31', 'UTC')).toBe(false);
    expect(projectedPastDue(Date.parse('2025-02-01T00:00:00Z'), '2025-01-31', 'UTC')).toBe(true);
  });
});
