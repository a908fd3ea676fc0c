import { Router } from 'express';
import { validate } from '@server/middleware/validate';
import { jointForPlant } from '@server/services/calc-service';
import { jointSpecSchema } from '@shared/trade';

/** Trade computations; every signed-in role may ask (requireSignIn is applied at /api). */
export const calcRoutes = Router();

calcRoutes.post('/joint', validate({ body: jointSpecSchema }), async (req, res) => {
  res.json(await jointForPlant(req.body));
});
