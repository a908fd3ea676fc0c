import type { Express } from 'express';

/** The parts of Express 5's router layers (router 2.x) the walk reads. */
interface Layer {
  name?: string;
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

const join = (prefix: string, path: string) => (prefix + (path === '/' ? '' : path)).replace(/\/{2,}/g, '/') || '/';

/** A layer's path as written in the code; anything but a plain string would hide routes from the walk. */
function pathOf(layer: Layer, what: string): string {
  const raw = layer.route ? layer.route.path : layer.rawPath;
  if (typeof raw !== 'string') {
    throw new Error(
      `cannot read the path of ${what} "${layer.name ?? '?'}" (got ${String(raw)}): mount and route with plain string paths, ` +
        'or the router internals changed and tests/helpers/app-routes.ts must learn the new shape',
    );
  }
  return raw;
}

/**
 * Every route the app answers, as "METHOD /path/:param", found by walking the router stack:
 * route layers give method and path, router layers (`app.use(path, router)`) give a mount path
 * in `rawPath` (router 2.x, Express 5.3) and their own stack, walked recursively. A path the
 * walk cannot read throws rather than letting a route slip past the role table.
 */
export function listRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = join(prefix, pathOf(layer, 'route'));
        for (const [method, on] of Object.entries(layer.route.methods)) if (on) found.push(`${method === '_all' ? 'ALL' : method.toUpperCase()} ${path}`);
      } else if (Array.isArray(layer.handle?.stack)) {
        // Mount Routers, not sub-apps: Express wraps a sub-app in a plain function the walk cannot see into.
        walk(layer.handle.stack, join(prefix, pathOf(layer, 'router')));
      }
    }
  };
  const root = (app as unknown as { router?: { stack?: Layer[] } }).router?.stack;
  if (!root) throw new Error('app.router.stack is missing: the Express version changed and tests/helpers/app-routes.ts must follow');
  walk(root, '');
  return found;
}
