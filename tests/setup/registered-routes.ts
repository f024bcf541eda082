import type { Express } from 'express';

/**
 * Every route of an Express 5 app as "METHOD /path", found by walking its router stack. A router
 * mounted at several paths (the API at /api/v1 and its alias /api) lists its routes under each.
 */
export function registeredRoutes(app: Express): string[] {
  type Layer = { rawPath?: unknown; route?: { path: unknown; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };
  const out = new Set<string>();
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) out.add(`${m === '_all' ? 'ALL' : m.toUpperCase()} ${prefix}${String(layer.route.path)}`);
      } else if (layer.handle?.stack) {
        const raws = Array.isArray(layer.rawPath) ? layer.rawPath : [layer.rawPath];
        for (const raw of raws) walk(layer.handle.stack, prefix + (typeof raw === 'string' && raw !== '/' ? raw : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...out].sort();
}
