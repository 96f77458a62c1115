// Lists the routes an Express app answers: the declared routes its dispatcher serves (remembered
// when the app is built) and any route registered on Express itself (the built client's fallback),
// by walking its router stack. Used by the tests that check every protected route refuses anonymous
// callers, that every answered route is documented, and the authorization matrix.
import type { ApiRoute } from './http/api-route';

export interface RouteInfo {
  method: string;
  path: string;
}

interface LayerLike {
  route?: { path: unknown; methods?: Record<string, boolean> };
  handle?: { stack?: unknown };
  rawPath?: unknown;
}

function isLayerList(value: unknown): value is LayerLike[] {
  return Array.isArray(value);
}

function walk(stack: LayerLike[], prefix: string, out: RouteInfo[]): void {
  for (const layer of stack) {
    if (layer.route && typeof layer.route.path === 'string') {
      for (const [method, on] of Object.entries(layer.route.methods ?? {})) {
        if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: prefix + layer.route.path });
      }
    } else if (layer.handle && isLayerList(layer.handle.stack)) {
      // Express 5's router keeps the mount path as rawPath; "/" mounts add nothing.
      const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
      walk(layer.handle.stack, prefix + mount, out);
    }
  }
}

const routeTables = new WeakMap<object, readonly ApiRoute[]>();

/** Remembers the route table an app's dispatcher serves, for listRoutes. */
export function rememberRouteTable(app: object, routes: readonly ApiRoute[]): void {
  routeTables.set(app, routes);
}

export function listRoutes(app: { router: unknown }): RouteInfo[] {
  const out: RouteInfo[] = (routeTables.get(app) ?? []).map((r) => ({ method: r.method.toUpperCase(), path: r.path }));
  const router = app.router as { stack?: unknown } | undefined;
  if (router && isLayerList(router.stack)) walk(router.stack, '', out);
  return out;
}
