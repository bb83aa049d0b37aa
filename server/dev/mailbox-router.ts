import { Router } from 'express';
import type { Knex } from 'knex';
import { AppError } from '../http/app-error';
import { requireAuth } from '../http/auth-middleware';
import { MailboxRepository } from './mailbox-repository';

/**
 * GET /api/dev/mailbox: the mail the local SMTP fake captured (never mounted in production). It holds
 * reset and invitation links, so a member reads only mail to their own address, and owners also the
 * invitations their studios sent: anything more would let one sign-up read another's reset link.
 */
export function mailboxRouter(db: Knex): Router {
  const mailbox = new MailboxRepository(db);
  const router = Router();
  router.get('/', requireAuth, async (req, res) => {
    const to = typeof req.query['to'] === 'string' ? req.query['to'].trim().toLowerCase() : undefined;
    if (to !== undefined && to.length > 254) throw new AppError('invalid_input', 400, 'to: e-mail is too long', [{ path: ['to'], message: 'Too long' }]);
    const reader = { email: req.user!.email, ownedStudios: await mailbox.ownedStudios(req.user!.id) };
    res.json(await mailbox.list(reader, 200, to || undefined));
  });
  return router;
}
