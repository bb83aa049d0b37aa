import { Router, type Request } from 'express';
import { themeCreate, themePatch, themePick, themeStatusChange } from '@shared/contracts/themes';
import { unauthenticated } from '../http/app-error';
import { allow, studioOf } from '../http/auth-middleware';
import { idParam, parseBody } from '../http/validate';
import type { ThemesService } from './themes-service';

function actorOf(req: Request) {
  if (!req.user) throw unauthenticated();
  return { ...studioOf(req), userId: req.user.id };
}

// Mounted at /api/studios/:studioId after loadStudio. Crew read; partners edit; the owner picks and deletes.
export function themesRouter(themes: ThemesService): Router {
  const router = Router({ mergeParams: true });

  router.get('/themes', async (req, res) => {
    res.json(await themes.list(studioOf(req)));
  });

  router.post('/themes', allow('owner', 'partner'), async (req, res) => {
    res.status(201).json(await themes.create(actorOf(req), parseBody(themeCreate, req)));
  });

  router.get('/themes/:themeId', async (req, res) => {
    res.json(await themes.detail(studioOf(req), idParam(req, 'themeId')));
  });

  router.patch('/themes/:themeId', allow('owner', 'partner'), async (req, res) => {
    res.json(await themes.update(actorOf(req), idParam(req, 'themeId'), parseBody(themePatch, req)));
  });

  router.post('/themes/:themeId/status', allow('owner', 'partner'), async (req, res) => {
    res.json(await themes.changeStatus(actorOf(req), idParam(req, 'themeId'), parseBody(themeStatusChange, req)));
  });

  router.post('/themes/:themeId/pick', allow('owner'), async (req, res) => {
    res.json(await themes.pick(actorOf(req), idParam(req, 'themeId'), parseBody(themePick, req)));
  });

  router.delete('/themes/:themeId', allow('owner'), async (req, res) => {
    await themes.remove(studioOf(req), idParam(req, 'themeId'));
    res.status(204).end();
  });

  return router;
}
