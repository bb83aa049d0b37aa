import type { Knex } from 'knex';
import { Router } from 'express';
import { themesRouter } from '../themes/themes-router';
import { ThemesService } from '../themes/themes-service';
import { appClock, type Clock } from '../clock/clock';
import { ScoringService } from './scoring-service';
import { seriesRouter } from './series-router';
import { SeriesService } from './series-service';

/**
 * The series and themes routes, and the scoring service whose afterSeriesChanged hook the imports
 * service calls after a commit. Mount `router` under the studio router.
 */
export function trendsRoutes(db: Knex, clock: Clock = appClock): { router: Router; scoring: ScoringService } {
  const scoring = new ScoringService(db, clock);
  const router = Router({ mergeParams: true });
  router.use('/', seriesRouter(new SeriesService(db, scoring)));
  router.use('/', themesRouter(new ThemesService(db, scoring)));
  return { router, scoring };
}
