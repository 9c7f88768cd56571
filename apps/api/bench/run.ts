/**
 * `pnpm bench:api <scenario>`: starts the API (and the Stripe stand-in, for the demo's estimates and payments) on
 * free loopback ports with a fresh demo database (and the scale seed when the scenario asks) and rate limits off,
 * runs the scenario of that name from bench/scenarios/ with autocannon, part by part, prints p50, p99,
 * requests/s and non-2xx counts with the load average, and stops everything. Exit code 1 when a part misses its
 * p99 target. `pnpm bench:api` alone lists the scenarios.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer, type AddressInfo } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { BenchContext, Scenario } from './scenario';

const here = import.meta.dirname;
const apiDir = resolve(here, '..');
const root = resolve(apiDir, '../..');
const available = readdirSync(join(here, 'scenarios'))
  .filter((f) => f.endsWith('.ts'))
  .map((f) => f.replace(/\.ts$/, ''));
const name = process.argv[2];
if (!name || !available.includes(name)) {
  console.error(`usage: pnpm bench:api <scenario>   (scenarios: ${available.join(', ')})`);
  process.exit(2);
}
const scenario = (await import(`./scenarios/${name}.ts`)).default as Scenario;

const freePort = () =>
  new Promise<number>((ok, fail) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as AddressInfo;
      s.close(() => ok(port));
    });
    s.once('error', fail);
  });

const dir = mkdtempSync(join(tmpdir(), 'bw-bench-'));
const [apiPort, stripePort, smtpPort] = [await freePort(), await freePort(), await freePort()];
const baseUrl = `http://127.0.0.1:${apiPort}`;
const children: ChildProcess[] = [];
function start(label: string, script: string, cwd: string, env: Record<string, string>, nodeArgs: string[] = []) {
  const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', script], {
    cwd,
    env: { ...process.env, ...env, FORCE_COLOR: '0' },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  child.stderr?.on('data', (b: Buffer) => process.env.BENCH_VERBOSE && process.stderr.write(`[${label}] ${b}`));
  children.push(child);
  return child;
}
/** Stops the children and waits (up to 10 s) for them to exit, so a profile they write on exit is complete. */
async function stop() {
  const running = children.filter((c) => c.exitCode === null);
  const exited = running.map((c) => new Promise((ok) => c.once('exit', ok)));
  for (const c of running) c.kill('SIGTERM');
  await Promise.race([Promise.all(exited), new Promise((ok) => setTimeout(ok, 10_000))]);
  rmSync(dir, { recursive: true, force: true });
}
process.on('SIGINT', () => {
  void stop().then(() => process.exit(130));
});

async function waitFor(url: string, what: string, timeoutMs = 180_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (
      await fetch(url).then(
        (r) => r.ok,
        () => false,
      )
    )
      return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${what} did not answer at ${url} within ${timeoutMs / 1000} s`);
}

const secret = 'whsec_bench_only_loopback';
start('stripe', 'src/main.ts', resolve(root, 'packages/stripe-fake'), {
  STRIPE_FAKE_PORT: String(stripePort),
  STRIPE_FAKE_STATE: join(dir, 'stripe-fake.json'),
  STRIPE_FAKE_WEBHOOK_URL: `${baseUrl}/api/webhooks/stripe`,
  STRIPE_WEBHOOK_SECRET: secret,
});
if (scenario.scale) {
  console.log(`seeding ${scenario.scale} projects (pnpm db:seed --scale ${scenario.scale})...`);
  const seed = spawn(process.execPath, ['--import', 'tsx', 'src/db/seed-cli.ts', '--scale', String(scenario.scale)], {
    cwd: apiDir,
    env: { ...process.env, DATABASE_PATH: join(dir, 'benchwright.db'), LOG_LEVEL: 'warn', FORCE_COLOR: '0' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const code = await new Promise<number | null>((ok) => seed.once('exit', ok));
  if (code !== 0) {
    await stop();
    throw new Error(`the scale seed failed (${code})`);
  }
}
// BENCH_API_NODE_ARGS: extra Node flags for the API only, e.g. '--cpu-prof --cpu-prof-dir=/tmp/prof' to profile it
const apiNodeArgs = process.env.BENCH_API_NODE_ARGS?.split(/\s+/).filter(Boolean) ?? [];
start(
  'api',
  'src/index.ts',
  apiDir,
  {
    HOST: '127.0.0.1',
    PORT: String(apiPort),
    DATABASE_PATH: join(dir, 'benchwright.db'),
    PDF_DIR: join(dir, 'estimates'),
    UPLOADS_DIR: join(dir, 'uploads'),
    STRIPE_API_BASE: `http://127.0.0.1:${stripePort}`,
    STRIPE_WEBHOOK_SECRET: secret,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, // nothing listens: mail waits in the outbox
    RATE_LIMITS: 'false',
    LOG_LEVEL: 'warn',
    SEED_DEMO: 'true',
    NODE_ENV: 'development',
    // the scale seed's thousands of revisions were never priced, so they have no record; filling them in would
    // keep the engine's thread busy for an hour beside the measured requests (the lists never read a record)
    ...(scenario.scale ? { RECORD_BACKFILL: 'false' } : {}),
  },
  apiNodeArgs,
);

