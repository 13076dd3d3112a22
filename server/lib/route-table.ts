/**
 * Every API route, read from the Express routers themselves (not from a list kept by hand):
 * method, full path pattern and the access declarations (server/middleware/access.ts) that apply
 * to it, from router-wide `use` layers and from the route's own handlers. The access log uses it
 * to name the pattern of a request; the generated route matrix and the fuzz tests enumerate it.
 */
import type { Express } from 'express';
import { match } from 'path-to-regexp';
import { accessOf, type RouteAccess } from '../middleware/access';

export type RouteEntry = {
  method: string;
  /** Full pattern, e.g. /api/teams/:teamId/studies/:studyId/runs/:runId */
  path: string;
  access: RouteAccess[];
  /** Path parameter names in order. */
  params: string[];
};

type Layer = {
  handle: unknown;
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean>; stack: Layer[] };
};

const isRouter = (h: unknown): h is { stack: Layer[] } =>
  typeof h === 'function' && Array.isArray((h as { stack?: unknown }).stack);

function join(prefix: string, path: string): string {
  const p = path === '/' ? '' : path;
  return `${prefix}${p}` || '/';
}

function walk(stack: Layer[], prefix: string, inherited: RouteAccess[], out: RouteEntry[]): void {
  const active = [...inherited];
  for (const layer of stack) {
    if (layer.route) {
      if (typeof layer.route.path !== 'string') continue; // regex routes: the client fallback
      const own = layer.route.stack.map((l) => accessOf(l.handle)).filter((a) => a !== undefined);
      const path = join(prefix, layer.route.path);
      const params = [...path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
      for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all'))
        out.push({ method: method.toUpperCase(), path, access: [...active, ...own], params });
    } else if (isRouter(layer.handle)) {
      if (typeof layer.rawPath !== 'string')
        throw new Error(`A router mounted under ${prefix} has a non-string path`);
      walk(layer.handle.stack, join(prefix, layer.rawPath), active, out);
    } else {
      const access = accessOf(layer.handle);
      if (access && (layer.rawPath === '/' || layer.rawPath === undefined)) active.push(access);
    }
  }
}

/** The API routes of an app (everything mounted under /api), in matching order. */
export function listApiRoutes(app: Express): RouteEntry[] {
  const router = (app as unknown as { router?: { stack: Layer[] } }).router;
  if (!router) return [];
  const out: RouteEntry[] = [];
  walk(router.stack, '', [], out);
  return out.filter((r) => r.path === '/api' || r.path.startsWith('/api/'));
}

/** method + path → the pattern of the first route that matches, as Express would pick it. */
export function createPatternLookup(routes: () => RouteEntry[]) {
  let compiled: { method: string; path: string; test: (p: string) => boolean }[] | null = null;
  return (method: string, path: string): string | null => {
    compiled ??= routes().map((r) => {
      const m = match(r.path, { decode: false, end: true, trailing: true });
      return { method: r.method, path: r.path, test: (p: string) => m(p) !== false };
    });
    const wanted = method === 'HEAD' ? ['HEAD', 'GET'] : [method];
    return compiled.find((c) => wanted.includes(c.method) && c.test(path))?.path ?? null;
  };
}
