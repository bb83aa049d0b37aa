import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

// The calendar and home page ask for the studio's stamp every 30 s, and a probe asks for health:
// kept at debug so the console shows what people do, not the polling (5.5 MB in 30 minutes before).
const POLLING = /^\/api\/(health(\?|$)|studios\/\d+\/events\/stamp(\?|$))/;

/** Polling and static files (the client's scripts, styles, fonts) go to debug; the rest to info. */
export function isQuiet(method: string | undefined, url: string): boolean {
  if (method !== 'GET' && method !== 'HEAD') return false;
  return POLLING.test(url) || !(url.startsWith('/api/') || url.startsWith('/feeds/'));
}

/** The path as asked: Express rewrites req.url inside its routers, originalUrl keeps it. */
const urlOf = (req: IncomingMessage) => (req as IncomingMessage & { originalUrl?: string }).originalUrl ?? req.url ?? '';

/** One short line a request: "GET /api/studios/4/summary 200 12 ms", with the request id. */
export function requestLog(log: Logger) {
  return pinoHttp({
    logger: log,
    customLogLevel: (req: IncomingMessage, res: ServerResponse, error?: Error) => {
      if (error || res.statusCode >= 500) return 'error';
      return isQuiet(req.method, urlOf(req)) ? 'debug' : 'info';
    },
    customSuccessMessage: (req, res, time) => `${req.method} ${urlOf(req)} ${res.statusCode} ${Math.round(time)} ms`,
    customErrorMessage: (req, res, error) => `${req.method} ${urlOf(req)} ${res.statusCode}: ${error.message}`,
    serializers: {
      req: (req: { id: unknown; method: string; url: string; raw?: IncomingMessage }) => ({ id: req.id, method: req.method, url: req.raw ? urlOf(req.raw) : req.url }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
