/**
 * Every route of the app as `METHOD /path`, read from Express's own router stack (not a
 * hand-written list), so specs that must cover every route fail when a new one is added.
 */
import type { Express } from 'express';

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
  rawPath?: string;
}

/** Every `/api` route of the app, sorted. */
export function enumerateRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = (prefix + layer.route.path).replace(/(.)\/$/, '$1');
        for (const method of Object.keys(layer.route.methods)) out.push(`${method.toUpperCase()} ${path}`);
      } else if (layer.handle.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out.filter((r) => r.includes(' /api/')).sort();
}

/** The routes that can change data: POST, PUT, PATCH and DELETE. */
export function enumerateWriteRoutes(app: Express): string[] {
  return enumerateRoutes(app).filter((r) => /^(POST|PUT|PATCH|DELETE) /.test(r));
}
