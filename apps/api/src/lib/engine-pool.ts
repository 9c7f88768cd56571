import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { Busy, Conflict, TooComplex } from './errors';
import type { EngineResult, EngineTask } from './engine-task';

export interface EnginePoolOptions {
  /** worker threads; default cores - 1 (at least 1), so the request thread keeps a core */
  threads?: number;
  /** tasks that may wait for a thread; one more answers 503 busy */
  maxQueue: number;
  /** time limits per task, from the moment a worker starts it */
  quickMs: number;
  thoroughMs: number;
}

export interface EnginePool {
  /** Runs a task on a worker: Busy (503) when the queue is full, TooComplex (422) when it runs past its limit. */
  run<T extends EngineTask>(task: T): Promise<EngineResult<T>>;
  /** Resolves once a worker is up (the API calls it at start-up so the first request does not wait). */
  warm(): Promise<void>;
  stats(): { threads: number; queued: number; running: number; completed: number; stopped: number };
  close(): Promise<void>;
}

const QUEUE_FULL = 'Task queue is at limit';

let bundled: Promise<string> | undefined;
/**
 * The worker's code (engine-task.ts and the engine under it) as one plain ES
 * module, bundled once per process with esbuild into a temporary folder. A
 * worker thread does not inherit the TypeScript loader of tsx (development)
 * or vitest (tests); loading the sources through tsx's API in each worker
 * took 3 to 8 s on a busy machine, which every worker stopped at its time
 * limit would pay again. The bundle loads in well under a second, and it is
 * the same in development, tests and production. esbuild runs in its own
 * process, so bundling does not hold the request thread.
 */
function workerFile(): Promise<string> {
  bundled ??= (async () => {
    const { build } = await import('esbuild');
    const dir = mkdtempSync(join(tmpdir(), 'benchwright-engine-'));
    process.once('exit', () => rmSync(dir, { recursive: true, force: true }));
    const outfile = join(dir, 'engine-worker.mjs');
    await build({
      entryPoints: [fileURLToPath(new URL('./engine-task.ts', import.meta.url))],
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      outfile,
      logLevel: 'silent',
    });
    return outfile;
  })();
  return bundled;
}

/**
 * The engine off the request thread (piscina). Previews run at 'quick' with
 * the short limit, pricing and layouts at 'thorough' with the long one. A
 * task past its limit is aborted: piscina terminates its worker (the only
 * way to stop synchronous work) and starts a fresh one.
 */
export function createEnginePool(opts: EnginePoolOptions): EnginePool {
  const threads = Math.max(1, opts.threads ?? availableParallelism() - 1);
  let piscina: Piscina | undefined;
  let closed = false;
  let started: Promise<Piscina> | undefined;
  // started on first use, so an app that never prices (most tests) never bundles
  const start = () =>
    (started ??= workerFile().then((filename) => {
      piscina = new Piscina({
        filename,
        minThreads: 1,
        maxThreads: threads,
        maxQueue: opts.maxQueue,
        idleTimeout: 60_000,
      });
      if (closed) void piscina.destroy();
      return piscina;
    }));
  let running = 0;
  let outstanding = 0;
  let stopped = 0;
  const retryAfter = Math.max(1, Math.ceil(opts.quickMs / 1000));

  async function run<T extends EngineTask>(task: T): Promise<EngineResult<T>> {
    // the bound is kept here: piscina 5.3's maxQueue counts only part of what waits (tasks it could not hand
    // to a busy worker sit in another list it does not count), so it let 4 tasks wait with maxQueue 1
    if (outstanding >= threads + opts.maxQueue) throw new Busy(retryAfter);
    outstanding++;
    try {
      return await runOnPool(task);
    } finally {
      outstanding--;
    }
  }

  async function runOnPool<T extends EngineTask>(task: T): Promise<EngineResult<T>> {
    const pool = piscina ?? (await start());
    const limitMs = task.kind === 'preview' ? opts.quickMs : opts.thoroughMs;
    const abort = new AbortController();
    const { port1, port2 } = new MessageChannel();
    let timer: NodeJS.Timeout | undefined;
    port1.once('message', () => {
      running++;
      timer = setTimeout(() => abort.abort(new Error('time limit')), limitMs);
    });
    try {
      return (await pool.run(
        { task, started: port2 },
        { transferList: [port2], signal: abort.signal },
      )) as EngineResult<T>;
    } catch (err) {
      if (abort.signal.aborted) {
        stopped++;
        throw new TooComplex();
      }
      if (err instanceof Error && err.message === QUEUE_FULL) throw new Busy(retryAfter);
      // the engine's RangeError: the price book cannot take these items (a part larger than any sheet in stock)
      if (err instanceof Error && err.name === 'RangeError')
        throw new Conflict(`The shop’s stock cannot take these items as they are: ${err.message}.`);
      throw err;
    } finally {
      if (timer) {
        clearTimeout(timer);
        running--;
      }
      port1.close();
    }
  }

  return {
    run,
    async warm() {
      await run({ kind: 'ping' });
    },
    stats: () => ({
      threads,
      queued: outstanding - running,
      running,
      completed: piscina?.completed ?? 0,
      stopped,
    }),
    async close() {
      closed = true;
      await piscina?.destroy();
    },
  };
}
