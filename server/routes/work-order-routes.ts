import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { validate } from '@server/middleware/validate';
import { sendKept } from '@server/middleware/kept-answer';
import { getIsolationPlan, setIsolationPlan } from '@server/services/work-orders/isolation-plan';
import { addJointTasks } from '@server/services/work-orders/joint-tasks';
import { getOrder } from '@server/services/work-orders/order-dto';
import { createOrder, listOrders, updateOrder } from '@server/services/work-orders/order-service';
import { cancelOrder, submitPlan } from '@server/services/work-orders/plan-service';
import { getWindowPlan } from '@server/services/work-orders/window-plan-service';
import { isolationPlanBodySchema } from '@shared/schemas/isolation-plans';
import { jointTasksAddSchema } from '@shared/schemas/joint-tasks';
import {
  workOrderCancelSchema, workOrderCreateSchema, workOrderIdParamsSchema as params, workOrderListQuerySchema, workOrderPlanSchema, workOrderUpdateSchema,
} from '@shared/schemas/work-orders';

export const workOrderRoutes = Router();
workOrderRoutes.use(requirePermission('workOrders.read'));
/** Writes: the planner's permission, then the body. */
const plan = [requirePermission('workOrders.plan'), jsonBody];

workOrderRoutes.get('/', validate({ query: workOrderListQuerySchema }, async ({ query }, req, res) => {
  sendKept(req, res, await listOrders(query, req.changeView));
}));

workOrderRoutes.post('/', ...plan, validate({ body: workOrderCreateSchema }, async ({ body }, _req, res) => {
  res.status(201).json(await createOrder(res.locals.me, body));
}));

workOrderRoutes.get('/:id', validate({ params }, async ({ params }, _req, res) => {
  res.json(await getOrder(params.id));
}));

workOrderRoutes.patch('/:id', ...plan, validate({ params, body: workOrderUpdateSchema }, async ({ params, body }, _req, res) => {
  res.json(await updateOrder(res.locals.me, params.id, body));
}));

workOrderRoutes.post('/:id/plan', ...plan, validate({ params, body: workOrderPlanSchema }, async ({ params, body }, _req, res) => {
  res.json(await submitPlan(res.locals.me, params.id, body));
}));

workOrderRoutes.post('/:id/cancellation', ...plan, validate({ params, body: workOrderCancelSchema }, async ({ params, body }, _req, res) => {
  res.json(await cancelOrder(res.locals.me, params.id, body.reason));
}));

workOrderRoutes.post('/:id/joint-tasks', ...plan, validate({ params, body: jointTasksAddSchema }, async ({ params, body }, _req, res) => {
  res.status(201).json(await addJointTasks(res.locals.me, params.id, body));
}));

workOrderRoutes.get('/:id/isolation-plan', validate({ params }, async ({ params }, _req, res) => {
  res.json(await getIsolationPlan(params.id));
}));

workOrderRoutes.put('/:id/isolation-plan', ...plan, validate({ params, body: isolationPlanBodySchema }, async ({ params, body }, _req, res) => {
  res.json(await setIsolationPlan(res.locals.me, params.id, body));
}));

workOrderRoutes.get('/:id/window-plan', validate({ params }, async ({ params }, _req, res) => {
  res.json(await getWindowPlan(params.id));
}));
