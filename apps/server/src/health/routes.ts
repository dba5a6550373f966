import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { checkHealth } from './check-health.ts';

export function healthRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const report = await checkHealth(sequelize);
    res.status(report.db === 'ok' ? 200 : 503).json(report);
  });
  return router;
}
