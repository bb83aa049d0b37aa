import { Router } from 'express';
import type { Knex } from 'knex';

export function healthRouter(db: Knex): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await db.raw('SELECT 1');
      res.json({ status: 'ok', db: 'up' });
    } catch {
      // The pool reconnects on the next query, so the server recovers once the database returns.
      res.status(503).set('Retry-After', '5').json({ status: 'degraded', db: 'down', error: { code: 'db_unavailable', message: 'The database cannot be reached just now' } });
    }
  });
  return router;
}
