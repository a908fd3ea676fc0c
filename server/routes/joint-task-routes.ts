import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { validate } from '@server/middleware/validate';
import { removeJointTask, setFitter } from '@server/services/work-orders/joint-tasks';
import { jointTaskFitterSchema, jointTaskIdParamsSchema as params } from '@shared/schemas/joint-tasks';

export const jointTaskRoutes = Router();
jointTaskRoutes.use(requirePermission('workOrders.plan'));

jointTaskRoutes.delete('/:id', validate({ params }, async ({ params }, _req, res) => {
  await removeJointTask(res.locals.me, params.id);
  res.status(204).end();
}));

jointTaskRoutes.put('/:id/fitter', jsonBody, validate({ params, body: jointTaskFitterSchema }, async ({ params, body }, _req, res) => {
  res.json(await setFitter(res.locals.me, params.id, body.personId));
}));
