import { Router } from 'express';

export const meRoutes = Router();

meRoutes.get('/', (_req, res) => {
  res.json(res.locals.me);
});
