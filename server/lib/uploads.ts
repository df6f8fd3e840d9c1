// Uploads are read into memory (small limits), checked by their content, then stored by hash.
// The name a browser sends is only kept as a label, and refused when it looks like a path.
import multer, { MulterError } from 'multer';
import type { RequestHandler } from 'express';
import { AppError, badInput } from '../errors';

export const PROOF_MAX_BYTES = 20 * 1024 * 1024;
export const CSV_MAX_BYTES = 1024 * 1024;

/**
 * One file in field `file`, at most `maxBytes`; larger files are refused with 413 by the error
 * handler. Every upload route uses this one parser, so a broken body is mapped in one place:
 * whatever the multipart parser throws (a body cut short, a malformed part header, a NUL in a
 * name) is the sender's fault and answers 400 `bad_upload`, never 500.
 */
export function singleFile(maxBytes: number): RequestHandler {
  // preservePath: see the name as sent, so a name with folders is refused rather than silently cut
  const parse = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: maxBytes, files: 1, fields: 10, parts: 12 } }).single('file');
  return (req, res, next) => {
    parse(req, res, (err?: unknown) => {
      if (!err || err instanceof MulterError || err instanceof AppError) return next(err as Error | undefined);
      const disk = diskFull(err);
      if (disk) return next(disk);
      next(badInput('The upload was not complete or not well formed. Choose the file again and retry.', undefined, 'bad_upload'));
    });
  };
}

/** A 507 for a full disk (ENOSPC from the file system, SQLITE_FULL from the database), else null. */
export function diskFull(err: unknown): AppError | null {
  const code = (err as { code?: unknown } | null)?.code;
  if (code !== 'ENOSPC' && code !== 'SQLITE_FULL') return null;
  return new AppError(
    507,
    'disk_full',
    "The server's disk is full, so nothing was saved. Ask the person who looks after the server to free space (old backups, logs), then try again; the tablets keep their scans until then.",
  );
}

export type SniffedType = 'application/pdf' | 'image/png' | 'image/jpeg';

const startsWith = (buf: Buffer, bytes: number[]) => buf.length >= bytes.length && bytes.every((b, i) => buf[i] === b);

/** The type of a file from its first bytes (magic numbers); null when it is none of PDF, PNG, JPEG. */
export function sniffProofType(buf: Buffer): SniffedType | null {
  // PDF: "%PDF-" (ISO 32000-1, 7.5.2 file header)
  if (startsWith(buf, [0x25, 0x50, 0x44, 0x46, 0x2d])) return 'application/pdf';
  // PNG: 89 50 4E 47 0D 0A 1A 0A (PNG specification, 5.2 signature)
  if (startsWith(buf, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  // JPEG: SOI marker FF D8 followed by another marker FF
  if (startsWith(buf, [0xff, 0xd8, 0xff])) return 'image/jpeg';
  return null;
}

/**
 * A label for an uploaded file. Names with folder parts, '..', control characters or that are
 * too long are refused: nobody needs them, and they are how path tricks start.
 */
export function checkUploadName(name: string | undefined): string {
  const n = (name ?? '').normalize('NFC');
  // eslint-disable-next-line no-control-regex
  if (!n || n.length > 200 || /[/\\\u0000-\u001f\u007f]/.test(n) || n.includes('..') || /^[a-zA-Z]:/.test(n)) {
    throw badInput('The file name is not acceptable: use a plain name without folders, like "proof-rev2.pdf".', undefined, 'bad_file_name');
  }
  return n.trim();
}

/** Text of an uploaded CSV: refuses binary content and invalid UTF-8. */
export function csvText(buf: Buffer): string {
  if (buf.length === 0) throw badInput('The file is empty.', undefined, 'empty_file');
  if (sniffProofType(buf) || startsWith(buf, [0x50, 0x4b, 0x03, 0x04]) || buf.includes(0)) {
    throw badInput('This is not a CSV file. Save the sheet as CSV (comma-separated values) and try again.', undefined, 'not_csv');
  }
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buf);
  } catch {
    throw badInput('The file is not UTF-8 text. Save the sheet as "CSV UTF-8" and try again.', undefined, 'not_csv');
  }
}
