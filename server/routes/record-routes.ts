import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { validate } from '@server/middleware/validate';
import { closeOrder, orderRecordGaps } from '@server/services/record/completeness';
import { orderRecordPdf } from '@server/services/record/record-pdf';
import { getOrder } from '@server/services/work-orders/order-dto';
import { workOrderIdParamsSchema as params } from '@shared/schemas/work-orders';

/** An order's record under /api/work-orders/:id: what it lacks, closing it, and the PDF. */
export const orderRecordRoutes = Router();

orderRecordRoutes.get('/:id/record-gaps', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  res.json({ gaps: await orderRecordGaps(params.id) });
}));

orderRecordRoutes.post('/:id/close', requirePermission('workOrders.close'), validate({ params }, async ({ params }, _req, res) => {
  await closeOrder(res.locals.me, params.id);
  res.json(await getOrder(params.id));
}));

orderRecordRoutes.get('/:id/record.pdf', requirePermission('workOrders.read'), validate({ params }, async ({ params }, _req, res) => {
  const { filename, pdf } = await orderRecordPdf(params.id);
  res.set({ 'Content-Type': 'application/pdf', 'Content-Disposition': `attachment; filename="${filename}"` });
  res.send(pdf);
}));
