import { Router } from 'express';
import { blackoutsRequestSchema, occasionSettingsSchema, optionalDateRangeQuerySchema } from '@shared/contracts/markets';
import { allow, studioOf } from '../http/auth-middleware';
import { parseBody, parseQuery } from '../http/validate';
import type { OccasionService } from './occasion-service';

// Mounted at /api/studios/:studioId. Members read; owner and partner change the calendar settings.
export function occasionsRouter(occasions: OccasionService): Router {
  const router = Router({ mergeParams: true });
  const editors = allow('owner', 'partner');

  router.get('/occasions', async (req, res) => {
    res.json(await occasions.settings(studioOf(req)));
  });
  router.put('/occasions', editors, async (req, res) => {
    res.json(await occasions.replace(studioOf(req), parseBody(occasionSettingsSchema, req)));
  });
  router.get('/occasions/upcoming', async (req, res) => {
    const { from, to } = parseQuery(optionalDateRangeQuerySchema, req);
    res.json(await occasions.upcoming(studioOf(req), from, to));
  });
  router.get('/blackouts', async (req, res) => {
    res.json(await occasions.blackouts(studioOf(req)));
  });
  router.put('/blackouts', editors, async (req, res) => {
    res.json(await occasions.replaceBlackouts(studioOf(req), parseBody(blackoutsRequestSchema, req)));
  });
  return router;
}
