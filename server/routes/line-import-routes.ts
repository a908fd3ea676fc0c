import { Router } from 'express';

export const lineImportRoutes = Router();
