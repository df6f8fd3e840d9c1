// The tablet's clock against the server's, measured on each sync the way NTP does (RFC 5905,
// section 8: offset θ = ½[(T2 − T1) + (T3 − T4)], round-trip delay δ = (T4 − T1) − (T3 − T2)).
// The server stamps one time (T2 = T3), so θ = T2 − (T1 + T4)/2 and δ = T4 − T1.
// Of the recent samples the one with the shortest round trip is kept, because its offset has
// the smallest error bound (±δ/2): the idea of NTP's clock filter.

export interface ClockSample {
  /** device clock when the request left (T1), ms */
  sentAt: number;
  /** server clock in the answer (T2 = T3), ms */
  serverTime: number;
  /** device clock when the answer came back (T4), ms */
  receivedAt: number;
}

export interface ClockOffset {
  /** add to the device clock to get server time, ms */
  offsetMs: number;
  /** round trip of the sample it came from, ms; the offset is good to ±roundTripMs/2 */
  roundTripMs: number;
}

export function offsetFromSample(s: ClockSample): ClockOffset {
  return {
    offsetMs: s.serverTime - (s.sentAt + s.receivedAt) / 2,
    roundTripMs: Math.max(0, s.receivedAt - s.sentAt),
  };
}

/** Best estimate from recent samples: the shortest round trip wins; null without samples. */
export function bestOffset(samples: readonly ClockSample[]): ClockOffset | null {
  let best: ClockOffset | null = null;
  for (const s of samples) {
    const o = offsetFromSample(s);
    if (!best || o.roundTripMs < best.roundTripMs) best = o;
  }
  return best;
}

/** Device time corrected to server time, as an ISO string. */
export function correctedIso(deviceMs: number, offset: ClockOffset | null): string {
  return new Date(Math.round(deviceMs + (offset?.offsetMs ?? 0))).toISOString();
}
