import type { Express } from 'express';

type Layer = {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: string | string[];
};

/**
 * Every (METHOD, path) the app has mounted, read from Express's own router stack (Express 5 /
 * router 2), sub-routers included, so a new route cannot escape the matrix.
 */
export function mountedRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const p of paths)
          for (const m of Object.keys(layer.route.methods)) out.push(`${m.toUpperCase()} ${prefix}${p}`);
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(out)].sort();
}
