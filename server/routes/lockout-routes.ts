import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { idempotently } from '@server/middleware/idempotency';
import { validate } from '@server/middleware/validate';
import { lockoutBoard } from '@server/services/lockout/board';
import { applyLocks, createLockBox, handOver, removeLock } from '@server/services/lockout/locks';
import { verifyIsolation } from '@server/services/lockout/verification';
import {
  handoverSchema, lockBoxCreateSchema, lockIdParamsSchema, lockRemovalSchema, locksApplySchema, verificationSchema,
} from '@shared/schemas/lockout';
import { workOrderIdParamsSchema as params } from '@shared/schemas/work-orders';

/** An order's lockout, under /api/work-orders/:id: the board and the lock events. Each write answers the board. */
export const orderLockoutRoutes = Router();

orderLockoutRoutes.get('/:id/lockout', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  res.json(await lockoutBoard(params.id, res.locals.me.id));
}));

orderLockoutRoutes.post('/:id/locks', requirePermission('locks.apply'), jsonBody, validate({ params, body: locksApplySchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    await applyLocks(res.locals.me, params.id, body, t);
    return { status: 201, body: await lockoutBoard(params.id, res.locals.me.id, t) };
  });
}));

orderLockoutRoutes.post('/:id/lock-box', requirePermission('locks.apply'), jsonBody, validate({ params, body: lockBoxCreateSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    await createLockBox(res.locals.me, params.id, body, t);
    return { status: 201, body: await lockoutBoard(params.id, res.locals.me.id, t) };
  });
}));

orderLockoutRoutes.post('/:id/handovers', requirePermission('locks.handover'), jsonBody, validate({ params, body: handoverSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    await handOver(res.locals.me, params.id, body, t);
    return { status: 201, body: await lockoutBoard(params.id, res.locals.me.id, t) };
  });
}));

orderLockoutRoutes.post('/:id/verification', requirePermission('isolation.verify'), jsonBody, validate({ params, body: verificationSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    await verifyIsolation(res.locals.me, params.id, body, t);
    return { status: 201, body: await lockoutBoard(params.id, res.locals.me.id, t) };
  });
}));

/** A lock at its own address: removal by its owner, or by a supervisor under 1910.147(e)(3). */
export const lockRoutes = Router();

lockRoutes.post('/:id/removal', requirePermission('locks.apply'), jsonBody, validate({ params: lockIdParamsSchema, body: lockRemovalSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const orderId = await removeLock(res.locals.me, params.id, body, t);
    return { status: 200, body: await lockoutBoard(orderId, res.locals.me.id, t) };
  });
}));
