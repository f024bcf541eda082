import { Router } from 'express';
import { can } from '@shared/permissions';
import { auditQuerySchema } from '@shared/schemas/publishing';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { auditLog } from '../../../queries/audit';
import { presentAuditEntry } from '../../../presenters/publishing';
import { setPageLinks } from '../../../presenters/page-links';

/** The audit log: read-only, for moderators and admins. There is deliberately no route that changes it. */
export function auditRouter(): Router {
  const router = Router();
  router.get('/audit', requireUser, route({ query: auditQuerySchema }, async (req, res) => {
    if (!can(actorOf(req), 'read:audit')) throw forbidden('The audit log is for moderators.');
    const page = await auditLog(req.valid.query);
    setPageLinks(req, res, page).set('Cache-Control', 'no-store').json({ ...page, items: page.items.map(presentAuditEntry) });
  }));
  return router;
}
