import { Router } from 'express';
import multer from 'multer';
import { AppError } from '@server/errors';
import { requirePermission } from '@server/middleware/auth';
import { validate } from '@server/middleware/validate';
import { confirmImport, getImport, listImportRows, uploadImport } from '@server/services/line-imports/import-service';
import { importIdParamsSchema, importRowsQuerySchema } from '@shared/schemas/line-imports';

// A CSV file kept in memory (the service stores its text); 50 MB is well over 100,000 lines.
const upload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8', // file names as the browser sends them, not read as Latin-1
  limits: { fileSize: 50 * 1024 * 1024, files: 1 },
  fileFilter: (_req, file, cb) => {
    if (/\.csv$/i.test(file.originalname) || file.mimetype === 'text/csv' || file.mimetype === 'text/plain') return cb(null, true);
    cb(AppError.badRequest(`"${file.originalname}" is not a CSV file; save the register from the spreadsheet as CSV and upload that.`));
  },
});

export const lineImportRoutes = Router();
lineImportRoutes.use(requirePermission('lines.import'));

lineImportRoutes.post('/', upload.single('file'), async (req, res) => {
  if (!req.file) throw AppError.badRequest('Choose a CSV file to upload (form field "file").', { file: ['Choose a CSV file to upload.'] });
  res.status(201).json(await uploadImport(res.locals.me, { filename: req.file.originalname, buffer: req.file.buffer }));
});

lineImportRoutes.get('/:id', validate({ params: importIdParamsSchema }, async ({ params }, _req, res) => {
  res.json(await getImport(params.id));
}));

lineImportRoutes.get('/:id/rows', validate({ params: importIdParamsSchema, query: importRowsQuerySchema }, async ({ params, query }, _req, res) => {
  res.json(await listImportRows(params.id, query));
}));

lineImportRoutes.post('/:id/confirm', validate({ params: importIdParamsSchema }, async ({ params }, _req, res) => {
  const imp = await confirmImport(res.locals.me, params.id);
  res.status(imp.status === 'applying' ? 202 : 200).json(imp);
}));
