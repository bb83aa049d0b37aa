import { Router } from 'express';
import { studioSettingsPatch } from '@shared/contracts/studios';
import { allow, studioOf } from '../http/auth-middleware';
import { parseBody } from '../http/validate';
import type { StudioService } from './studio-service';

// Mounted at /api/studios/:studioId after loadStudio.
export function studiosRouter(studios: StudioService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    res.json(await studios.settings(studioOf(req)));
  });

  router.get('/summary', async (req, res) => {
    res.json(await studios.summary(studioOf(req)));
  });

  router.patch('/', allow('owner'), async (req, res) => {
    res.json(await studios.update(studioOf(req), parseBody(studioSettingsPatch, req)));
  });

  return router;
}
