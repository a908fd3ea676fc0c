import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '@server/errors';

// A CSV file kept in memory (the service stores its text); 50 MB is well over 100,000 lines.
const csvUpload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8', // file names as the browser sends them, not read as Latin-1
  limits: { fileSize: 50 * 1024 * 1024, files: 1 },
  fileFilter: (_req, file, cb) => {
    if (/\.csv$/i.test(file.originalname) || file.mimetype === 'text/csv' || file.mimetype === 'text/plain') return cb(null, true);
    cb(AppError.badRequest(`"${file.originalname}" is not a CSV file; save the register from the spreadsheet as CSV and upload that.`));
  },
});
const single = csvUpload.single('file');

/**
 * Receives one CSV file in the form field "file". A form the client broke (cut short, no
 * boundary, a malformed part) is the client's mistake: 400 with a sentence, not a 500.
 */
export const receiveCsvFile: RequestHandler = (req, res, next) => {
  single(req, res, (err?: unknown) => {
    if (!err || err instanceof AppError || err instanceof multer.MulterError) return next(err);
    const said = err instanceof Error ? err.message : String(err);
    next(AppError.badRequest(`The upload could not be read (${said}); choose the file and upload it again.`));
  });
};
