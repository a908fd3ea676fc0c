import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { shiftOf } from '@server/services/joints/shift';

/** The signed-in person's joint tasks on open orders: the fitter's home page. */
export const shiftRoutes = Router();
shiftRoutes.use(requirePermission('workOrders.read'));

shiftRoutes.get('/', async (_req, res) => {
  res.json(await shiftOf(res.locals.me));
});
