import type { Express } from 'express';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface Route {
  method: Method;
  path: string;
}

export interface RouteInfo extends Route {
  method: 'post' | 'put' | 'patch' | 'delete';
}

interface Layer {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

const WRITES = new Set(['post', 'put', 'patch', 'delete']);

const join = (prefix: string, path: string): string => `${prefix}${path === '/' ? '' : path}`;

function walk(stack: Layer[], prefix: string, out: Map<string, Route>): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods)) {
        const path = join(prefix, layer.route.path) || '/';
        out.set(`${method} ${path}`, { method: method as Method, path });
      }
    } else if (layer.handle?.stack && typeof layer.rawPath === 'string') {
      walk(layer.handle.stack, join(prefix, layer.rawPath), out);
    }
  }
}

/**
 * Every route of the app, read from Express's own router stack (so a route added tomorrow is in
 * the list without anyone remembering to add it to a test).
 */
export function allRoutes(app: Express): Route[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out = new Map<string, Route>();
  walk(router.stack, '', out);
  return [...out.values()];
}

/** Every state-changing route of the app. */
export function stateChangingRoutes(app: Express): RouteInfo[] {
  return allRoutes(app).filter((r): r is RouteInfo => WRITES.has(r.method));
}
