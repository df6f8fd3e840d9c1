import { describe, expect, it } from 'vitest';
import { defaultWindow, lastWeeks, throughputByWeek, yieldTotals } from './summary';

describe('manager summary figures', () => {
  it('the last four weeks end today and do not overlap (28 days)', () => {
    const w = lastWeeks('2026-12-04');
    expect(w).toEqual([
      { from: '2026-11-07', to: '2026-11-13' },
      { from: '2026-11-14', to: '2026-11-20' },
      { from: '2026-11-21', to: '2026-11-27' },
      { from: '2026-11-28', to: '2026-12-04' },
    ]);
    // across a year end
    expect(lastWeeks('2026-01-03', 1)).toEqual([{ from: '2025-12-28', to: '2026-01-03' }]);
  });

  it('first-pass yield and scrap rate over all steps, weighted by pieces', () => {
    // worked by hand: (98 + 45) / (100 + 50) = 0.9533…; (1 + 3) / 150 = 0.0266…
    const t = yieldTotals([
      { inQty: 100, firstPassQty: 98, scrapQty: 1 },
      { inQty: 50, firstPassQty: 45, scrapQty: 3 },
    ]);
    expect(t.firstPassYield).toBeCloseTo(143 / 150, 10);
    expect(t.scrapRate).toBeCloseTo(4 / 150, 10);
    expect(t.inQty).toBe(150);
    expect(yieldTotals([])).toEqual({ firstPassYield: null, scrapRate: null, inQty: 0 });
  });

  it('reports open on the last four weeks with data, not on empty weeks', () => {
    // data ended three weeks ago: the window ends there (28 days, both ends included)
    expect(defaultWindow('2026-11-13', '2026-12-04')).toEqual({ from: '2026-10-17', to: '2026-11-13' });
    // data up to today, or none at all: the four weeks up to today
    expect(defaultWindow('2026-12-04', '2026-12-04')).toEqual({ from: '2026-11-07', to: '2026-12-04' });
    expect(defaultWindow(null, '2026-12-04')).toEqual({ from: '2026-11-07', to: '2026-12-04' });
  });
});

describe('throughputByWeek', () => {
  it('sums daily buckets into the given weeks, leaving days outside them out (worked by hand)', () => {
    const weeks = lastWeeks('2026-12-05', 2); // 22–28 Nov and 29 Nov – 5 Dec
    const day = (label: string, orders: number, trays: number, pieces: number) => ({ label, orders, trays, pieces });
    const out = throughputByWeek(weeks, [
      day('2026-11-21', 9, 9, 900),
      day('2026-11-22', 1, 2, 200),
      day('2026-11-28', 2, 3, 300),
      day('2026-11-29', 4, 5, 500),
      day('2026-12-05', 1, 1, 100),
    ]);
    expect(out).toEqual([
      { from: '2026-11-22', to: '2026-11-28', orders: 3, trays: 5, pieces: 500 },
      { from: '2026-11-29', to: '2026-12-05', orders: 5, trays: 6, pieces: 600 },
    ]);
  });
});
