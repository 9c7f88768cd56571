import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACCESS, defaultParams, type RouteAccess } from './access-table';
import { pino } from 'pino';
import { createApp } from '../src/app';
import { applyMigrations, openDb } from '../src/db/client';
import { loadEnv } from '../src/env';
import { appRoutes, routeKey } from './routes';
import { EMAILS, seededWorld, type World } from './world';

/**
 * Random input on every route (issue 13): for each route Express has, 50 cases as the owner and 50 as a client
 * (fixed seed), with random path parameters, query strings and JSON bodies, some of them near-valid. Any 5xx
 * fails, and so does a 4xx whose body is off the error shape `{ error: { code, message, issues? } }`.
 */
const CODES = [
  'invalid_input',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'unsupported_media_type',
  'rate_limited',
];
const RUNS = 50;
const SEED = 1302;

let w: World;
beforeAll(async () => {
  w = await seededWorld();
}, 60_000);
afterAll(async () => {
  await w?.close();
});

/** what is wrong with an answer, or null */
function offShape(status: number, body: unknown, text: string): string | null {
  if (status >= 500) return `status ${status}: ${text.slice(0, 300)}`;
  if (status < 400) return null;
  const e = (body as { error?: Record<string, unknown> } | undefined)?.error;
  if (!e || typeof e !== 'object') return `status ${status} without an error object: ${text.slice(0, 300)}`;
  const extra = Object.keys(e).filter((k) => !['code', 'message', 'issues'].includes(k));
  if (extra.length) return `status ${status}: unexpected fields ${extra.join(', ')}`;
  if (!CODES.includes(String(e.code))) return `status ${status}: code ${String(e.code)}`;
  if (typeof e.message !== 'string' || !e.message) return `status ${status}: no message`;
  if (e.issues !== undefined) {
    if (!Array.isArray(e.issues)) return `status ${status}: issues is not a list`;
    for (const i of e.issues as unknown[])
      if (
        !i ||
        typeof i !== 'object' ||
        Object.keys(i).sort().join() !== 'message,path' ||
        typeof (i as { path: unknown }).path !== 'string' ||
        typeof (i as { message: unknown }).message !== 'string'
      )
        return `status ${status}: an issue off the shape: ${JSON.stringify(i)}`;
  }
  if (/at .*\.[tj]s:\d+|node_modules/i.test(text)) return `status ${status}: a stack trace`;
  return null;
}

/** a near-valid body: the table's accepted body with one field replaced, dropped or added */
const nearValid = (valid: Record<string, unknown>) =>
  fc.oneof(
    fc.constant(valid),
    fc
      .record({ k: fc.constantFrom(...Object.keys(valid), '__proto__', 'constructor', 'extra'), v: fc.jsonValue() })
      .map(({ k, v }) => JSON.parse(JSON.stringify({ ...valid, [k]: v })) as unknown),
    fc.constantFrom(...Object.keys(valid)).map((k) => {
      const { [k]: _, ...rest } = valid;
      return rest;
    }),
  );

/**
 * Routes whose answer lays the whole piece out at `thorough` (seconds of work here): their real id comes once,
 * as an example, and the random cases use other ids, so that the file stays within a minute.
 */
const HEAVY = new Set([
  'GET /api/projects/:id/layouts',
  'GET /api/jobs/:id/traveller',
  'GET /api/jobs/:id/traveller.pdf',
]);

const param = (real: string, heavy: boolean) =>
  fc.oneof(
    { weight: heavy ? 0 : 3, arbitrary: fc.constant({ raw: false, v: real }) },
    { weight: 2, arbitrary: fc.string({ maxLength: 40 }).map((v) => ({ raw: false, v })) },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom('%zz', '%', '..', '%00', '%E0%A4%A', 'null', '-1', '1e308', 'x'.repeat(300), '%2F..%2F')
        .map((v) => ({ raw: true, v })),
    },
  );

const query = fc.oneof(
  fc.constant(''),
  fc
    .dictionary(
      fc.string({ maxLength: 8 }),
      fc.oneof(
        fc.string({ maxLength: 20 }),
        fc.jsonValue().map((v) => JSON.stringify(v)),
      ),
      {
        maxKeys: 4,
      },
    )
    .map((d) => `?${new URLSearchParams(d).toString()}`),
  fc.constantFrom('?a=%zz', '?items[0][spec]=x', '?__proto__[x]=1', '?a[]=1&a[]=2'),
);

