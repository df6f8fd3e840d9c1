import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import { AppError } from '../errors';
import { diskFull } from '../lib/uploads';

function body(code: string, message: string, extra: Record<string, unknown> = {}, issues?: unknown) {
  return { error: { code, message, ...extra, ...(issues ? { issues } : {}) } };
}

export const notFoundApi: RequestHandler = (req, res) => {
  res.status(404).json(body('not_found', `There is no API route ${req.method} ${req.path}.`));
};

/** Maps every error to the one documented shape; never sends a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof AppError) {
    if (err.status === 429 && typeof err.extra.retryAfterSeconds === 'number') res.set('Retry-After', String(err.extra.retryAfterSeconds));
    res.status(err.status).json(body(err.code, err.message, err.extra, err.issues));
    return;
  }
  if (err instanceof MulterError) {
    const tooBig = err.code === 'LIMIT_FILE_SIZE';
    res
      .status(tooBig ? 413 : 400)
      .json(body(tooBig ? 'too_large' : 'bad_upload', tooBig ? 'The file is too large.' : `The upload was not accepted: ${err.message}.`));
    return;
  }
  const disk = diskFull(err);
  if (disk) {
    req.log?.error({ err }, 'disk full');
    res.status(507).json(body(disk.code, disk.message));
    return;
  }
  // body-parser errors carry a `type`
  const type = (err as { type?: string }).type;
  if (type === 'entity.parse.failed') {
    res.status(400).json(body('bad_json', 'The request body is not valid JSON.'));
    return;
  }
  if (type === 'entity.too.large') {
    res.status(413).json(body('too_large', 'The request body is too large.'));
    return;
  }
  if (type === 'charset.unsupported' || type === 'encoding.unsupported') {
    res.status(415).json(body('unsupported_encoding', 'The request encoding is not supported.'));
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json(body('internal_error', 'Something went wrong on the server. The error was logged; try again.'));
};
