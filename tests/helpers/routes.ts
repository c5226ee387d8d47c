import type { Express } from 'express';

export interface RouteInfo {
  method: string;
  path: string;
}

interface Layer {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

/** Calls `visit` for each method of each route the app answers, mounted routers included, in order. */
function walkRoutes(app: Express, visit: (info: RouteInfo, route: object) => void): void {
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method === '_all') continue;
          const path = `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/';
          visit({ method: method.toUpperCase(), path }, layer.route);
        }
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, `${prefix}${mount}`);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
}

/** Every route the Express app answers, read from its router (mounted routers included). */
export function listRoutes(app: Express): RouteInfo[] {
  const out: RouteInfo[] = [];
  walkRoutes(app, (info) => out.push(info));
  return out;
}

/**
 * Each of the app's Express route objects with its full pattern per method ("GET /api/books/:id"),
 * so a handler's `req.route` names the route that answered.
 */
export function routeNames(app: Express): WeakMap<object, Map<string, string>> {
  const names = new WeakMap<object, Map<string, string>>();
  walkRoutes(app, ({ method, path }, route) => {
    const byMethod = names.get(route) ?? new Map<string, string>();
    byMethod.set(method, `${method} ${path}`);
    names.set(route, byMethod);
  });
  return names;
}
