/**
 * `pnpm bench:api <scenario>`: starts the API (and the Stripe stand-in, for the demo's estimates and payments) on
 * free loopback ports with a fresh demo database and rate limits off, runs the scenario of that name from
 * bench/scenarios/ with autocannon, prints p50, p99, requests/s and non-2xx counts, and stops everything.
 * Exit code 1 when a scenario misses its p99 target. `pnpm bench:api` alone lists the scenarios.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer, type AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
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
function start(label: string, script: string, cwd: string, env: Record<string, string>) {
  const child = spawn(process.execPath, ['--import', 'tsx', script], {
    cwd,
    env: { ...process.env, ...env, FORCE_COLOR: '0' },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  child.stderr?.on('data', (b: Buffer) => process.env.BENCH_VERBOSE && process.stderr.write(`[${label}] ${b}`));
  children.push(child);
  return child;
}
function stop() {
  for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
  rmSync(dir, { recursive: true, force: true });
}
process.on('SIGINT', () => {
  stop();
  process.exit(130);
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
start('api', 'src/index.ts', apiDir, {
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
});

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
    async getJson(path, cookie) {
      const r = await fetch(`${baseUrl}${path}`, { headers: cookie ? { cookie } : {} });
      if (!r.ok) throw new Error(`GET ${path}: ${r.status}`);
      return r.json() as never;
    },
  };
  const { requests, headers } = await scenario.setup(ctx);
  const duration = scenario.durationSeconds ?? 20;
  console.log(`${name}: ${scenario.description}; ${duration} s against ${baseUrl}`);
  const result = await autocannon({
    url: baseUrl,
    connections: scenario.connections,
    overallRate: scenario.overallRate,
    duration,
    headers,
    requests,
  });
  const p99 = result.latency.p99;
  const verdict = scenario.target ? (p99 <= scenario.target.p99Ms ? 'met' : 'MISSED') : '';
  console.log(
    [
      `p50 ${result.latency.p50} ms`,
      `p99 ${p99} ms${scenario.target ? ` (target <= ${scenario.target.p99Ms} ms: ${verdict})` : ''}`,
      `${result.requests.average} requests/s (${result.requests.total} in ${duration} s)`,
      `non-2xx ${result.non2xx}`,
      `errors ${result.errors}, timeouts ${result.timeouts}`,
    ].join('\n'),
  );
  stop();
  process.exit(verdict === 'MISSED' || result.non2xx > 0 || result.errors > 0 ? 1 : 0);
} catch (err) {
  console.error(String(err));
  stop();
  process.exit(1);
}
