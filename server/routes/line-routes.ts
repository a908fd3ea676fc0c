import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { sendKept } from '@server/middleware/kept-answer';
import { validate } from '@server/middleware/validate';
import { logger } from '@server/logger';
import { exportFilename, lineRegisterCsv } from '@server/services/line-register-export';
import { getLine, listLines } from '@server/services/line-service';
import { lineExportQuerySchema, lineListQuerySchema, lineNumberParamsSchema } from '@shared/schemas/lines';

export const lineRoutes = Router();
lineRoutes.use(requirePermission('lines.read'));

lineRoutes.get('/', validate({ query: lineListQuerySchema }, async ({ query }, req, res) => {
  sendKept(req, res, await listLines(query, req.changeView));
}));

// Before '/:lineNumber', or "export.csv" would be looked up as a line number.
lineRoutes.get('/export.csv', validate({ query: lineExportQuerySchema }, async ({ query }, _req, res) => {
  const csv = lineRegisterCsv(query);
  const header = await csv.next(); // opens the cursor: a failure here still answers in the error shape
  res.attachment(exportFilename(new Date()));
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.write(header.value ?? '');
  try {
    await pipeline(Readable.from(csv), res);
  } catch (err) {
    // The status has gone with the header row; a failure now can only cut the download short.
    logger.warn({ err }, 'line register export ended early');
  }
}));

lineRoutes.get('/:lineNumber', validate({ params: lineNumberParamsSchema }, async ({ params }, _req, res) => {
  res.json(await getLine(params.lineNumber));
}));
