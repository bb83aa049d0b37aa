import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { AppError } from '../http/app-error';
import { studioOf } from '../http/auth-middleware';
import type { AgendaScheduler } from './agenda-scheduler';

// Mounted at /api/studios/:studioId/agenda. POST /preview: this week's agenda mail, to the member
// who asks, now. A few an hour each: it is for seeing what Monday's looks like, not a mail relay.
export function agendaRouter(agenda: AgendaScheduler): Router {
  const router = Router({ mergeParams: true });
  const perMember = rateLimit({
    windowMs: 60 * 60 * 1000,
    limit: 5,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `agenda-preview:${req.user!.id}`,
    handler: () => {
      throw new AppError('rate_limited', 429, 'You asked for the agenda 5 times this hour; try again later');
    },
  });
  router.post('/preview', perMember, async (req, res) => {
    const user = req.user!;
    res.status(202).json(await agenda.sendPreview(studioOf(req).id, { userId: user.id, name: user.name, email: user.email }));
  });
  return router;
}
