import { Router } from 'express';
import { seriesDetailQuery, seriesListQuery } from '@shared/contracts/series';
import { studioOf } from '../http/auth-middleware';
import { idParam, parseQuery } from '../http/validate';
import type { SeriesService } from './series-service';

// Mounted at /api/studios/:studioId after loadStudio; every member may read.
export function seriesRouter(series: SeriesService): Router {
  const router = Router({ mergeParams: true });

  router.get('/series', async (req, res) => {
    res.json(await series.list(studioOf(req), parseQuery(seriesListQuery, req)));
  });

  router.get('/series/targets', async (req, res) => {
    res.json(await series.targets(studioOf(req)));
  });

  router.get('/series/:seriesId', async (req, res) => {
    res.json(await series.detail(studioOf(req), idParam(req, 'seriesId'), parseQuery(seriesDetailQuery, req).target));
  });

  return router;
}
