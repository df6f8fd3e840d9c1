import { describe, expect, it } from 'vitest';
import { signInDelaySeconds, MAX_DELAY_SECONDS } from './sign-in-throttle';

// OWASP Authentication Cheat Sheet: throttle with growing delays; never a long lockout.
describe('signInDelaySeconds', () => {
  it('lets the first failures through without delay', () => {
    expect([0, 1, 2].map(signInDelaySeconds)).toEqual([0, 0, 0]);
  });
  it('doubles the delay after each further failure', () => {
    expect([3, 4, 5, 6].map(signInDelaySeconds)).toEqual([1, 2, 4, 8]);
  });
  it('never holds an account longer than the cap', () => {
    expect(signInDelaySeconds(50)).toBe(MAX_DELAY_SECONDS);
    expect(MAX_DELAY_SECONDS).toBeLessThanOrEqual(60);
  });
});
