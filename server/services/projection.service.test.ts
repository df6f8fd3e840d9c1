import { describe, expect, it } from 'vitest';
import { measuredStillFresh } from './projection.service';

const MIN = 60_000;
const T = Date.parse('2026-12-04T09:00:00Z');

describe('the kept measured history of the floor', () => {
  const kept = { at: T, foldedUpTo: 1_000_000 };

  it('stands for 10 minutes while the scan log grows by at most 1 %', () => {
    expect(measuredStillFresh(kept, T, 1_000_000)).toBe(true);
    expect(measuredStillFresh(kept, T + 9 * MIN, 1_010_000)).toBe(true);
  });

  it('is read again after 10 minutes, when the clock goes back, or after more than 1 % of new scans', () => {
    expect(measuredStillFresh(kept, T + 10 * MIN, 1_000_000)).toBe(false);
    expect(measuredStillFresh(kept, T - 1, 1_000_000)).toBe(false);
    expect(measuredStillFresh(kept, T + MIN, 1_010_001)).toBe(false);
  });

  it('is read again while the facts are rebuilt (the cursor starts again from 0) and at every new scan on a young floor', () => {
    expect(measuredStillFresh(kept, T + MIN, 20)).toBe(false);
    expect(measuredStillFresh({ at: T, foldedUpTo: 50 }, T + MIN, 51)).toBe(false);
  });
});
