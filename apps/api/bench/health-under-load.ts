/**
 * The health-under-load scenario (issue "price once", item 2): while 4
 * thorough pricings of a mixed job run (three base cabinets, two wall
 * cabinets, a bookcase and the default bench), how fast do GET /api/health
 * and GET /api/auth/me answer? Target: p99 <= 50 ms.
 *
 *   pnpm --filter @benchwright/api exec tsx bench/health-under-load.ts [seconds per endpoint, default 10]
 *
 * Starts the API in this process on a free loopback port, on an in-memory
 * database with the demo seed and rate limits off; autocannon runs in its own
 * worker thread so that its work does not sit on the API's event loop. Stops
 * itself after at most 3 minutes.
 */
import { mkdtempSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { pino } from 'pino';
import { designs } from '@benchwright/pricing';
import { createApp } from '../src/app';
import { applyMigrations, openDb } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { loadEnv } from '../src/env';

const SECONDS = Number(process.argv[2] ?? 10);
const PRICINGS = 4;
const TARGET_P99_MS = 50;
setTimeout(() => {
  console.error('health-under-load: stopped after 3 minutes');
  process.exit(2);
}, 180_000).unref();

const env = loadEnv({
  DATABASE_PATH: ':memory:',
  LOG_LEVEL: 'silent',
  RATE_LIMITS: 'false',
  PDF_DIR: join(mkdtempSync(join(tmpdir(), 'bw-bench-')), 'pdf'),
});
const db = openDb(':memory:');
applyMigrations(db);
await seedDemo(db);
const app = createApp({ db, env, log: pino({ level: 'silent' }), ready: () => true });
const server = app.listen(0, '127.0.0.1');
await new Promise((r) => server.once('listening', r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
await app.pool.warm();

async function signIn(email: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (r.status !== 200) throw new Error(`sign-in of ${email}: ${r.status}`);
  return r.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}
const owner = await signIn('maren@fernhill.example');
const client = await signIn('priya@example.com');

const mixedJob = [
  { spec: designs['base-cabinet'].defaults, quantity: 3 },
  { spec: designs['wall-cabinet'].defaults, quantity: 2 },
  { spec: designs.bookcase.defaults, quantity: 1 },
  { spec: designs['assembly-bench'].defaults, quantity: 1 },
];

async function post(path: string, cookie: string, body: unknown) {
  const r = await fetch(`${base}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Cookie: cookie },
    body: JSON.stringify(body),
  });
  return { status: r.status, body: (await r.json()) as Record<string, { id: string }> };
}

/** One of the 4 pricings: request the mixed job as the client, price it as the owner, again until told to stop. */
let stop = false;
const pricings: { status: number; ms: number }[] = [];
async function pricingLoop() {
  while (!stop) {
    const p = await post('/api/projects', client, { items: mixedJob, notes: 'bench' });
    if (p.status !== 201) throw new Error(`request: ${p.status} ${JSON.stringify(p.body)}`);
    const t0 = performance.now();
    const e = await post(`/api/projects/${p.body.project?.id}/estimates`, owner, { source: 'engine' });
    pricings.push({ status: e.status, ms: performance.now() - t0 });
  }
}

async function measure(path: string, cookie?: string) {
  const r = await autocannon({
    url: `${base}${path}`,
    // two clients at a time: the latency one person sees, not the queue of a flood
    connections: 2,
    duration: SECONDS,
    workers: 1,
    headers: cookie ? { Cookie: cookie } : {},
  });
  return {
    path,
    requests: r.requests.total,
    non2xx: r.non2xx,
    p50: r.latency.p50,
    p99: r.latency.p99,
    max: r.latency.max,
  };
}

console.log(
  `health-under-load: ${SECONDS} s per endpoint, ${availableParallelism()} cores, ${app.pool.stats().threads} engine thread(s), load average ${loadavg()[0]?.toFixed(1)}`,
);
const idle = [await measure('/api/health'), await measure('/api/auth/me', owner)];
const loops = Array.from({ length: PRICINGS }, () => pricingLoop());
// wait until the pricings are running
while (app.pool.stats().running === 0) await new Promise((r) => setTimeout(r, 20));
const loaded = [await measure('/api/health'), await measure('/api/auth/me', owner)];
stop = true;
await Promise.all(loops);

const row = (label: string, m: Awaited<ReturnType<typeof measure>>) =>
  `${label.padEnd(8)} ${m.path.padEnd(14)} p50 ${String(m.p50).padStart(4)} ms  p99 ${String(m.p99).padStart(4)} ms  max ${String(m.max).padStart(5)} ms  ${m.requests} requests, ${m.non2xx} not 2xx`;
for (const m of idle) console.log(row('idle', m));
for (const m of loaded) console.log(row('loaded', m));
const done = pricings.filter((p) => p.status === 201);
const ms = pricings.map((p) => p.ms).sort((a, b) => a - b);
console.log(
  `pricings of the mixed job while measuring: ${pricings.length} (${done.length} priced, ${pricings.filter((p) => p.status === 422).length} too complex, ${pricings.filter((p) => p.status === 503).length} busy); median ${Math.round(ms[Math.floor(ms.length / 2)] ?? 0)} ms to answer, with ${PRICINGS} at once`,
);
const worst = Math.max(...loaded.map((m) => m.p99));
console.log(`load average after: ${loadavg()[0]?.toFixed(1)} (the figures mean little when it is far above the cores)`);
console.log(
  `target p99 <= ${TARGET_P99_MS} ms under load: ${worst <= TARGET_P99_MS ? 'met' : 'NOT met'} (worst p99 ${worst} ms)`,
);
await app.pool.close();
server.closeAllConnections();
server.close();
process.exit(0);
