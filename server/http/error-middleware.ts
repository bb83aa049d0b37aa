import type { ErrorRequestHandler, RequestHandler } from 'express';
import { z as zodClassic } from 'zod';
import '@shared/contracts/zod';
import * as z from 'zod/mini';
import { RunwayError } from '@shared/planning/runway-types';
import { AppError, ErrorIssue } from './app-error';
import { isDatabaseUnavailable } from './db-errors';

type Issue = { path: PropertyKey[]; message: string };

function issuesOf(list: Issue[]): ErrorIssue[] {
  return list.map((issue) => ({
    path: issue.path.map((part) => (typeof part === 'number' ? part : String(part))),
    message: issue.message,
  }));
}

function describe(issues: ErrorIssue[]): string {
  return issues.map((issue) => (issue.path.length ? `${issue.path.join('.')}: ${issue.message}` : issue.message)).join('; ');
}

// Body-parser, multer and other middleware errors carry a status and a type we can name.
function fromHttpError(error: { status?: number; statusCode?: number; type?: string; code?: string; message?: string }) {
  const status = error.status ?? error.statusCode;
  if (error.type === 'entity.parse.failed') return new AppError('malformed_json', 400, 'The request body is not valid JSON');
  if (error.type === 'entity.too.large' || error.code === 'LIMIT_FILE_SIZE') {
    return new AppError('too_large', 413, 'The request is larger than the server accepts');
  }
  if (typeof error.code === 'string' && error.code.startsWith('LIMIT_')) {
    return new AppError('bad_upload', 400, error.message ?? 'The upload was refused');
  }
  if (status && status >= 400 && status < 500) {
    return new AppError('bad_request', status, error.message ?? 'The request was refused');
  }
  return null;
}

/** The answer to every request while the database is away; the pool reconnects once it is back. */
export function databaseUnavailable(): AppError {
  return new AppError('db_unavailable', 503, 'The database cannot be reached just now; try again in a moment');
}

export function errorMiddleware(log: { error: (obj: unknown, msg: string) => void; warn: (obj: unknown, msg: string) => void }): ErrorRequestHandler {
  return (error, _req, res, _next) => {
    let known: AppError | null = null;
    if (error instanceof AppError) known = error;
    else if (isDatabaseUnavailable(error)) {
      log.warn({ err: { code: (error as { code?: unknown }).code, message: (error as Error).message } }, 'database unavailable');
      res.set('Retry-After', '5');
      known = databaseUnavailable();
    }
    else if (error instanceof RunwayError) known = new AppError(`runway_${error.code.replace('-', '_')}`, 422, error.message);
    else if (error instanceof z.core.$ZodError || error instanceof zodClassic.ZodError) {
      const issues = issuesOf(error.issues as Issue[]);
      known = new AppError('invalid_input', 400, describe(issues), issues);
    } else if (error && typeof error === 'object') known = fromHttpError(error);
    if (!known) {
      log.error({ err: error }, 'unhandled error');
      res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side; it has been logged' } });
      return;
    }
    const body: Record<string, unknown> = { code: known.code, message: known.message };
    if (known.issues) body['issues'] = known.issues;
    res.status(known.status).json({ error: body, ...(known.details ?? {}) });
  };
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', 404, `No API route for ${req.method} ${req.path}`));
};
