import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { freePort } from './helpers';

const API_DIR = fileURLToPath(new URL('..', import.meta.url));

export interface ChildApi {
  url: string;
  port: number;
  proc: ChildProcess;
  /** the process's output so far, for the failure message */
  output: () => string;
  /** SIGKILL, resolved once the process has gone */
  kill: () => Promise<void>;
  /** SIGTERM (a clean shutdown), resolved once the process has gone */
  stop: () => Promise<void>;
}

/** Polls `check` until it gives a value, or throws after `ms` with `what`. */
export async function waitFor<T>(what: string, ms: number, check: () => Promise<T | undefined> | T | undefined) {
  const deadline = Date.now() + ms;
  for (;;) {
    const v = await check();
    if (v !== undefined) return v;
    if (Date.now() > deadline) throw new Error(`timed out after ${ms} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * The API as `pnpm start` runs it (src/index.ts: migrations, seed, mail worker), in a process of its own with
 * the given environment, on a free port of the loopback. One node process (tsx as an import hook, not its CLI,
 * which would put a second process between the signal and the API). Resolves once /api/health answers 200.
 */
export async function startApi(env: Record<string, string>, readyWithinMs = 120_000): Promise<ChildApi> {
  const port = await freePort();
  const proc = spawn(process.execPath, ['--import', 'tsx', 'src/index.ts'], {
    cwd: API_DIR,
    env: {
      PATH: process.env.PATH ?? '',
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      LOG_LEVEL: 'warn',
      RATE_LIMITS: 'false',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  const keep = (b: Buffer) => {
    out = (out + b.toString('utf8')).slice(-20_000);
  };
  proc.stdout!.on('data', keep);
  proc.stderr!.on('data', keep);
  const gone = new Promise<void>((r) => proc.once('exit', () => r()));
  const url = `http://127.0.0.1:${port}`;
  const end = async (signal: NodeJS.Signals) => {
    if (proc.exitCode === null && proc.signalCode === null) proc.kill(signal);
    await gone;
  };
  try {
    await waitFor(`the API on ${url} to be ready`, readyWithinMs, async () => {
      if (proc.exitCode !== null) throw new Error(`the API exited with ${proc.exitCode}:\n${out}`);
      const r = await fetch(`${url}/api/health`).catch(() => null);
      return r?.status === 200 ? true : undefined;
    });
  } catch (err) {
    await end('SIGKILL');
    throw err;
  }
  return { url, port, proc, output: () => out, kill: () => end('SIGKILL'), stop: () => end('SIGTERM') };
}

/** Signs in over HTTP and gives the Cookie header of the new session. */
export async function signInCookie(url: string, email: string, password = 'bench-demo-2026'): Promise<string> {
  const r = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (r.status !== 200) throw new Error(`sign-in of ${email}: ${r.status} ${await r.text()}`);
  return r.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}
