import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { config } from '@server/config';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';

export const notFound: RequestHandler = (req) => {
  throw AppError.notFound(`There is no ${req.method} ${req.path} here.`);
};

/** What body-parser's refusals mean to the person who sent the request. */
const BODY_REFUSALS: Record<string, (err: { status: number; encoding?: string; charset?: string }) => AppError> = {
  'entity.parse.failed': () => AppError.badRequest('The request body is not valid JSON.'),
  'entity.too.large': () => new AppError(413, 'too_large', 'The request body is too large.'),
  'encoding.unsupported': (e) => new AppError(415, 'unsupported_encoding', `The request body's Content-Encoding "${e.encoding ?? '?'}" is not one this server reads (gzip, deflate, br or none).`),
  'charset.unsupported': (e) => new AppError(415, 'unsupported_charset', `The request body's charset "${e.charset ?? '?'}" is not one this server reads; send UTF-8.`),
  'request.aborted': () => AppError.badRequest('The request body ended before it was complete.'),
  'request.size.invalid': () => AppError.badRequest('The request body is shorter or longer than its Content-Length says.'),
};

/**
 * Turns whatever was thrown into the error the client is told about, or null for a real fault.
 * A client's mistake (a bad body, a bad % escape in the address, an error carrying a 4xx status)
 * keeps its 4xx; only what the client could not have caused is a 500.
 */
export function toClientError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof multer.MulterError) {
    return AppError.badRequest(err.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than the 50 MB an upload may be.' : `The upload was refused: ${err.message}.`);
  }
  const e = err as { type?: string; status?: unknown; statusCode?: unknown; expose?: boolean; message?: string } | null;
  const refusal = e?.type ? BODY_REFUSALS[e.type] : undefined;
  const status = Number(e?.status ?? e?.statusCode);
  if (refusal && status >= 400 && status < 500) return refusal(e as { status: number });
  if (err instanceof URIError || /^Failed to decode param/.test(e?.message ?? '')) {
    return AppError.badRequest('The address has a % that does not start a valid escape (such as %20).');
  }
  if (Number.isInteger(status) && status >= 400 && status < 500) {
    return new AppError(status, `http_${status}`, e?.expose !== false && e?.message ? e.message : `The request was refused (${status}).`);
  }
  return null;
}

/** Mounted last: every failure leaves as `{ error: { code, message, details? } }`. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toClientError(err);
  if (known) {
    res.status(known.status).json({ error: { code: known.code, message: known.message, ...(known.details ? { details: known.details } : {}) } });
    return;
  }
  logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
  const message = config.isProduction ? 'Something went wrong on the server; it has been logged.' : String(err?.message ?? err);
  res.status(500).json({ error: { code: 'internal', message } });
};
