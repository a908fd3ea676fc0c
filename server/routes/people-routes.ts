import { Router } from 'express';
import { requirePermission } from '@server/middleware/auth';
import { jsonBody } from '@server/middleware/body';
import { validate } from '@server/middleware/validate';
import { listPeople, setRoles } from '@server/services/people-service';
import { personIdParamsSchema, personRolesBodySchema } from '@shared/schemas/roles';

export const peopleRoutes = Router();
peopleRoutes.use(requirePermission('people.manage'), jsonBody);

peopleRoutes.get('/', async (_req, res) => {
  res.json(await listPeople());
});

peopleRoutes.put('/:id/roles', validate({ params: personIdParamsSchema, body: personRolesBodySchema }, async ({ params, body }, _req, res) => {
  res.json(await setRoles(res.locals.me, params.id, body.roles));
}));
