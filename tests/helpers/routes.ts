import type { Express } from 'express';

/** One route of the app: its method in capitals and its path as mounted ("/api/plots/:plotId"). */
export interface Route {
  method: string;
  path: string;
}

interface StackLayer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: StackLayer[] };
  rawPath?: unknown;
}

function walk(stack: StackLayer[], prefix: string, out: Route[]) {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: (prefix + (p === '/' ? '' : p)) || '/' });
        }
      }
    } else if (layer.handle?.stack && typeof layer.rawPath === 'string') {
      walk(layer.handle.stack, prefix + (layer.rawPath === '/' ? '' : layer.rawPath), out);
    }
  }
}

/**
 * Every /api route of the app, found by walking its own router stack (Express 5's `app.router`), once
 * each and without the HEAD that Express adds beside each GET. A route added to the app appears here
 * with no list to keep up to date.
 */
export function apiRoutes(app: Express): Route[] {
  const out: Route[] = [];
  walk((app as unknown as { router: { stack: StackLayer[] } }).router.stack, '', out);
  const seen = new Set<string>();
  return out.filter((r) => {
    const key = `${r.method} ${r.path}`;
    if (!r.path.startsWith('/api/') || r.method === 'HEAD' || seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** "METHOD /path", the key a route is listed under in tables of routes. */
export const routeKey = (r: Route) => `${r.method} ${r.path}`;
