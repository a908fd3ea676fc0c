import { Router } from 'express';
import { AppError } from '@server/errors';
import { requirePermission } from '@server/middleware/auth';
import { receiveCsvFile } from '@server/middleware/upload';
import { validate } from '@server/middleware/validate';
import { cancelImport } from '@server/services/line-imports/cancel';
import { confirmImport, getImport, listImportRows, listImports, uploadImport } from '@server/services/line-imports/import-service';
import { importIdParamsSchema, importListQuerySchema, importRowsQuerySchema } from '@shared/schemas/line-imports';

export const lineImportRoutes = Router();
lineImportRoutes.use(requirePermission('lines.import'));

lineImportRoutes.get('/', validate({ query: importListQuerySchema }, async ({ query }, _req, res) => {
  res.json(await listImports(query));
}));

lineImportRoutes.post('/', receiveCsvFile, async (req, res) => {
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

lineImportRoutes.post('/:id/cancellation', validate({ params: importIdParamsSchema }, async ({ params }, _req, res) => {
  res.json(await cancelImport(res.locals.me, params.id));
}));
