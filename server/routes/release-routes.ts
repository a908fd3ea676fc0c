import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { idempotently } from '@server/middleware/idempotency';
import { sendKept } from '@server/middleware/kept-answer';
import { validate } from '@server/middleware/validate';
import { findOrder } from '@server/services/work-orders/order-facts';
import { releaseBlockers } from '@server/services/release/blockers';
import { listPressureTests, pressureTestDto } from '@server/services/release/test-dto';
import { recordPressureTest } from '@server/services/release/pressure-test';
import { releaseOrder } from '@server/services/release/release';
import { keptReleaseQueue } from '@server/services/release/queue';
import { keptLineStatusBoard } from '@server/services/release/status-board';
import { pressureTestBodySchema, releaseBodySchema } from '@shared/schemas/release';
import { workOrderIdParamsSchema as params } from '@shared/schemas/work-orders';

/** The test and the release of an order, under /api/work-orders/:id. */
export const orderReleaseRoutes = Router();

orderReleaseRoutes.get('/:id/pressure-tests', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  await findOrder(params.id);
  res.json(await listPressureTests(params.id));
}));

orderReleaseRoutes.post('/:id/pressure-tests', requirePermission('tests.witness'), jsonBody, validate({ params, body: pressureTestBodySchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const id = await recordPressureTest(res.locals.me, params.id, body, t);
    return { status: 201, body: await pressureTestDto(id, t) };
  });
}));

orderReleaseRoutes.get('/:id/release-check', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  const blockers = await releaseBlockers(await findOrder(params.id));
  res.json({ ready: blockers.length === 0, blockers });
}));

orderReleaseRoutes.post('/:id/release', requirePermission('lines.release'), jsonBody, validate({ params, body: releaseBodySchema }, async ({ params, body }, _req, res) => {
  res.status(201).json(await releaseOrder(res.locals.me, params.id, body));
}));

/** Operations' queue: orders whose lines are out, ready first, each with every reason it is blocked. */
export const releaseQueueRoutes = Router();
releaseQueueRoutes.use(requirePermission('workOrders.read'));
releaseQueueRoutes.get('/', async (req, res) => {
  sendKept(req, res, await keptReleaseQueue(req.changeView));
});

/** Every line out of service, why, and when it can come back. */
export const lineStatusRoutes = Router();
lineStatusRoutes.use(requirePermission('workOrders.read'));
lineStatusRoutes.get('/', async (req, res) => {
  sendKept(req, res, await keptLineStatusBoard(req.changeView));
});
