import { describe, expect, it } from 'vitest';
import { retryDelayMs, BACKOFF_CAP_MS, BACKOFF_FLOOR_MS } from './backoff';

describe('sync back-off', () => {
  it('doubles the ceiling each attempt up to the cap', () => {
    const top = (n: number) => retryDelayMs(n, () => 0.999999);
    expect([1, 2, 3, 4].map(top)).toEqual([1000, 2000, 4000, 8000]);
    expect(top(30)).toBe(BACKOFF_CAP_MS);
  });
  it('never waits less than the floor', () => {
    for (let n = 1; n < 10; n++) expect(retryDelayMs(n, () => 0)).toBe(BACKOFF_FLOOR_MS);
  });
  it('spreads retries between floor and ceiling', () => {
    const d = retryDelayMs(5, () => 0.5);
    expect(d).toBeGreaterThan(BACKOFF_FLOOR_MS);
    expect(d).toBeLessThan(16_000);
  });
});
