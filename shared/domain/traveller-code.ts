// The text inside a traveller's QR code: tray number, revision and a truncated MAC.
//
//   T1:1042-07:2:K3J7QZ2MX4NCA5PD
//   │  │       │ └ first 80 bits of HMAC-SHA256(key, "T1:1042-07:2"), base32 (RFC 4648)
//   │  │       └ revision (a reprint makes a new one and voids the old)
//   │  └ tray number, also printed under the QR for typing by hand
//   └ format version
//
// Everything is upper case, digits and ':' '-' '.', so the QR uses the alphanumeric mode
// (ISO/IEC 18004) and fits version 3 at error-correction level Q. Runs in the browser too:
// a tablet without the key can still read the tray number; the server verifies.
import { hmac } from '@noble/hashes/hmac';
import { sha256 } from '@noble/hashes/sha2';
import { utf8ToBytes } from '@noble/hashes/utils';
import { TRAY_NUMBER_MAX_LENGTH, TRAY_NUMBER_PATTERN, normaliseTrayNumber } from './trays';

export const CODE_PREFIX = 'T1';
/** 80 bits of MAC: 16 base32 characters. */
export const MAC_BITS = 80;
export const MAC_CHARS = MAC_BITS / 5;
export const MAX_REVISION = 999;
/** Longest possible code: prefix, number, revision and MAC with three separators. */
export const MAX_CODE_LENGTH = CODE_PREFIX.length + 1 + TRAY_NUMBER_MAX_LENGTH + 1 + String(MAX_REVISION).length + 1 + MAC_CHARS;

const BASE32 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567';

function base32(bytes: Uint8Array, chars: number): string {
  let out = '';
  let buffer = 0;
  let bits = 0;
  for (const b of bytes) {
    buffer = (buffer << 8) | b;
    bits += 8;
    while (bits >= 5 && out.length < chars) {
      out += BASE32[(buffer >>> (bits - 5)) & 31];
      bits -= 5;
    }
    buffer &= (1 << bits) - 1;
    if (out.length >= chars) break;
  }
  return out;
}

export type TravellerKey = Uint8Array | string;

function keyBytes(key: TravellerKey): Uint8Array {
  const k = typeof key === 'string' ? utf8ToBytes(key) : key;
  if (k.length < 16) throw new Error('The traveller key must be at least 16 bytes');
  return k;
}

function mac(number: string, revision: number, key: TravellerKey): string {
  const message = utf8ToBytes(`${CODE_PREFIX}:${number}:${revision}`);
  return base32(hmac(sha256, keyBytes(key), message), MAC_CHARS);
}

function checkNumber(number: string): void {
  if (!TRAY_NUMBER_PATTERN.test(number)) throw new Error(`Not a tray number: ${number}`);
}

/** The exact text to put in the QR code of revision `revision` of tray `number`. */
export function makeTravellerCode(input: { number: string; revision: number }, key: TravellerKey): string {
  checkNumber(input.number);
  if (!Number.isInteger(input.revision) || input.revision < 1 || input.revision > MAX_REVISION) {
    throw new Error(`Revision must be 1–${MAX_REVISION}`);
  }
  return `${CODE_PREFIX}:${input.number}:${input.revision}:${mac(input.number, input.revision, key)}`;
}

export type ParsedTravellerCode = { form: 'qr'; number: string; revision: number; mac: string } | { form: 'typed'; number: string };

const CODE_PATTERN = new RegExp(`^${CODE_PREFIX}:([0-9A-Z.-]{1,${TRAY_NUMBER_MAX_LENGTH}}):([1-9][0-9]{0,2}):([A-Z2-7]{${MAC_CHARS}})$`);

/**
 * Reads a scanned code or a typed tray number without the key (offline tablets use this to
 * show the tray). Returns null when the text is neither.
 */
export function parseTravellerCode(text: string): ParsedTravellerCode | null {
  // hand scanners in keyboard-wedge mode may add spaces or send lower case
  const clean = normaliseTrayNumber(text);
  if (clean.startsWith(`${CODE_PREFIX}:`)) {
    const m = CODE_PATTERN.exec(clean);
    if (!m || !TRAY_NUMBER_PATTERN.test(m[1])) return null;
    return { form: 'qr', number: m[1], revision: Number(m[2]), mac: m[3] };
  }
  if (TRAY_NUMBER_PATTERN.test(clean)) return { form: 'typed', number: clean };
  return null;
}

function equalConstantTime(a: string, b: string): boolean {
  if (a.length !== b.length) return false;
  let diff = 0;
  for (let i = 0; i < a.length; i++) diff |= a.charCodeAt(i) ^ b.charCodeAt(i);
  return diff === 0;
}

export type TravellerCheck =
  | { status: 'ok'; number: string; revision: number; typed: boolean }
  | { status: 'unreadable' }
  | { status: 'bad_signature'; number: string }
  | { status: 'void_traveller'; number: string; revision: number; currentRevision: number };

/**
 * Verifies a scanned code against the server key and the tray's current revision.
 * A typed tray number carries no MAC: it is accepted as the current revision (typed: true).
 */
export function verifyTravellerCode(text: string | ParsedTravellerCode, key: TravellerKey, currentRevision: number): TravellerCheck {
  const parsed = typeof text === 'string' ? parseTravellerCode(text) : text;
  if (!parsed) return { status: 'unreadable' };
  if (parsed.form === 'typed') return { status: 'ok', number: parsed.number, revision: currentRevision, typed: true };
  if (!equalConstantTime(parsed.mac, mac(parsed.number, parsed.revision, key))) {
    return { status: 'bad_signature', number: parsed.number };
  }
  if (parsed.revision !== currentRevision) {
    return { status: 'void_traveller', number: parsed.number, revision: parsed.revision, currentRevision };
  }
  return { status: 'ok', number: parsed.number, revision: parsed.revision, typed: false };
}

/** Words for a refused code, naming the current revision of a void traveller. */
export function travellerCheckMessage(check: TravellerCheck): string {
  switch (check.status) {
    case 'ok':
      return `Tray ${check.number}, revision ${check.revision}`;
    case 'unreadable':
      return 'This is not a Trayce traveller code or tray number';
    case 'bad_signature':
      return `The code of tray ${check.number} has been changed; use the printed traveller`;
    case 'void_traveller':
      return `Traveller revision ${check.revision} of tray ${check.number} is void; revision ${check.currentRevision} is current`;
  }
}