function caseArb(route: RouteAccess, realParams: Record<string, string>, role: 'owner' | 'client') {
  const names = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
  const heavy = HEAVY.has(`${route.method} ${route.path}`);
  const params = fc.tuple(...names.map((n) => param(realParams[n] ?? 'x', heavy)));
  const valid = route.body?.(w.ids, role === 'owner' ? 'owner' : 'clientB');
  const body =
    route.method === 'GET'
      ? fc.constant(undefined)
      : valid && typeof valid === 'object' && Object.keys(valid).length
        ? fc.oneof(fc.jsonValue(), nearValid(valid as Record<string, unknown>))
        : fc.jsonValue();
  return fc.record({ params, query, body });
}

const emailOf = { owner: EMAILS.owner, client: EMAILS.priya } as const;
/** the client's own resources: Priya's project and her sent estimate */
function realParamsFor(path: string, role: 'owner' | 'client'): Record<string, string> {
  const p = defaultParams(path, w.ids);
  if (role === 'client' && path.startsWith('/api/projects/')) return { id: w.ids.priyaProject };
  if (role === 'client' && path.startsWith('/api/estimates/')) return { id: w.ids.priyaEstimate };
  return p;
}

/** the routes as Express has them, each with its row of the access table (for a near-valid body) */
const ROUTES = (() => {
  const env = loadEnv({ DATABASE_PATH: ':memory:', LOG_LEVEL: 'silent' });
  const db = openDb(':memory:');
  applyMigrations(db);
  const app = createApp({ db, env, log: pino({ level: 'silent' }), ready: () => true });
  const table = new Map(ACCESS.map((r) => [`${r.method} ${r.path}`, r]));
  return appRoutes(app as never).map(
    (r): RouteAccess =>
      table.get(routeKey(r)) ?? { ...r, method: r.method as RouteAccess['method'], expect: ACCESS[0]!.expect },
  );
})();

for (const role of ['owner', 'client'] as const) {
  describe(`random input as ${role === 'owner' ? 'the owner' : 'a client'}`, () => {
    let cookie = '';
    beforeAll(async () => {
      cookie = await w.cookie(emailOf[role]);
    });
    for (const route of ROUTES) {
      it(`${route.method} ${route.path}: no 5xx, nothing off the error shape in ${RUNS} cases`, async () => {
        const real = realParamsFor(route.path, role);
        let failure = '';
        const started = Date.now();
        await fc
          .assert(
            fc.asyncProperty(caseArb(route, real, role), async ({ params, query: qs, body }) => {
              let i = 0;
              const path =
                route.path.replace(/:(\w+)/g, () => {
                  const p = params[i++]!;
                  return p.raw ? p.v : encodeURIComponent(p.v);
                }) + qs;
              let req = request(w.api)[route.method.toLowerCase() as 'get'](path).set('Cookie', cookie);
              if (body !== undefined) req = req.set('Content-Type', 'application/json').send(JSON.stringify(body));
              const r = await req.buffer(true).parse((res, cb) => {
                const chunks: Buffer[] = [];
                res.on('data', (c: Buffer) => chunks.push(c));
                res.on('end', () => cb(null, Buffer.concat(chunks)));
              });
              const text = (r.body as Buffer).toString('utf8');
              let json: unknown;
              try {
                json = JSON.parse(text);
              } catch {
                json = undefined;
              }
              const wrong = offShape(r.status, json, text);
              if (wrong) failure ||= `${route.method} ${path} body ${JSON.stringify(body)?.slice(0, 300)}: ${wrong}`;
              return !wrong;
            }),
            {
              numRuns: RUNS,
              seed: SEED,
              endOnFailure: true,
              examples: HEAVY.has(`${route.method} ${route.path}`)
                ? [[{ params: Object.values(real).map((v) => ({ raw: false, v })), query: '', body: undefined }]]
                : [],
            },
          )
          .catch(() => undefined);
        if (process.env.FUZZ_TIMINGS) console.log(`${role} ${route.method} ${route.path}: ${Date.now() - started} ms`);
        // the route under test may have ended the session
        if (route.endsSession) cookie = await w.cookie(emailOf[role]);
        expect(failure).toBe('');
      }, 120_000);
    }
  });
}
