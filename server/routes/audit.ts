/**
 * /api/teams/:teamId/audit — the team's audit trail, for owners ('audit:read'): a page of events
 * newest first with filters, and the same filters as a CSV download. There is no route that
 * changes or deletes an event (and the table refuses it).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { listAuditQuerySchema } from '../../shared/schemas/audit';
import { exportAudit, listAudit } from '../services/audit';

export function createAuditRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'audit:read');

  router.get('/', read, async (req, res) => {
    res.json(await listAudit(deps, actorOf(req).teamId, parseQuery(listAuditQuerySchema, req)));
  });
  router.get('/export.csv', read, async (req, res) => {
    const query = parseQuery(listAuditQuerySchema, req);
    const file = await exportAudit(deps, actorOf(req), query);
    res
      .set('Cache-Control', 'no-store')
      .type('text/csv; charset=utf-8')
      .attachment(file.filename)
      .send(file.body);
  });
  return router;
}
