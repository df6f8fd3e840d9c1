import { describe, expect, it } from 'vitest';
import { pbkdf2Sync } from 'node:crypto';
import { checkPin, makePinVerifier, pinHash } from './pin-verifier';

describe('offline PIN verifier', () => {
  it('is PBKDF2-SHA-256 (checked against node:crypto, an independent implementation)', async () => {
    const salt = '000102030405060708090a0b0c0d0e0f';
    const ours = await pinHash('1357', salt, 1000);
    const reference = pbkdf2Sync('1357', Buffer.from(salt, 'hex'), 1000, 32, 'sha256').toString('hex');
    expect(ours).toBe(reference);
  });

  it('matches RFC 6070-style test vector for PBKDF2 (SHA-256 variant, published in RFC 7914 §11)', async () => {
    // RFC 7914 section 11: PBKDF2-HMAC-SHA256, P = "passwd", S = "salt", c = 1, dkLen = 64; first 32 bytes:
    const saltHex = Buffer.from('salt').toString('hex');
    expect(await pinHash('passwd', saltHex, 1)).toBe('55ac046e56e3089fec1691c22544b605f94185216dde0465e68b9d57c20dacbc');
  });

  it('accepts the right PIN and refuses a wrong one, with a fresh salt each time', async () => {
    const a = await makePinVerifier('2468');
    const b = await makePinVerifier('2468');
    expect(a.salt).not.toBe(b.salt);
    expect(await checkPin('2468', a)).toBe(true);
    expect(await checkPin('2469', a)).toBe(false);
  });
});
