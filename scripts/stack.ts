/**
 * Runs the whole product on this machine: maildev (SMTP :1025, inbox :1080),
 * the Stripe stand-in (:12111), the API (:3000, which applies the migrations
 * and seeds the demo on start, its payments through the stand-in),
 * the client portal (:5173) and the shop app (:5174). Prints the URLs and the
 * demo sign-ins once everything answers; Ctrl-C stops everything.
 *
 *   pnpm exec tsx scripts/stack.ts            # as the start command runs it
 *   STACK_DATA=data/e2e pnpm exec tsx scripts/stack.ts --fresh   # a fresh database (the e2e run)
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { MailDev } from 'maildev';

const root = resolve(import.meta.dirname, '..');
const data = resolve(root, process.env.STACK_DATA ?? 'data');
if (process.argv.includes('--fresh')) rmSync(data, { recursive: true, force: true });
mkdirSync(resolve(data, 'maildev'), { recursive: true });

const env = {
  ...process.env,
  DATABASE_PATH: resolve(data, 'benchwright.db'),
  UPLOADS_DIR: resolve(data, 'uploads'),
  PDF_DIR: resolve(data, 'estimates'),
  STRIPE_FAKE_STATE: resolve(data, 'stripe-fake.json'),
  SMTP_URL: process.env.SMTP_URL ?? 'smtp://127.0.0.1:1025',
  FORCE_COLOR: '0',
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
  smtp: 1025,
  web: 1080,
  ip: '127.0.0.1',
  webIp: '127.0.0.1',
  mailDirectory: resolve(data, 'maildev'),
  silent: true,
});
await maildev.start();
run('stripe', ['--filter', '@benchwright/stripe-fake', 'start'], root);
await waitFor('http://127.0.0.1:12111/__fake/events', 'the Stripe stand-in').catch(async (err) => {
  console.error(String(err));
  await stop(1);
});
run('api', ['--filter', '@benchwright/api', 'start'], root);
run('portal', ['--filter', '@benchwright/customer', 'dev'], root);
run('shop', ['--filter', '@benchwright/shop', 'dev'], root);

try {
  await waitFor('http://127.0.0.1:3000/api/health', 'the API');
  // the entry module answers once Vite has transformed it and optimised its dependencies
  await waitFor('http://127.0.0.1:5173/src/main.tsx', 'the client portal');
  await waitFor('http://127.0.0.1:5174/src/main.tsx', 'the shop app');
  await waitFor('http://127.0.0.1:1080/api/healthz', 'maildev');
} catch (err) {
  console.error(String(err));
  await stop(1);
}

console.log(`
Benchwright is running (demo data: Fernhill Joinery, invented).

  client portal   http://127.0.0.1:5173
  shop app        http://127.0.0.1:5174
  API             http://127.0.0.1:3000/api  (health: /api/health)
  mail inbox      http://127.0.0.1:1080/index.html (maildev; SMTP on 127.0.0.1:1025)
  Stripe stand-in http://127.0.0.1:12111     (test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)

Demo sign-ins, all with the password bench-demo-2026:
  maren@fernhill.example   owner (shop app)
  idris@fernhill.example   builder (shop app)
  priya@example.com        client (portal)
  tomasz@example.com       client (portal)
  guild@example.com        client (portal): the Alder Cross Makers' Guild

Press Ctrl-C to stop everything.
READY
`);
