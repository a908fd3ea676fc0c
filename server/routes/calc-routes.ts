import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { validate } from '@server/middleware/validate';
import { jointForPlant } from '@server/services/calc-service';
import { jointSpecSchema } from '@shared/trade';

/** Trade computations. */
export const calcRoutes = Router();
calcRoutes.use(requirePermission('calc.use'), jsonBody);

calcRoutes.post('/joint', validate({ body: jointSpecSchema }, async ({ body }, _req, res) => {
  res.json(await jointForPlant(body));
}));
