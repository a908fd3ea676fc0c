import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { validate } from '@server/middleware/validate';
import { logger } from '@server/logger';
import { exportFilename, lineRegisterCsv } from '@server/services/csv-export';
import { getLine, listLines } from '@server/services/line-service';
import { lineExportQuerySchema, lineListQuerySchema, lineNumberParamsSchema, type LineExportQuery, type LineListQuery } from '@shared/schemas/lines';

// Reading the register is open to every signed-in role (planner, fitter, operations,
// supervisor, admin): app.ts puts requireSignIn in front of /api, so no role check here.
export const lineRoutes = Router();

lineRoutes.get('/', validate({ query: lineListQuerySchema }), async (_req, res) => {
  res.json(await listLines(res.locals.query as LineListQuery));
});

// Before '/:lineNumber', or "export.csv" would be looked up as a line number.
lineRoutes.get('/export.csv', validate({ query: lineExportQuerySchema }), async (_req, res) => {
  const csv = lineRegisterCsv(res.locals.query as LineExportQuery);
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
});

lineRoutes.get('/:lineNumber', validate({ params: lineNumberParamsSchema }), async (req, res) => {
  res.json(await getLine(req.params.lineNumber as string));
});
