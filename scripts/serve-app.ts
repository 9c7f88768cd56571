/**
 * Serves one built app (its `dist/` from `vite build`) the way a shop would deploy it: gzip, hashed assets cached
 * for a year, `index.html` never cached, any other path answered with `index.html` (the app routes in the
 * browser), and `/api` passed to the API so the app's URLs are the same as in development.
 *
 *   pnpm exec tsx scripts/serve-app.ts --dir apps/customer/dist --port 5173 [--api http://127.0.0.1:3000] [--host 127.0.0.1]
 */
import compression from 'compression';
import express from 'express';
import { createProxyMiddleware } from 'http-proxy-middleware';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parseArgs } from 'node:util';

const { values } = parseArgs({
  options: {
    dir: { type: 'string' },
    port: { type: 'string' },
    api: { type: 'string', default: 'http://127.0.0.1:3000' },
    host: { type: 'string', default: '127.0.0.1' },
  },
});
if (!values.dir || !values.port)
  throw new Error('usage: serve-app.ts --dir DIST --port PORT [--api URL] [--host HOST]');
const dir = resolve(values.dir);
const index = join(dir, 'index.html');
if (!existsSync(index)) throw new Error(`${index} is missing: run pnpm build first`);

const app = express();
app.disable('x-powered-by');
// the API's own answers pass through untouched (X-Forwarded-For added, so its per-address limits see the client)
app.use('/api', createProxyMiddleware({ target: `${values.api}/api`, xfwd: true }));
app.use(compression());
app.use(
  express.static(dir, {
    index: false,
    setHeaders(res, path) {
      // Vite puts a content hash in every file name under assets/: such a file never changes
      res.setHeader(
        'Cache-Control',
        path.startsWith(join(dir, 'assets')) ? 'public, max-age=31536000, immutable' : 'no-cache',
      );
    },
  }),
);
app.get('/assets/{*rest}', (_req, res) => void res.status(404).end());
app.get('/{*rest}', (_req, res) => {
  res.setHeader('Cache-Control', 'no-cache');
  res.sendFile(index);
});
app.listen(Number(values.port), values.host, () =>
  console.log(`serving ${dir} on http://${values.host}:${values.port} (/api -> ${values.api})`),
);
