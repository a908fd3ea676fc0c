import { Router } from 'express';

export const calcRoutes = Router();
