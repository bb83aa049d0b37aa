import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from './app-error';

const cookieName = 'XSRF-TOKEN';
const headerName = 'x-xsrf-token';
const unsafe = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

// Angular's double-submit convention: a readable cookie on GETs, echoed in a header on writes.
export function csrf(isSecure: boolean): RequestHandler {
  return (req, res, next) => {
    const cookie = req.cookies?.[cookieName] as string | undefined;
    if (!unsafe.has(req.method)) {
      if (!cookie) {
        res.cookie(cookieName, randomBytes(24).toString('base64url'), { sameSite: 'lax', secure: isSecure, httpOnly: false, path: '/' });
      }
      next();
      return;
    }
    const header = req.get(headerName);
    if (!cookie || !header || cookie.length !== header.length || !timingSafeEqual(Buffer.from(cookie), Buffer.from(header))) {
      next(new AppError('csrf', 403, 'Missing or wrong X-XSRF-TOKEN header; reload the page and try again'));
      return;
    }
    next();
  };
}
