import { Router } from 'express';
import { marketRequestSchema, marketUpdateSchema } from '@shared/contracts/markets';
import { allow, studioOf } from '../http/auth-middleware';
import { idParam, parseBody } from '../http/validate';
import type { MarketService } from './market-service';

// Mounted at /api/studios/:studioId/markets. Every member reads; owner and partner edit.
export function marketsRouter(markets: MarketService): Router {
  const router = Router({ mergeParams: true });
  const editors = allow('owner', 'partner');

  router.get('/', async (req, res) => {
    res.json(await markets.list(studioOf(req)));
  });
  router.get('/:marketId', async (req, res) => {
    res.json(await markets.get(studioOf(req), idParam(req, 'marketId')));
  });
  router.post('/', editors, async (req, res) => {
    res.status(201).json(await markets.create(studioOf(req), parseBody(marketRequestSchema, req)));
  });
  router.put('/:marketId', editors, async (req, res) => {
    res.json(await markets.update(studioOf(req), idParam(req, 'marketId'), parseBody(marketUpdateSchema, req)));
  });
  router.delete('/:marketId', editors, async (req, res) => {
    await markets.remove(studioOf(req), idParam(req, 'marketId'));
    res.status(204).end();
  });

  return router;
}
