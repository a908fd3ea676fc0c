import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { validate } from '@server/middleware/validate';
import { readPhoto } from '@server/services/joints/photos';
import { photoIdParamsSchema as params } from '@shared/schemas/joint-steps';

/** A joint photo by id, to signed-in people only; never under the name it was uploaded with. */
export const photoRoutes = Router();
photoRoutes.use(requirePermission('workOrders.read'));

photoRoutes.get('/:id', validate({ params }, async ({ params }, _req, res) => {
  const photo = await readPhoto(params.id);
  res.set({ 'Content-Type': photo.mediaType, 'Cache-Control': 'private, max-age=86400', 'Content-Disposition': `inline; filename="${photo.id}.jpg"`, 'X-Content-Type-Options': 'nosniff' });
  res.send(photo.content);
}));
