import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import { putFile, readFile, filePath } from './file-store';

describe('content-addressed file store', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'trayce-files-'));
  it('stores by the sha-256 of the content (checked against node:crypto) and reads it back', () => {
    const content = Buffer.from('%PDF-1.4 a proof');
    const { hash, sizeBytes } = putFile(dir, content);
    expect(hash).toBe(crypto.createHash('sha256').update(content).digest('hex'));
    expect(sizeBytes).toBe(content.length);
    expect(readFile(dir, hash)?.equals(content)).toBe(true);
  });
  it('never turns anything but a hash into a path', () => {
    expect(() => filePath(dir, '../../etc/passwd')).toThrow();
    expect(readFile(dir, 'f'.repeat(64))).toBeNull();
  });
});
