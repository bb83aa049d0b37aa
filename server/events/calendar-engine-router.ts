import { Router } from 'express';
import type { Knex } from 'knex';
import { MarketService } from '../markets/market-service';
import { marketsRouter } from '../markets/markets-router';
import { OccasionService } from '../occasions/occasion-service';
import { occasionsRouter } from '../occasions/occasions-router';
import { RunwayService } from '../runways/runway-service';
import { runwaysRouter, templatesRouter } from '../runways/runways-router';
import { TemplateService } from '../runways/template-service';
import { EventMoves } from './event-moves';
import { EventService } from './event-service';
import { eventsRouter } from './events-router';

/** The calendar engine's routes under /api/studios/:studioId (membership already checked). */
export function calendarEngineRouter(db: Knex): Router {
  const router = Router({ mergeParams: true });
  router.use('/events', eventsRouter(new EventService(db), new EventMoves(db)));
  router.use('/runways', runwaysRouter(new RunwayService(db)));
  router.use('/runway-templates', templatesRouter(new TemplateService(db)));
  router.use('/markets', marketsRouter(new MarketService(db)));
  router.use('/', occasionsRouter(new OccasionService(db)));
  return router;
}
