import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { idempotently } from '@server/middleware/idempotency';
import { validate } from '@server/middleware/validate';
import { enterEngineeringCureTime } from '@server/services/holds/engineering';
import { jointDetail } from '@server/services/joints/joint-view';
import { engineeringEntrySchema, holdIdParamsSchema as params } from '@shared/schemas/joint-steps';

/** A hold at its own address: a supervisor's engineering cure time where the engine refused. */
export const holdRoutes = Router();

holdRoutes.post('/:id/engineering', requirePermission('holds.engineeringEntry'), jsonBody, validate({ params, body: engineeringEntrySchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const jointId = await enterEngineeringCureTime(res.locals.me, params.id, body, t);
    return { status: 200, body: await jointDetail(jointId, res.locals.me.id, t) };
  });
}));
