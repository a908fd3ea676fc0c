import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { validate } from '@server/middleware/validate';
import { currentPlantSettings, setPlantSettings } from '@server/services/plant-settings-service';
import { plantSettingsBodySchema } from '@shared/schemas/plant-settings';

export const plantSettingsRoutes = Router();

plantSettingsRoutes.get('/', requirePermission('plantSettings.read'), async (_req, res) => {
  res.json(await currentPlantSettings());
});

plantSettingsRoutes.put('/', requirePermission('plantSettings.edit'), jsonBody, validate({ body: plantSettingsBodySchema }, async ({ body }, _req, res) => {
  res.json(await setPlantSettings(res.locals.me, body));
}));
