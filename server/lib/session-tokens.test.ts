import { describe, expect, it } from 'vitest';
import { SignJWT } from 'jose';
import { makeSessionTokenVerifier } from './session-tokens';

const key = new Uint8Array(32).fill(7);
const otherKey = new Uint8Array(32).fill(9);
const t0 = Date.UTC(2026, 11, 4, 12);

async function token(signWith: Uint8Array, expSeconds: number) {
  return new SignJWT({ sid: 's-1' })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject('u-1')
    .setIssuedAt(t0 / 1000)
    .setExpirationTime(expSeconds)
    .sign(signWith);
}

describe('session token verifier', () => {
  it('gives the claims of a rightly signed token, the second time from memory', async () => {
    const verify = makeSessionTokenVerifier(key);
    const t = await token(key, t0 / 1000 + 3600);
    expect(await verify(t, t0)).toEqual({ sid: 's-1', sub: 'u-1', exp: t0 / 1000 + 3600 });
    expect(await verify(t, t0 + 1000)).toEqual({ sid: 's-1', sub: 'u-1', exp: t0 / 1000 + 3600 });
  });

  it('refuses a token signed with another key, and a token changed by one character', async () => {
    const verify = makeSessionTokenVerifier(key);
    expect(await verify(await token(otherKey, t0 / 1000 + 3600), t0)).toBeNull();
    const good = await token(key, t0 / 1000 + 3600);
    const last = good.at(-1) === 'A' ? 'B' : 'A';
    expect(await verify(good.slice(0, -1) + last, t0)).toBeNull();
  });

  it('refuses a remembered token once it has expired', async () => {
    const verify = makeSessionTokenVerifier(key);
    const t = await token(key, t0 / 1000 + 60);
    expect(await verify(t, t0)).not.toBeNull();
    expect(await verify(t, t0 + 61_000)).toBeNull();
  });
});
