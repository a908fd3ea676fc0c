import { Router } from 'express';
import { sequelize } from '@server/db/sequelize';

export const healthRoutes = Router();

healthRoutes.get('/', async (_req, res) => {
  await sequelize.query('select 1');
  res.json({ ok: true });
});
