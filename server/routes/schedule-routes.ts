import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { validate } from '@server/middleware/validate';
import { schedule } from '@server/services/work-orders/schedule';
import { scheduleQuerySchema } from '@shared/schemas/work-order-plan';

export const scheduleRoutes = Router();
scheduleRoutes.use(requirePermission('workOrders.read'));

scheduleRoutes.get('/', validate({ query: scheduleQuerySchema }, async ({ query }, _req, res) => {
  res.json(await schedule(query));
}));
