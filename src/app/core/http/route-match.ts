import type { Route } from '@angular/router';

export interface Matched {
  route: Route;
  params: Record<string, string>;
}

/**
 * The chain of routes (parent first) that `path` names, with their `:name` parameters, or [] when none does. A
 * plain reading of the route table for start-up, before the router runs: paths of literal and `:name` segments,
 * children, `pathMatch: 'full'`; redirects and wildcards match nothing (nothing is fetched for them early).
 */
export function matchRoutes(routes: Route[], path: string): Matched[] {
  const segments = path.split('/').filter(Boolean).map(decodeURIComponent);
  return walk(routes, segments) ?? [];
}

function walk(routes: Route[], segments: string[]): Matched[] | null {
  for (const route of routes) {
    if (route.redirectTo !== undefined || route.path === undefined || route.path === '**') continue;
    const own = route.path.split('/').filter(Boolean);
    if (own.length > segments.length) continue;
    const params: Record<string, string> = {};
    const fits = own.every((p, i) =>
      p.startsWith(':') ? ((params[p.slice(1)] = segments[i]), true) : p === segments[i],
    );
    if (!fits) continue;
    const rest = segments.slice(own.length);
    if (route.children) {
      const below = walk(route.children, rest);
      if (below) return [{ route, params }, ...below];
    } else if (rest.length === 0) return [{ route, params }];
  }
  return null;
}
