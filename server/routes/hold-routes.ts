import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { idempotently } from '@server/middleware/idempotency';
import { validate } from '@server/middleware/validate';
import { enterEngineeringCureTime } from '@server/services/holds/engineering';
import { jointDetail } from '@server/services/joints/joint-view';
import { engineeringEntrySchema, holdIdParamsSchema as params, temperatureLogIdParamsSchema } from '@shared/schemas/joint-steps';
import { workOrderIdParamsSchema } from '@shared/schemas/work-orders';
import { receiveCsvFile } from '@server/middleware/upload';
import { applyTemperatureLog, listTemperatureLogs, uploadTemperatureLog } from '@server/services/holds/temperature-log';

/** A hold at its own address: a supervisor's engineering cure time where the engine refused. */
export const holdRoutes = Router();

holdRoutes.post('/:id/engineering', requirePermission('holds.engineeringEntry'), jsonBody, validate({ params, body: engineeringEntrySchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const jointId = await enterEngineeringCureTime(res.locals.me, params.id, body, t);
    return { status: 200, body: await jointDetail(jointId, res.locals.me.id, t) };
  });
}));

/** Temperature logs under /api/work-orders/:id (upload, list) and at their own address (apply). */
export const orderTemperatureLogRoutes = Router();

orderTemperatureLogRoutes.get('/:id/temperature-logs', requirePermission('workOrders.read'), validate({ params: workOrderIdParamsSchema }, async ({ params }, _req, res) => {
  res.json(await listTemperatureLogs(params.id));
}));

orderTemperatureLogRoutes.post('/:id/temperature-logs', requirePermission('holds.temperatureLog'), receiveCsvFile, validate({ params: workOrderIdParamsSchema }, async ({ params }, req, res) => {
  res.status(201).json(await uploadTemperatureLog(res.locals.me, params.id, req.file!.originalname, req.file!.buffer));
}));

export const temperatureLogRoutes = Router();

temperatureLogRoutes.post('/:id/apply', requirePermission('holds.temperatureLog'), validate({ params: temperatureLogIdParamsSchema }, async ({ params }, _req, res) => {
  res.json(await applyTemperatureLog(res.locals.me, params.id));
}));
