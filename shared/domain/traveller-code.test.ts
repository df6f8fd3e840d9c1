import { describe, expect, it } from 'vitest';
import QRCode from 'qrcode';
import { hmac } from '@noble/hashes/hmac';
import { sha256 } from '@noble/hashes/sha2';
import { createHmac } from 'node:crypto';
import { MAX_CODE_LENGTH, makeTravellerCode, parseTravellerCode, travellerCheckMessage, verifyTravellerCode } from './traveller-code';
import { TRAY_NUMBER_MAX_LENGTH, childTrayNumber, mouldNumber, trayNumber } from './trays';

const KEY = 'test-key-0123456789abcdef-0123456789';
const OTHER_KEY = 'another-key-0123456789abcdef-012345';

// Characters of the alphanumeric mode, ISO/IEC 18004 (0–9, A–Z, space, $ % * + - . / :).
const ALPHANUMERIC = /^[0-9A-Z $%*+\-./:]*$/;

describe('traveller code: round trip, tamper, void', () => {
  const number = trayNumber('1042', 7);

  it('round trip: the code names the tray and its revision and verifies', () => {
    const code = makeTravellerCode({ number, revision: 1 }, KEY);
    expect(parseTravellerCode(code)).toMatchObject({ form: 'qr', number: '1042-07', revision: 1 });
    expect(verifyTravellerCode(code, KEY, 1)).toEqual({ status: 'ok', number: '1042-07', revision: 1, typed: false });
  });

  it('the MAC is the first 80 bits of HMAC-SHA256 (RFC 2104), checked against node:crypto', () => {
    const code = makeTravellerCode({ number, revision: 3 }, KEY);
    const macText = code.split(':')[3];
    const expected = createHmac('sha256', KEY).update('T1:1042-07:3').digest();
    // decode base32 (RFC 4648) back to bits and compare with the first 80 bits
    const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567';
    const bits = [...macText].map((c) => alphabet.indexOf(c).toString(2).padStart(5, '0')).join('');
    const expectedBits = [...expected.subarray(0, 10)].map((b) => b.toString(2).padStart(8, '0')).join('');
    expect(bits).toBe(expectedBits);
    // and the browser-side library agrees with node's
    expect(Buffer.from(hmac(sha256, new TextEncoder().encode(KEY), new TextEncoder().encode('T1:1042-07:3')))).toEqual(expected);
  });

  it('a changed character anywhere is refused', () => {
    const code = makeTravellerCode({ number, revision: 2 }, KEY);
    const swaps: Record<string, string> = { '0': '1', '1': '2', '2': '3', '7': '8', A: 'B' };
    for (let i = 3; i < code.length; i++) {
      const c = code[i];
      if (c === ':') continue;
      const alt = swaps[c] ?? (/[A-Z]/.test(c) ? (c === 'Z' ? 'Y' : String.fromCharCode(c.charCodeAt(0) + 1)) : c === '9' ? '8' : String(Number(c) + 1));
      const tampered = code.slice(0, i) + alt + code.slice(i + 1);
      const r = verifyTravellerCode(tampered, KEY, 2);
      expect(['bad_signature', 'unreadable']).toContain(r.status);
    }
  });

  it('a forged revision or tray number with the old MAC is a bad signature', () => {
    const code = makeTravellerCode({ number, revision: 1 }, KEY);
    const mac = code.split(':')[3];
    expect(verifyTravellerCode(`T1:1042-07:2:${mac}`, KEY, 2).status).toBe('bad_signature');
    expect(verifyTravellerCode(`T1:1042-08:1:${mac}`, KEY, 1).status).toBe('bad_signature');
  });

  it('a code made under another key is a bad signature', () => {
    const code = makeTravellerCode({ number, revision: 1 }, OTHER_KEY);
    expect(verifyTravellerCode(code, KEY, 1)).toEqual({ status: 'bad_signature', number });
  });

  it('after a reprint the old revision is void and the message names the current one', () => {
    const old = makeTravellerCode({ number, revision: 1 }, KEY);
    const current = makeTravellerCode({ number, revision: 2 }, KEY);
    expect(current).not.toBe(old);
    const r = verifyTravellerCode(old, KEY, 2);
    expect(r).toEqual({ status: 'void_traveller', number, revision: 1, currentRevision: 2 });
    expect(travellerCheckMessage(r)).toMatch(/revision 2 is current/);
    expect(verifyTravellerCode(current, KEY, 2).status).toBe('ok');
  });

  it('reads without the key (offline tablets) and accepts the number typed by hand', () => {
    expect(parseTravellerCode('  1042-07 ')).toEqual({ form: 'typed', number: '1042-07' });
    expect(parseTravellerCode('1042-07.1')).toEqual({ form: 'typed', number: '1042-07.1' });
    const code = makeTravellerCode({ number, revision: 4 }, KEY);
    // keyboard-wedge scanners may send lower case
    expect(parseTravellerCode(code.toLowerCase())).toMatchObject({ form: 'qr', number, revision: 4 });
    expect(verifyTravellerCode('1042-07', KEY, 4)).toEqual({ status: 'ok', number, revision: 4, typed: true });
    expect(parseTravellerCode('hello world')).toBeNull();
    expect(parseTravellerCode('ABC-01')).toBeNull();
    expect(parseTravellerCode('T1:1042-07:x:ABC')).toBeNull();
    expect(parseTravellerCode('')).toBeNull();
    expect(verifyTravellerCode('https://example.com', KEY, 1).status).toBe('unreadable');
  });

  it('refuses to make a code with a bad number, revision or short key', () => {
    expect(() => makeTravellerCode({ number: 'a b', revision: 1 }, KEY)).toThrow();
    expect(() => makeTravellerCode({ number, revision: 0 }, KEY)).toThrow();
    expect(() => makeTravellerCode({ number, revision: 1000 }, KEY)).toThrow();
    expect(() => makeTravellerCode({ number, revision: 1 }, 'short')).toThrow();
  });
});

