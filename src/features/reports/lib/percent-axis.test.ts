import { describe, expect, it } from 'vitest';
import { percentAxis } from './percent-axis';

describe('percent axis zoom', () => {
  it('yields between 99 % and 100 % get an axis that starts just below them', () => {
    const a = percentAxis([0.9912, 0.9987, 1, null]);
    expect(a.zoomed).toBe(true);
    expect(a.domain[1]).toBe(1);
    expect(a.domain[0]).toBeLessThan(0.9912);
    expect(a.domain[0]).toBeGreaterThanOrEqual(0.98);
    // the lowest bar keeps a visible length: at least a tenth of the axis
    expect((0.9912 - a.domain[0]) / (1 - a.domain[0])).toBeGreaterThanOrEqual(0.09);
  });

  it('a round start: whole tenths of a percent or coarser', () => {
    const [start] = percentAxis([0.953, 0.99]).domain;
    expect(Math.round(start * 1000)).toBeCloseTo(start * 1000, 6);
    expect(start).toBeLessThan(0.953);
  });

  it('low shares keep the full 0–100 % axis', () => {
    expect(percentAxis([0.3, 0.99])).toEqual({ domain: [0, 1], zoomed: false });
    expect(percentAxis([])).toEqual({ domain: [0, 1], zoomed: false });
  });
});
