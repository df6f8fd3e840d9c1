import { describe, expect, it } from 'vitest';
import { defaultWindow, lastWeeks, yieldTotals } from './summary';

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
