import { Router } from 'express';
import { requireRole } from '@server/middleware/auth';
import { validate } from '@server/middleware/validate';
import { currentPlantSettings, setPlantSettings } from '@server/services/plant-settings-service';
import { plantSettingsBodySchema } from '@shared/schemas/plant-settings';

/** Every signed-in role reads the plant's settings; only an admin changes them. */
export const plantSettingsRoutes = Router();

plantSettingsRoutes.get('/', async (_req, res) => {
  res.json(await currentPlantSettings());
});

plantSettingsRoutes.put('/', requireRole('admin'), validate({ body: plantSettingsBodySchema }), async (req, res) => {
  res.json(await setPlantSettings(res.locals.me, req.body));
});
