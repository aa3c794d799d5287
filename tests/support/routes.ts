/** The routes an Express 5 app serves, read from its router stack (so helpers that mount routes count too). */
import type { Express } from 'express';

interface Layer {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

const join = (a: string, b: string) => (a + (b === '/' ? '' : b)).replace(/\/+/g, '/') || '/';

/** Every `METHOD /path` the app serves, walking mounted routers and joining their mount paths (Express 5). */
export function servedRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        if (typeof layer.route.path !== 'string') throw new Error(`route path ${String(layer.route.path)} under ${prefix} is not a string; the walker reads only strings`);
        for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all')) found.push(`${method.toUpperCase()} ${join(prefix, layer.route.path)}`);
      } else if (layer.handle?.stack) {
        if (typeof layer.rawPath !== 'string') throw new Error(`a router mounted under ${prefix} has no string mount path (Express's router changed?)`);
        walk(layer.handle.stack, join(prefix, layer.rawPath));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(found)].sort();
}
