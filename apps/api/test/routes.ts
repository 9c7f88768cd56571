/** One route as Express has it: the method in capitals and the full path with its parameters (`/api/jobs/:id`). */
export interface AppRoute {
  method: string;
  path: string;
}

interface LayerLike {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
  /** the path the layer was mounted at (router 2.x keeps it as given) */
  rawPath?: string | string[];
}

const join = (prefix: string, path: string) => {
  const p = `${prefix}/${path}`.replace(/\/+/g, '/');
  return p.length > 1 ? p.replace(/\/$/, '') : p;
};

/**
 * Every route of the app, from its router's stack: route layers give their path and methods, mounted routers
 * their stack, and each layer the path it was mounted at (`rawPath`, router 2.x). A mount at a pattern this
 * cannot read fails loudly rather than leaving routes out.
 */
export function appRoutes(app: { router: { stack: LayerLike[] } }): AppRoute[] {
  const out: AppRoute[] = [];
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = ([] as string[]).concat(layer.route.path);
        for (const p of paths)
          for (const [m, on] of Object.entries(layer.route.methods))
            if (on && m !== '_all') out.push({ method: m.toUpperCase(), path: join(prefix, p) });
        // `_all` would need every method in the table; the app has none, and this fails if one appears
        if (layer.route.methods._all)
          throw new Error(`route ${join(prefix, String(layer.route.path))} takes all methods`);
      } else if (layer.handle?.stack) {
        if (typeof layer.rawPath !== 'string')
          throw new Error(`a router is mounted at ${String(layer.rawPath)}: give the route walk its prefix`);
        walk(layer.handle.stack, join(prefix, layer.rawPath));
      }
    }
  };
  walk(app.router.stack, '');
  const seen = new Set<string>();
  return out.filter((r) => {
    const k = `${r.method} ${r.path}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

export const routeKey = (r: AppRoute) => `${r.method} ${r.path}`;
