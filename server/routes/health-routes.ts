import { Router } from 'express';
import { checkHealth } from '@server/services/health-service';

export const healthRoutes = Router();

healthRoutes.get('/', async (_req, res) => {
  res.json(await checkHealth());
});
