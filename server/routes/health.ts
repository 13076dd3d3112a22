import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { AppDeps } from '../deps';
import { publicRoute } from '../middleware/access';

export function createHealthRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', publicRoute('load balancer health check'), async (_req, res) => {
    try {
      await deps.db.execute(sql`select 1`);
      res.json({ status: 'ok', database: 'ok' });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'unreachable' });
    }
  });
  return router;
}
