import { Router } from 'express';
import type { Transaction } from 'sequelize';
import type { z } from 'zod';
import type { Action } from '@shared/permissions';
import type { Me } from '@shared/schemas/roles';
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

/** A lock event on the order: the permission, the body, the service in the write's transaction; answers the board. */
function boardWrite<B extends z.ZodType>(path: string, action: Action, body: B, run: (me: Me, orderId: string, body: z.output<B>, t: Transaction) => Promise<void>) {
  orderLockoutRoutes.post(path, requirePermission(action), jsonBody, validate({ params, body }, async ({ params, body: valid }, req, res) => {
    await idempotently(req, res, async (t) => {
      await run(res.locals.me, params.id, valid, t);
      return { status: 201, body: await lockoutBoard(params.id, res.locals.me.id, t) };
    });
  }));
}

boardWrite('/:id/locks', 'locks.apply', locksApplySchema, applyLocks);
boardWrite('/:id/lock-box', 'locks.apply', lockBoxCreateSchema, createLockBox);
boardWrite('/:id/handovers', 'locks.handover', handoverSchema, handOver);
boardWrite('/:id/verification', 'isolation.verify', verificationSchema, verifyIsolation);

/** A lock at its own address: removal by its owner, or by a supervisor under 1910.147(e)(3). */
export const lockRoutes = Router();

lockRoutes.post('/:id/removal', requirePermission('locks.apply'), jsonBody, validate({ params: lockIdParamsSchema, body: lockRemovalSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const orderId = await removeLock(res.locals.me, params.id, body, t);
    return { status: 200, body: await lockoutBoard(orderId, res.locals.me.id, t) };
  });
}));
