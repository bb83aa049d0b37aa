import type { Express } from 'express';

export interface AppRoute {
  method: string;
  /** The path as mounted, with Express's parameters (/api/studios/:studioId/events/:eventId). */
  path: string;
}

interface RouterLayer {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
}

const joined = (prefix: string, path: unknown) => (typeof path === 'string' && path !== '/' ? `${prefix}${path}` : prefix);

/** Every route the app answers, read from Express's own router stack (Express 5: layer.rawPath). */
export function routesOf(app: Express): AppRoute[] {
  const routes: AppRoute[] = [];
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = joined(prefix, layer.route.path) || '/';
        for (const method of Object.keys(layer.route.methods)) if (method !== '_all') routes.push({ method: method.toUpperCase(), path });
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, joined(prefix, layer.rawPath));
      }
    }
  };
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '');
  return routes;
}
