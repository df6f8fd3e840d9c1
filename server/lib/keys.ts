import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';

/** A 32-byte secret kept in the data folder, created on first start (never committed). */
export function loadOrCreateKey(dataDir: string, name: string): Uint8Array {
  const dir = path.join(dataDir, 'keys');
  const file = path.join(dir, `${name}.key`);
  fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
  fs.chmodSync(dir, 0o700);
  if (!fs.existsSync(file)) {
    fs.writeFileSync(file, crypto.randomBytes(32).toString('base64'), { mode: 0o600, flag: 'wx' });
  }
  const key = Buffer.from(fs.readFileSync(file, 'utf8').trim(), 'base64');
  if (key.length !== 32) throw new Error(`The key file ${file} is damaged: expected 32 bytes.`);
  return new Uint8Array(key);
}

export function sha256Hex(text: string): string {
  return crypto.createHash('sha256').update(text).digest('hex');
}

/** A random token with `bytes` of entropy, URL-safe. */
export function randomToken(bytes = 24): string {
  return crypto.randomBytes(bytes).toString('base64url');
}
