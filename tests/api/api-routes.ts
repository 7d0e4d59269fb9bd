import type { Express } from 'express';
import { accessRuleOf, type AccessRule } from '../../server/core/access.js';

/** One route the app answers, with the access rules found in its handler chain. */
export interface MountedRoute {
  method: string;
  /** The full path pattern, e.g. `/api/users/:id`. */
  path: string;
  /** Every access rule (allow / publicRoute) in the route's own handler chain. */
  rules: AccessRule[];
}

/** The shape of Express 5's router layers that the walk reads (router 2.x: `rawPath`, `route`, a nested router's `stack`). */
interface RouterLayer {
  rawPath?: unknown;
  handle?: { stack?: RouterLayer[] };
  route?: { path: string; methods: Record<string, boolean>; stack: RouterLayer[] };
}

/** Lists every route mounted under /api and /brapi by walking the app's router stack, so no route escapes the role table. */
export function listApiRoutes(app: Express): MountedRoute[] {
  const routes: MountedRoute[] = [];
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '', routes);
  return routes.filter((r) => r.path.startsWith('/api/') || r.path.startsWith('/brapi/'));
}

function walk(stack: RouterLayer[], prefix: string, into: MountedRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const rules = layer.route.stack.map((l) => accessRuleOf(l.handle)).filter((r): r is AccessRule => r !== undefined);
      for (const method of Object.keys(layer.route.methods)) {
        into.push({ method: method.toUpperCase(), path: joinPath(prefix, layer.route.path), rules });
      }
    } else if (layer.handle?.stack) {
      walk(layer.handle.stack, joinPath(prefix, String(layer.rawPath ?? '')), into);
    }
  }
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}
