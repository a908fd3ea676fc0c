import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { listFitters } from '@server/services/people-service';

/** Who may be given joint tasks: read by whoever plans work orders (People & roles is for admins). */
export const fitterRoutes = Router();
fitterRoutes.use(requirePermission('workOrders.plan'));

fitterRoutes.get('/', async (_req, res) => {
  res.json(await listFitters());
});
