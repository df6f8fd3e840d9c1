import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';

/**
 * Uploaded files (proofs, QC photos) live under `<data>/files/` by the sha-256 of their content:
 * a name a person typed never becomes a path, and the same file stored twice takes space once.
 */
export function putFile(dataDir: string, content: Buffer): { hash: string; sizeBytes: number } {
  const hash = crypto.createHash('sha256').update(content).digest('hex');
  const file = filePath(dataDir, hash);
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
    const tmp = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, content, { mode: 0o600 });
    fs.renameSync(tmp, file);
  }
  return { hash, sizeBytes: content.length };
}

export function filePath(dataDir: string, hash: string): string {
  if (!/^[0-9a-f]{64}$/.test(hash)) throw new Error('not a content hash');
  return path.join(dataDir, 'files', hash.slice(0, 2), hash);
}

export function readFile(dataDir: string, hash: string): Buffer | null {
  const file = filePath(dataDir, hash);
  return fs.existsSync(file) ? fs.readFileSync(file) : null;
}

/** The printable thumbnail made from a stored file at upload, kept beside it by the file's hash. */
export function putThumbnail(dataDir: string, sourceHash: string, png: Buffer): void {
  const file = `${filePath(dataDir, sourceHash)}.thumb.png`;
  if (fs.existsSync(file)) return;
  fs.mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
  const tmp = `${file}.${process.pid}.tmp`;
  fs.writeFileSync(tmp, png, { mode: 0o600 });
  fs.renameSync(tmp, file);
}

export function readThumbnail(dataDir: string, sourceHash: string): Buffer | null {
  const file = `${filePath(dataDir, sourceHash)}.thumb.png`;
  return fs.existsSync(file) ? fs.readFileSync(file) : null;
}
