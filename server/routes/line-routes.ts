import { Router } from 'express';

export const lineRoutes = Router();
