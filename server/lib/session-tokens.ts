// Verifying a session cookie's signature (HS256 through Web Crypto) is the costliest part of
// resolving a request's session, and a tablet sends the same cookie with every scan. A cookie
// whose signature was checked once is remembered, with its claims, until it expires; revocation,
// idle time and the person's and tablet's state are still read from the database on every request
// (auth.service.ts), so remembering a signature never keeps a revoked session alive.
import { jwtVerify } from 'jose';

export interface SessionClaims {
  sid: string;
  sub: string;
  /** expiry, epoch seconds (absent: never expires by the token alone) */
  exp: number | null;
}

const MAX_REMEMBERED = 10_000;

export function makeSessionTokenVerifier(key: Uint8Array | CryptoKey) {
  const remembered = new Map<string, SessionClaims>();
  return async function verify(token: string, nowMs: number): Promise<SessionClaims | null> {
    const known = remembered.get(token);
    if (known) {
      if (known.exp == null || known.exp * 1000 > nowMs) return known;
      remembered.delete(token);
      return null;
    }
    try {
      const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'], currentDate: new Date(nowMs) });
      if (typeof payload.sid !== 'string' || typeof payload.sub !== 'string') return null;
      const claims: SessionClaims = { sid: payload.sid, sub: payload.sub, exp: typeof payload.exp === 'number' ? payload.exp : null };
      if (remembered.size >= MAX_REMEMBERED) remembered.delete(remembered.keys().next().value!);
      remembered.set(token, claims);
      return claims;
    } catch {
      return null;
    }
  };
}
