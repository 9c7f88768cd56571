/**
 * Runs the whole product on this machine: maildev (SMTP :1025, inbox :1080),
 * the Stripe stand-in (:12111), the API (:3000, which applies the migrations
 * and seeds the demo on start, its payments through the stand-in),
 * the client portal (:5173) and the shop app (:5174). Prints the URLs and the
 * demo sign-ins once everything answers; Ctrl-C stops everything. STACK_PORT_OFFSET moves every port (scripts/ports.ts).
 *
 *   pnpm exec tsx scripts/stack.ts            # as the start command runs it
 *   STACK_DATA=data/e2e pnpm exec tsx scripts/stack.ts --fresh   # a fresh database (the e2e run)
 *   pnpm exec tsx scripts/stack.ts --prod     # the built apps (pnpm build first), the API in production mode
 *
 * With --prod each app's dist/ is served by scripts/serve-app.ts on the same port (gzip, long-cached hashed
 * assets, /api proxied), the API runs with NODE_ENV=production, and the secrets come from data/secrets.json,
 * made with random values on the first run and read by both the API and the Stripe stand-in.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { MailDev } from 'maildev';
import { ports, urls } from './ports';

const root = resolve(import.meta.dirname, '..');
const data = resolve(root, process.env.STACK_DATA ?? 'data');
if (process.argv.includes('--fresh')) rmSync(data, { recursive: true, force: true });
mkdirSync(resolve(data, 'maildev'), { recursive: true });
const prod = process.argv.includes('--prod');

/** The secrets the API refuses to run in production without; any missing one is generated and kept (mode 600). */
function secrets(): Record<string, string> {
  const file = resolve(data, 'secrets.json');
  const kept = existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as Record<string, string>) : {};
  const wanted: Record<string, () => string> = {
    STRIPE_WEBHOOK_SECRET: () => `whsec_${randomBytes(24).toString('hex')}`,
    STRIPE_SECRET_KEY: () => `sk_test_${randomBytes(24).toString('hex')}`,
  };
  const missing = Object.keys(wanted).filter((k) => !kept[k]);
  for (const k of missing) kept[k] = wanted[k]!();
  if (missing.length) {
    writeFileSync(file, JSON.stringify(kept, null, 2) + '\n', { mode: 0o600 });
    console.log(`secrets generated into ${file}: ${missing.join(', ')}`);
  }
  return kept;
}

const env = {
  ...process.env,
  DATABASE_PATH: resolve(data, 'benchwright.db'),
  UPLOADS_DIR: resolve(data, 'uploads'),
  PDF_DIR: resolve(data, 'estimates'),
  STRIPE_FAKE_STATE: resolve(data, 'stripe-fake.json'),
  SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${ports.smtp}`,
  PORT: String(ports.api),
  API_URL: urls.api,
  PORTAL_URL: urls.portal,
  SHOP_URL: urls.shop,
  PORTAL_PORT: String(ports.portal),
  SHOP_PORT: String(ports.shop),
  APP_ORIGINS: [urls.portal, urls.shop].join(','),
  STRIPE_API_BASE: urls.stripe,
  STRIPE_FAKE_PORT: String(ports.stripe),
  STRIPE_FAKE_WEBHOOK_URL: `${urls.api}/api/webhooks/stripe`,
  FORCE_COLOR: '0',
  ...(prod ? { ...secrets(), NODE_ENV: 'production' } : {}),
};

const children: ChildProcess[] = [];
function run(name: string, args: string[], cwd: string) {
  const child = spawn('pnpm', args, { cwd, env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  const prefix = (line: string) => (line.trim() ? `[${name}] ${line}\n` : '');
  child.stdout?.on('data', (b: Buffer) => process.stdout.write(b.toString().split('\n').map(prefix).join('')));
  child.stderr?.on('data', (b: Buffer) => process.stderr.write(b.toString().split('\n').map(prefix).join('')));
  child.on('exit', (code, signal) => {
    if (!stopping) {
      console.error(`[${name}] stopped (${signal ?? code}); stopping everything`);
      void stop(1);
    }
  });
  children.push(child);
}

async function waitFor(url: string, what: string, timeoutMs = 180_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${what} did not answer at ${url} within ${timeoutMs / 1000} s`);
}

let stopping = false;
let maildev: MailDev | null = null;
async function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  for (const c of children) {
    try {
      if (c.pid) process.kill(-c.pid, 'SIGTERM');
    } catch {
      // already gone
    }
  }
  await new Promise((r) => setTimeout(r, 800));
  for (const c of children) {
    try {
      if (c.pid && c.exitCode === null) process.kill(-c.pid, 'SIGKILL');
    } catch {
      // already gone
    }
  }
  await maildev?.stop().catch(() => undefined);
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));

maildev = new MailDev({
  smtp: ports.smtp,
  web: ports.mailWeb,
  ip: '127.0.0.1',
  webIp: '127.0.0.1',
  mailDirectory: resolve(data, 'maildev'),
  silent: true,
});
await maildev.start();
run('stripe', ['--filter', '@benchwright/stripe-fake', 'start'], root);
await waitFor(`${urls.stripe}/__fake/events`, 'the Stripe stand-in').catch(async (err) => {
  console.error(String(err));
  await stop(1);
});
run('api', ['--filter', '@benchwright/api', 'start'], root);
const serve = (dist: string, port: number) => [
  'exec',
  'tsx',
  'scripts/serve-app.ts',
  '--dir',
  dist,
  '--port',
  String(port),
  '--api',
  urls.api,
];
if (prod) {
  run('portal', serve('apps/customer/dist', ports.portal), root);
  run('shop', serve('apps/shop/dist', ports.shop), root);
} else {
  run('portal', ['--filter', '@benchwright/customer', 'dev'], root);
  run('shop', ['--filter', '@benchwright/shop', 'dev'], root);
}

try {
  await waitFor(`${urls.api}/api/health`, 'the API');
  // the entry module answers once Vite has transformed it and optimised its dependencies
  await waitFor(`${urls.portal}/${prod ? '' : 'src/main.tsx'}`, 'the client portal');
  await waitFor(`${urls.shop}/${prod ? '' : 'src/main.tsx'}`, 'the shop app');
  await waitFor(`${urls.mail}/api/healthz`, 'maildev');
} catch (err) {
  console.error(String(err));
  await stop(1);
}

console.log(`
Benchwright is running${prod ? ' (production build)' : ''} (demo data: Fernhill Joinery, invented).

  client portal   ${urls.portal}
  shop app        ${urls.shop}
  API             ${urls.api}/api  (health: /api/health)
  mail inbox      ${urls.mail}/index.html (maildev; SMTP on 127.0.0.1:${ports.smtp})
  Stripe stand-in ${urls.stripe}     (test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)

Demo sign-ins, all with the password bench-demo-2026:
  maren@fernhill.example   owner (shop app)
  idris@fernhill.example   builder (shop app)
  priya@example.com        client (portal)
  tomasz@example.com       client (portal)
  guild@example.com        client (portal): the Alder Cross Makers' Guild

Press Ctrl-C to stop everything.
READY
`);
