import { Router } from 'express';
import { openApiDocument } from '@server/openapi/document';

/** The API's OpenAPI 3.1 description. Public: it holds no data, only the shape of the API the client already carries. */
export const openApiRoutes = Router();

openApiRoutes.get('/', (_req, res) => {
  res.json(openApiDocument());
});
