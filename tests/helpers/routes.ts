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

/** Every route the Express app answers, read from its router (mounted routers included). */
export function listRoutes(app: Express): RouteInfo[] {
  const out: RouteInfo[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method === '_all') continue;
          const path = `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/';
          out.push({ method: method.toUpperCase(), path });
        }
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, `${prefix}${mount}`);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out;
}
