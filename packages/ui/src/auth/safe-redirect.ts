const HERE = 'http://app.invalid';

/**
 * Where to go after signing in: `target` only when it is a path of this app (one leading `/`, not `//host` or
 * `/\host`, which browsers read as another site, and no control characters, which browsers drop from URLs so that
 * `/\t/host` becomes `//host`); otherwise `fallback`.
 *
 * @example safeRedirect('/projects/42?tab=estimate', '/projects') // '/projects/42?tab=estimate'
 * @example safeRedirect('//evil.example', '/projects') // '/projects'
 */
export function safeRedirect(target: string | null | undefined, fallback: string): string {
  if (!target || target[0] !== '/' || target[1] === '/' || target[1] === '\\') return fallback;
  // eslint-disable-next-line no-control-regex -- the point is to find control characters
  if (/[\u0000-\u001F\u007F\\]/.test(target)) return fallback;
  try {
    const u = new URL(target, HERE);
    return u.origin === HERE ? `${u.pathname}${u.search}${u.hash}` : fallback;
  } catch {
    return fallback;
  }
}
