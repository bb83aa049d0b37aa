import { Router, type Request } from 'express';
import { feedRequest } from '@shared/contracts/feeds';
import { AppError, unauthenticated } from '../http/app-error';
import { studioOf, type SessionUser } from '../http/auth-middleware';
import { idParam, parseBody } from '../http/validate';
import type { FeedService, FeedValidators } from './feed-service';

function userOf(req: Request): SessionUser {
  if (!req.user) throw unauthenticated();
  return req.user;
}

// Mounted at /api/studios/:studioId/feeds after loadStudio. Every member may keep feeds of their own.
export function feedsRouter(feeds: FeedService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    res.json(await feeds.list(studioOf(req), userOf(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await feeds.create(studioOf(req), userOf(req), parseBody(feedRequest, req)));
  });

  router.post('/:feedId/rotate', async (req, res) => {
    res.json(await feeds.rotate(studioOf(req), userOf(req), idParam(req, 'feedId')));
  });

  router.delete('/:feedId', async (req, res) => {
    await feeds.remove(studioOf(req), userOf(req), idParam(req, 'feedId'));
    res.status(204).end();
  });

  return router;
}

const noFeed = () => new AppError('not_found', 404, 'No such feed: the link may have been revoked or replaced');

// RFC 9110 §13.1.2 and §13.2.2: If-None-Match decides when present; If-Modified-Since only without it.
function isNotModified(req: Request, validators: FeedValidators): boolean {
  const noneMatch = req.get('if-none-match');
  if (noneMatch) {
    const weakless = (tag: string) => tag.trim().replace(/^W\//, '');
    return noneMatch.trim() === '*' || noneMatch.split(',').some((tag) => weakless(tag) === validators.etag);
  }
  const since = Date.parse(req.get('if-modified-since') ?? '');
  return !Number.isNaN(since) && validators.lastModified.getTime() <= since;
}

// Mounted at /feeds, outside /api: calendar apps fetch it with no session and no CSRF token.
export function feedFileRouter(feeds: FeedService): Router {
  const router = Router();
  router.get('/:file', async (req, res) => {
    const token = /^([A-Za-z0-9_-]{22,100})\.ics$/.exec(String(req.params['file']))?.[1];
    if (!token) throw noFeed();
    const validators = await feeds.validators(token);
    if (!validators) throw noFeed();
    res.set({
      ETag: validators.etag,
      'Last-Modified': validators.lastModified.toUTCString(),
      'Cache-Control': 'private, no-cache',
      'X-Robots-Tag': 'noindex',
    });
    if (isNotModified(req, validators)) {
      res.status(304).end();
      return;
    }
    res.type('text/calendar; charset=utf-8').send(await feeds.render(validators));
  });
  return router;
}
