import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { Busy, Unavailable } from './errors';
import type { PdfTask } from './pdf/pdf-task';

export type { PdfTask };

export interface PdfPool {
  /** Renders a PDF on the worker thread: Busy (503) when too many wait, Unavailable (503) past the time limit. */
  render(task: Exclude<PdfTask, { kind: 'ping' }>): Promise<Buffer>;
  /** Resolves once the worker is up, with its thread id (never 0, the request thread's). */
  warm(): Promise<number>;
  close(): Promise<void>;
}

export interface PdfPoolOptions {
  /** documents that may wait for the thread; one more answers 503 busy */
  maxQueue: number;
  /** time limit per document */
  timeoutMs: number;
}

/** one thread draws; more would take CPU from the requests and the engine on a small machine */
const THREADS = 1;
/** what the owner or the client reads when too many documents wait (503 busy) */
const BUSY = 'Other PDFs are being made right now. Try again in a few seconds.';

let bundled: Promise<string> | undefined;
/**
 * The worker's code (pdf-task.ts and the documents under it) as one ES module,
 * bundled once per process with esbuild (a worker thread does not inherit the
 * TypeScript loader; see engine-pool.ts). React, react-pdf, the fonts and the
 * QR encoder stay outside the bundle and are loaded from the API's own
 * node_modules, so the bundle is written under it (in `.cache/`): the fonts are
 * found by package name from there.
 */
function workerFile(): Promise<string> {
  bundled ??= (async () => {
    const { build } = await import('esbuild');
    const apiRoot = fileURLToPath(new URL('../../', import.meta.url));
    const cache = join(apiRoot, 'node_modules', '.cache');
    mkdirSync(cache, { recursive: true });
    const dir = mkdtempSync(join(cache, 'benchwright-pdf-'));
    process.once('exit', () => rmSync(dir, { recursive: true, force: true }));
    const outfile = join(dir, 'pdf-worker.mjs');
    await build({
      entryPoints: [fileURLToPath(new URL('./pdf/pdf-task.ts', import.meta.url))],
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      jsx: 'automatic',
      external: ['react', 'react/*', '@react-pdf/*', '@fontsource/*', 'qrcode'],
      outfile,
      logLevel: 'silent',
    });
    return outfile;
  })();
  return bundled;
}

/**
 * PDFs off the request thread (piscina, one worker): rendering an estimate or a
 * traveller of a large job takes a second or more of CPU, which would hold every
 * other request. A document past its time limit is aborted (its worker is
 * replaced) and the caller gets 503 with a plain message.
 */
export function createPdfPool(opts: PdfPoolOptions): PdfPool {
  let piscina: Piscina | undefined;
  let started: Promise<Piscina> | undefined;
  let closed = false;
  let outstanding = 0;
  const start = () =>
    (started ??= workerFile().then((filename) => {
      piscina = new Piscina({ filename, minThreads: THREADS, maxThreads: THREADS, idleTimeout: 60_000 });
      if (closed) void piscina.destroy();
      return piscina;
    }));

  // Our own queue in front of the thread: a document is handed to piscina only when a thread is free, so its time
  // limit counts from when the thread picks it up, never the time it waited behind others.
  let drawing = 0;
  const waiting: (() => void)[] = [];
  const turn = () => (drawing < THREADS ? (drawing++, Promise.resolve()) : new Promise<void>((ok) => waiting.push(ok)));
  // the next waiting document takes the freed thread over (`drawing` stays counted for it)
  const done = () => {
    const next = waiting.shift();
    if (next) next();
    else drawing--;
  };

  async function run(task: PdfTask): Promise<Uint8Array> {
    if (outstanding >= THREADS + opts.maxQueue) throw new Busy(5, BUSY);
    outstanding++;
    try {
      const pool = piscina ?? (await start());
      await turn();
      const abort = new AbortController();
      const timer = setTimeout(() => abort.abort(new Error('time limit')), opts.timeoutMs);
      try {
        return (await pool.run(task, { signal: abort.signal })) as Uint8Array;
      } catch (err) {
        if (abort.signal.aborted) throw new Unavailable('The document took too long to draw. Try again in a minute.');
        throw err;
      } finally {
        clearTimeout(timer);
        done();
      }
    } finally {
      outstanding--;
    }
  }

  return {
    async render(task) {
      const bytes = await run(task);
      return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    },
    async warm() {
      return (await run({ kind: 'ping' }))[0] ?? 0;
    },
    async close() {
      closed = true;
      await piscina?.destroy();
    },
  };
}
