import { Router } from 'express';
import { runwayCreateBodySchema, runwayPreviewBodySchema, templateBodySchema, templateUpdateSchema } from '@shared/contracts/runways';
import { allow, studioOf } from '../http/auth-middleware';
import { unauthenticated } from '../http/app-error';
import { idParam, parseBody } from '../http/validate';
import type { RunwayService } from './runway-service';
import { templateIdParam, type TemplateService } from './template-service';

const planners = allow('owner', 'partner');

// Mounted at /api/studios/:studioId/runways. Members read; owner and partner plan and delete.
export function runwaysRouter(runways: RunwayService): Router {
  const router = Router({ mergeParams: true });
  router.post('/preview', planners, async (req, res) => {
    res.json(await runways.preview(studioOf(req), parseBody(runwayPreviewBodySchema, req)));
  });
  router.get('/', async (req, res) => {
    res.json(await runways.list(studioOf(req)));
  });
  router.post('/', planners, async (req, res) => {
    if (!req.user) throw unauthenticated();
    res.status(201).json(await runways.create(studioOf(req), req.user.id, parseBody(runwayCreateBodySchema, req)));
  });
  router.get('/:runwayId', async (req, res) => {
    res.json(await runways.get(studioOf(req), idParam(req, 'runwayId')));
  });
  router.delete('/:runwayId', planners, async (req, res) => {
    await runways.remove(studioOf(req), idParam(req, 'runwayId'));
    res.status(204).end();
  });
  return router;
}

// Mounted at /api/studios/:studioId/runway-templates; built-in templates have string ids ("default", ...).
export function templatesRouter(templates: TemplateService): Router {
  const router = Router({ mergeParams: true });
  const id = (raw: string | string[] | undefined) => templateIdParam(String(raw));
  router.get('/', async (req, res) => {
    res.json(await templates.list(studioOf(req)));
  });
  router.get('/:templateId', async (req, res) => {
    res.json(await templates.get(studioOf(req), id(req.params['templateId'])));
  });
  router.post('/', planners, async (req, res) => {
    res.status(201).json(await templates.create(studioOf(req), parseBody(templateBodySchema, req)));
  });
  router.put('/:templateId', planners, async (req, res) => {
    res.json(await templates.update(studioOf(req), id(req.params['templateId']), parseBody(templateUpdateSchema, req)));
  });
  router.delete('/:templateId', planners, async (req, res) => {
    await templates.remove(studioOf(req), id(req.params['templateId']));
    res.status(204).end();
  });
  return router;
}
