import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { config } from '@server/config';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';

export const notFound: RequestHandler = (req) => {
  throw AppError.notFound(`There is no ${req.method} ${req.path} here.`);
};

/** Mounted last: every failure leaves as `{ error: { code, message, details? } }`. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof multer.MulterError) {
    err = AppError.badRequest(err.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than the 50 MB an upload may be.' : `The upload was refused: ${err.message}.`);
  } else if (err?.type === 'entity.parse.failed') {
    err = AppError.badRequest('The request body is not valid JSON.');
  } else if (err?.type === 'entity.too.large') {
    err = new AppError(413, 'too_large', 'The request body is too large.');
  }
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) } });
    return;
  }
  logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
  const message = config.isProduction ? 'Something went wrong on the server; it has been logged.' : String(err?.message ?? err);
  res.status(500).json({ error: { code: 'internal', message } });
};
