import type { Express } from 'express';

export interface RouteInfo {
  method: 'post' | 'put' | 'patch' | 'delete';
  path: string;
}

interface Layer {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

const WRITES = new Set(['post', 'put', 'patch', 'delete']);

const join = (prefix: string, path: string): string => `${prefix}${path === '/' ? '' : path}`;

function walk(stack: Layer[], prefix: string, out: Map<string, RouteInfo>): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods)) {
        if (WRITES.has(method)) out.set(`${method} ${join(prefix, layer.route.path)}`, { method: method as RouteInfo['method'], path: join(prefix, layer.route.path) || '/' });
      }
    } else if (layer.handle?.stack && typeof layer.rawPath === 'string') {
      walk(layer.handle.stack, join(prefix, layer.rawPath), out);
    }
  }
}

/**
 * Every state-changing route of the app, read from Express's own router stack (so a route added
 * tomorrow is in the list without anyone remembering to add it to a test).
 */
export function stateChangingRoutes(app: Express): RouteInfo[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out = new Map<string, RouteInfo>();
  walk(router.stack, '', out);
  return [...out.values()];
}