try {
  await waitFor(`http://127.0.0.1:${stripePort}/__fake/events`, 'the Stripe stand-in');
  await waitFor(`${baseUrl}/api/health`, 'the API');
  const ctx: BenchContext = {
    baseUrl,
    async signIn(email) {
      const r = await fetch(`${baseUrl}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password: 'bench-demo-2026' }),
      });
      if (!r.ok) throw new Error(`sign-in of ${email}: ${r.status}`);
      return r.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; ');
    },
    async postJson(path, body, cookie) {
      const r = await fetch(`${baseUrl}${path}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
        body: JSON.stringify(body),
      });
      return { status: r.status, body: (await r.json()) as never };
    },
    async getJson(path, cookie) {
      const r = await fetch(`${baseUrl}${path}`, { headers: cookie ? { cookie } : {} });
      if (!r.ok) throw new Error(`GET ${path}: ${r.status}`);
      return r.json() as never;
    },
  };
  const plan = await scenario.setup(ctx);
  const parts = plan.parts ?? [{ label: name, requests: plan.requests }];
  const duration = scenario.durationSeconds ?? 20;
  const load = () => loadavg()[0]?.toFixed(1);
  console.log(
    `${name}: ${scenario.description}; ${duration} s a part against ${baseUrl}; ${availableParallelism()} cores, load average ${load()}`,
  );
  let missed = false;
  let failed = false;
  // each part first runs unmeasured for a few seconds at its rate, so the figures are of a warm server (compiled code,
  // SQLite's page cache) as a shop's API is after its first minutes, not of its first requests after start-up
  const warmup = Number(process.env.BENCH_WARMUP_S ?? 3);
  if (warmup > 0) console.log(`(each part warms up for ${warmup} s first, not counted; BENCH_WARMUP_S=0 to skip)`);
  for (const part of parts) {
    if (warmup > 0)
      await autocannon({
        url: baseUrl,
        connections: scenario.connections,
        overallRate: scenario.overallRate,
        duration: warmup,
        headers: plan.headers,
        requests: part.requests,
      });
    await part.before?.();
    const result = await autocannon({
      url: baseUrl,
      connections: scenario.connections,
      overallRate: scenario.overallRate,
      duration,
      headers: plan.headers,
      requests: part.requests,
    });
    const p99 = result.latency.p99;
    const judged = scenario.target && !plan.unjudged?.includes(part.label);
    const verdict = judged ? (p99 <= scenario.target!.p99Ms ? 'met' : 'MISSED') : '';
    missed ||= verdict === 'MISSED';
    failed ||= result.non2xx > 0 || result.errors > 0;
    console.log(
      [
        `${part.label}:`,
        `  p50 ${result.latency.p50} ms`,
        `  p99 ${p99} ms${judged ? ` (target <= ${scenario.target!.p99Ms} ms: ${verdict})` : ''}`,
        `  ${result.requests.average} requests/s (${result.requests.total} in ${duration} s)`,
        `  non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}`,
        `  load average ${load()} after`,
      ].join('\n'),
    );
  }
  for (const line of (await plan.after?.()) ?? []) console.log(line);
  await stop();
  process.exit(missed || failed ? 1 : 0);
} catch (err) {
  console.error(String(err));
  await stop();
  process.exit(1);
}
