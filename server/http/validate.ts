import type { Request } from 'express';
import { AppError } from './app-error';

interface Parser<T> {
  parse(data: unknown): T;
}

export function parseBody<T>(schema: Parser<T>, req: Request): T {
  return schema.parse(req.body ?? {});
}

export function parseQuery<T>(schema: Parser<T>, req: Request): T {
  return schema.parse(req.query ?? {});
}

export function idParam(req: Request, name: string): number {
  const raw = req.params[name];
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw new AppError('not_found', 404, `No ${name.replace(/Id$/, '')} with id ${raw}`);
  return id;
}
