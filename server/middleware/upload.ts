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
    cb(AppError.badRequest(`"${file.originalname}" is not a CSV file; save it as CSV (from the spreadsheet, or the logger's own software) and upload that.`));
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

/** The most a joint photo may weigh on arrival; the tablet sends about 0.5–2 MB after resizing. */
export const PHOTO_MAX_BYTES = 12 * 1024 * 1024;
const photoUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 } }).single('photo');

/**
 * Receives one picture in the form field "photo". Its name and claimed type are ignored: the
 * service checks the bytes. Too large is 413; no file is 400.
 */
export const receivePhoto: RequestHandler = (req, res, next) => {
  photoUpload(req, res, (err?: unknown) => {
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
      return next(new AppError(413, 'photo_too_large', `The picture is larger than the ${PHOTO_MAX_BYTES / 1024 / 1024} MB a joint photo may be; take it again at a lower resolution.`));
    }
    if (err) return next(err instanceof AppError || err instanceof multer.MulterError ? err : AppError.badRequest('The upload could not be read; take the picture and send it again.'));
    if (!req.file) return next(AppError.badRequest('Attach the picture in the form field "photo".', { photo: ['no picture attached'] }));
    next();
  });
};
