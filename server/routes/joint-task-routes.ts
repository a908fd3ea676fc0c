import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { idempotently } from '@server/middleware/idempotency';
import { receivePhoto } from '@server/middleware/upload';
import { validate } from '@server/middleware/validate';
import { jointDetail } from '@server/services/joints/joint-view';
import { storePhoto } from '@server/services/joints/photos';
import { redoJoint } from '@server/services/joints/redo';
import { recordStep } from '@server/services/joints/steps';
import { removeJointTask, setFitter } from '@server/services/work-orders/joint-tasks';
import { jointTaskFitterSchema, jointTaskIdParamsSchema as params } from '@shared/schemas/joint-tasks';
import { photoUploadFieldsSchema, redoSchema, stepRecordSchema } from '@shared/schemas/joint-steps';

export const jointTaskRoutes = Router();

jointTaskRoutes.get('/:id', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  res.json(await jointDetail(params.id, res.locals.me.id));
}));

// The planner's: remove a task, assign its fitter.
jointTaskRoutes.delete('/:id', requirePermission('workOrders.plan'), validate({ params }, async ({ params }, _req, res) => {
  await removeJointTask(res.locals.me, params.id);
  res.status(204).end();
}));

jointTaskRoutes.put('/:id/fitter', requirePermission('workOrders.plan'), jsonBody, validate({ params, body: jointTaskFitterSchema }, async ({ params, body }, _req, res) => {
  res.json(await setFitter(res.locals.me, params.id, body.personId));
}));

// The fitter's, from the shift tablet: each write carries an Idempotency-Key.
jointTaskRoutes.post('/:id/steps', requirePermission('joints.record'), jsonBody, validate({ params, body: stepRecordSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, (t) => recordStep(res.locals.me, params.id, body, t));
}));

jointTaskRoutes.post('/:id/redo', requirePermission('joints.redo'), jsonBody, validate({ params, body: redoSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => {
    const replacement = await redoJoint(res.locals.me, params.id, body.reason, t);
    return { status: 201, body: await jointDetail(replacement, res.locals.me.id, t) };
  });
}));

jointTaskRoutes.post('/:id/photos', requirePermission('joints.record'), receivePhoto, validate({ params, body: photoUploadFieldsSchema }, async ({ params, body }, req, res) => {
  await idempotently(req, res, async (t) => ({ status: 201, body: await storePhoto(res.locals.me, params.id, body.step, req.file!.buffer, t) }));
}));
