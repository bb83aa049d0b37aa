import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import type { Role } from '@shared/contracts/auth';
import { AppError, forbidden, unauthenticated } from './app-error';
import { idParam } from './validate';

export interface SessionUser {
  id: number;
  email: string;
  name: string;
}

export interface StudioContext {
  id: number;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      studio?: StudioContext;
    }
  }
}

export const requireAuth: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthenticated());
};

// Loads :studioId for the signed-in user; a studio they are not a member of answers 404, as if absent.
export function loadStudio(db: Knex): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(unauthenticated());
    const studioId = idParam(req, 'studioId');
    const membership = await db('memberships').where({ studio_id: studioId, user_id: req.user.id }).first('role');
    if (!membership) return next(new AppError('not_found', 404, `No studio with id ${studioId}`));
    req.studio = { id: studioId, role: membership.role };
    next();
  };
}

// Declares which roles may call a route: router.post('/x', allow('owner', 'partner'), handler).
export function allow(...permitted: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.studio) return next(unauthenticated());
    next(permitted.includes(req.studio.role) ? undefined : forbidden(`Only ${permitted.join(' or ')} may do that`));
  };
}

export function studioOf(req: Request): StudioContext {
  if (!req.studio) throw unauthenticated();
  return req.studio;
}
