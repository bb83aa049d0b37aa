import { Router } from 'express';
import { atHandQuerySchema, dateRangeQuerySchema } from '@shared/contracts/markets';
import { eventPatchSchema } from '@shared/contracts/runways';
import { allow, studioOf } from '../http/auth-middleware';
import { unauthenticated } from '../http/app-error';
import { idParam, parseBody, parseQuery } from '../http/validate';
import type { EventMoves } from './event-moves';
import type { EventService } from './event-service';

// Mounted at /api/studios/:studioId/events. Members read; PATCH checks roles itself (crew may tick
// their own steps); re-planning is for owner and partner.
export function eventsRouter(events: EventService, moves: EventMoves): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const { from, to } = parseQuery(dateRangeQuerySchema, req);
    const { body, etag } = await events.listBody(studioOf(req), from, to);
    res.set({ ETag: etag, 'Cache-Control': 'private, no-cache' }).type('application/json').send(body);
  });
  router.get('/tray', async (req, res) => {
    res.json(await events.tray(studioOf(req)));
  });
  router.get('/at-hand', async (req, res) => {
    const { today, through } = parseQuery(atHandQuerySchema, req);
    res.set('Cache-Control', 'no-store').json(await events.atHand(studioOf(req), today, through));
  });
  router.get('/stamp', async (req, res) => {
    res.set('Cache-Control', 'no-store').json(await events.stamp(studioOf(req)));
  });
  router.get('/:eventId', async (req, res) => {
    res.json(await events.get(studioOf(req), idParam(req, 'eventId')));
  });
  router.patch('/:eventId', async (req, res) => {
    if (!req.user) throw unauthenticated();
    res.json(await moves.patch(studioOf(req), req.user.id, idParam(req, 'eventId'), parseBody(eventPatchSchema, req)));
  });
  router.post('/:eventId/replan', allow('owner', 'partner'), async (req, res) => {
    const isPreview = req.query['preview'] === '1' || req.query['preview'] === 'true';
    res.json(await moves.replan(studioOf(req), idParam(req, 'eventId'), isPreview, req.query['from'] === 'itself'));
  });

  return router;
}