describe('QR size: ISO/IEC 18004 capacity table at error-correction level Q', () => {
  // Alphanumeric capacity at level Q, ISO/IEC 18004 table 7: V2 29, V3 47, V4 67 characters.
  const ALNUM_Q: Record<number, number> = { 2: 29, 3: 47, 4: 67 };

  it('the qrcode package agrees with the ISO/IEC 18004 alphanumeric capacities at Q', () => {
    for (const [v, cap] of Object.entries(ALNUM_Q)) {
      expect(QRCode.create('A'.repeat(cap), { errorCorrectionLevel: 'Q' }).version).toBe(Number(v));
      expect(QRCode.create('A'.repeat(cap + 1), { errorCorrectionLevel: 'Q' }).version).toBe(Number(v) + 1);
    }
  });

  it('the longest possible code is alphanumeric and fits version 3 (≤ 4) at level Q', () => {
    const longest = makeTravellerCode({ number: '9'.repeat(TRAY_NUMBER_MAX_LENGTH), revision: 999 }, KEY);
    expect(longest).toHaveLength(MAX_CODE_LENGTH);
    expect(longest).toMatch(ALPHANUMERIC);
    expect(longest.length).toBeLessThanOrEqual(ALNUM_Q[3]);
    const qr = QRCode.create(longest, { errorCorrectionLevel: 'Q' });
    expect(qr.version).toBeLessThanOrEqual(4);
    expect(qr.version).toBe(3);
    // no byte-mode segment: only alphanumeric (and numeric runs, which are denser still)
    expect(qr.segments.every((s) => s.mode.id === 'Alphanumeric' || s.mode.id === 'Numeric')).toBe(true);
    // Version V is 17 + 4V modules square (ISO/IEC 18004)
    expect(qr.modules.size).toBe(17 + 4 * qr.version);
  });

  it('typical tray, mould and split-tray codes fit version 3 at Q', () => {
    for (const n of [trayNumber('1042', 7), mouldNumber('24117', 'back'), childTrayNumber(trayNumber('24117', 112), 3)]) {
      const code = makeTravellerCode({ number: n, revision: 12 }, KEY);
      expect(code).toMatch(ALPHANUMERIC);
      expect(QRCode.create(code, { errorCorrectionLevel: 'Q' }).version).toBeLessThanOrEqual(3);
    }
  });
});
