import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import onHeaders from 'on-headers';
import { AppError } from './app-error';

const cookieName = 'XSRF-TOKEN';
const headerName = 'x-xsrf-token';
const unsafe = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * What a token is bound to: the signed-in session's id, or "anon" before sign-in; null where no
 * session is loaded (the health route, mounted before sessions), which only hands out a first token.
 */
function bindingOf(req: Request): string | null {
  if (req.session === undefined) return null;
  return req.user ? `session:${req.sessionID}` : 'anon';
}

/**
 * Angular's cookie-and-header convention (XSRF-TOKEN read by the client, echoed as X-XSRF-TOKEN),
 * with the token signed for the session it belongs to: "nonce.signature", the signature an HMAC of
 * the binding and the nonce under the session secret. A cookie and header planted by someone else
 * then fail, because the server never signed that pair for this session. A new token goes out when
 * none is held, when it belongs to another session, and when a sign-in or sign-out changes the binding.
 */
export function csrf(secret: string, isSecure: boolean): RequestHandler {
  const sign = (binding: string, nonce: string) => createHmac('sha256', secret).update(`${binding}.${nonce}`).digest('base64url');
  const issue = (binding: string) => {
    const nonce = randomBytes(18).toString('base64url');
    return `${nonce}.${sign(binding, nonce)}`;
  };
  const isValid = (token: string, binding: string) => {
    const [nonce, signature, ...rest] = token.split('.');
    if (!nonce || !signature || rest.length) return false;
    return same(signature, sign(binding, nonce));
  };
  const setToken = (res: Response, token: string) => res.cookie(cookieName, token, { sameSite: 'lax', secure: isSecure, httpOnly: false, path: '/' });

  return (req, res, next) => {
    const cookie = req.cookies?.[cookieName] as string | undefined;
    const before = bindingOf(req);
    // Just before the answer goes out: a sign-in or sign-out in the handler changes what the token
    // must be bound to, and the client reads the new cookie for its next write.
    onHeaders(res, () => {
      const after = bindingOf(req) ?? 'anon';
      if (!cookie ? true : before === null ? false : !isValid(cookie, after)) setToken(res, issue(after));
    });
    if (!unsafe.has(req.method)) {
      next();
      return;
    }
    const header = req.get(headerName);
    if (!cookie || !header || !same(cookie, header) || !isValid(cookie, before ?? 'anon')) {
      next(new AppError('csrf', 403, 'Missing or wrong X-XSRF-TOKEN header; reload the page and try again'));
      return;
    }
    next();
  };
}

function same(a: string, b: string): boolean {
  return a.length === b.length && timingSafeEqual(Buffer.from(a), Buffer.from(b));
}
