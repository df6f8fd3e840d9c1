// Fast operator switching while the tablet is offline. After a person signs in online with badge
// and PIN, the tablet keeps a salted PBKDF2-SHA-256 hash of that PIN (WebCrypto) for the rest of
// the shift, so the same person can sign in again here without the server. The server still
// decides: scans carry the operator's id and are accepted only for people who signed in on this
// tablet (see the scan overrides service).

export const PIN_ITERATIONS = 100_000;
export const OFFLINE_SIGN_IN_HOURS = 12;

function toHex(bytes: ArrayBuffer | Uint8Array): string {
  return Array.from(new Uint8Array(bytes), (b) => b.toString(16).padStart(2, '0')).join('');
}

function fromHex(hex: string): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(hex.length / 2);
  for (let i = 0; i < out.length; i++) out[i] = parseInt(hex.slice(i * 2, i * 2 + 2), 16);
  return out;
}

export async function pinHash(pin: string, saltHex: string, iterations = PIN_ITERATIONS): Promise<string> {
  const key = await crypto.subtle.importKey('raw', new TextEncoder().encode(pin), 'PBKDF2', false, ['deriveBits']);
  const bits = await crypto.subtle.deriveBits({ name: 'PBKDF2', hash: 'SHA-256', salt: fromHex(saltHex), iterations }, key, 256);
  return toHex(bits);
}

export async function makePinVerifier(pin: string): Promise<{ salt: string; verifier: string }> {
  const salt = toHex(crypto.getRandomValues(new Uint8Array(16)));
  return { salt, verifier: await pinHash(pin, salt) };
}

export async function checkPin(pin: string, stored: { salt: string; verifier: string }): Promise<boolean> {
  const h = await pinHash(pin, stored.salt);
  let diff = h.length ^ stored.verifier.length;
  for (let i = 0; i < Math.min(h.length, stored.verifier.length); i++) diff |= h.charCodeAt(i) ^ stored.verifier.charCodeAt(i);
  return diff === 0;
}
