import { Router } from 'express';
import type { Knex } from 'knex';
import { AppError, forbidden } from '../http/app-error';
import { requireAuth } from '../http/auth-middleware';
import { MailboxRepository } from './mailbox-repository';

/**
 * GET /api/dev/mailbox: the mail the local SMTP fake captured (never mounted in production).
 * Signed-in studio owners only, since it holds every account's invitation and reset links.
 */
export function mailboxRouter(db: Knex): Router {
  const mailbox = new MailboxRepository(db);
  const router = Router();
  router.get('/', requireAuth, async (req, res) => {
    if (!(await mailbox.isOwnerSomewhere(req.user!.id))) throw forbidden('Only a studio owner may read the captured mail');
    const to = typeof req.query['to'] === 'string' ? req.query['to'].trim().toLowerCase() : undefined;
    if (to !== undefined && to.length > 254) throw new AppError('invalid_input', 400, 'to: e-mail is too long', [{ path: ['to'], message: 'Too long' }]);
    res.json(await mailbox.list(200, to || undefined));
  });
  return router;
}
