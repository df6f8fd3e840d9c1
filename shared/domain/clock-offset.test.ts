import { describe, expect, it } from 'vitest';
import { bestOffset, correctedIso, offsetFromSample } from './clock-offset';

describe('clock offset (RFC 5905 §8 on-wire arithmetic)', () => {
  it('matches θ = ½[(T2 − T1) + (T3 − T4)] and δ = (T4 − T1) − (T3 − T2) with T2 = T3', () => {
    // Computed: T1 = 1000, T2 = T3 = 5060, T4 = 1120: θ = ½[(4060) + (3940)] = 4000, δ = 120 − 0 = 120.
    const T1 = 1000;
    const T2 = 5060;
    const T3 = T2;
    const T4 = 1120;
    const rfcTheta = (T2 - T1 + (T3 - T4)) / 2;
    const rfcDelta = T4 - T1 - (T3 - T2);
    expect(offsetFromSample({ sentAt: T1, serverTime: T2, receivedAt: T4 })).toEqual({ offsetMs: rfcTheta, roundTripMs: rfcDelta });
    expect(rfcTheta).toBe(4000);
  });

  it('a tablet 90 s slow with a symmetric 200 ms round trip measures +90 s', () => {
    const device = 1_700_000_000_000;
    const o = offsetFromSample({ sentAt: device, serverTime: device + 90_000 + 100, receivedAt: device + 200 });
    expect(o.offsetMs).toBe(90_000);
  });

  it('keeps the sample with the shortest round trip', () => {
    const best = bestOffset([
      { sentAt: 0, serverTime: 600, receivedAt: 1000 }, // δ 1000, θ 100
      { sentAt: 2000, serverTime: 2040, receivedAt: 2060 }, // δ 60, θ 10
      { sentAt: 3000, serverTime: 3400, receivedAt: 3500 }, // δ 500, θ 150
    ]);
    expect(best).toEqual({ offsetMs: 10, roundTripMs: 60 });
    expect(bestOffset([])).toBeNull();
  });

  it('corrects a device time', () => {
    expect(correctedIso(Date.parse('2025-03-03T08:00:00.000Z'), { offsetMs: -1500, roundTripMs: 10 })).toBe('2025-03-03T07:59:58.500Z');
    expect(correctedIso(0, null)).toBe('1970-01-01T00:00:00.000Z');
  });
});
