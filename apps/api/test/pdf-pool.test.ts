import { afterEach, describe, expect, it } from 'vitest';
import { createPdfPool, type PdfPool } from '../src/lib/pdf-pool';
import type { LabelsPdfInput } from '../src/lib/pdf/labels-pdf';

/** A job of `parts` parts of 4 units each: 4 x parts labels. */
function labels(parts: number): LabelsPdfInput {
  return {
    shopName: 'Test shop',
    clientName: 'Test client',
    jobUrl: 'http://127.0.0.1/jobs/j1',
    units: 'in',
    traveller: {
      pieces: [
        {
          title: 'Bookcase',
          quantity: 1,
          parts: Array.from({ length: parts }, (_, i) => ({
            name: `Part ${i + 1}`,
            materialName: 'Birch plywood',
            stock: 'sheet' as const,
            quantity: 4,
            lengthMm: 700,
            widthMm: 300,
            thicknessMm: 18.26,
            grain: 'length',
            banding: '1 long',
            machining: [],
          })),
        },
      ],
    },
  };
}

let pools: PdfPool[] = [];
const pool = (maxQueue: number, timeoutMs: number) => {
  const p = createPdfPool({ maxQueue, timeoutMs });
  pools.push(p);
  return p;
};
afterEach(async () => {
  await Promise.all(pools.map((p) => p.close()));
  pools = [];
});

describe('the PDF worker', () => {
  it('renders documents on a worker thread, never on the request thread', async () => {
    const p = pool(4, 60_000);
    expect(await p.warm()).toBeGreaterThan(0);
    const pdf = await p.render({ kind: 'labels', input: labels(10) });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
  });
  it('stops a document past its time limit with 503, and the next one still renders', async () => {
    const p = pool(4, 60_000);
    await p.warm(); // the bundle and the thread are up: the limit below measures the drawing alone
    const slow = createPdfPool({ maxQueue: 4, timeoutMs: 1 });
    pools.push(slow);
    await slow.warm().catch(() => undefined);
    await expect(slow.render({ kind: 'labels', input: labels(2000) })).rejects.toMatchObject({
      status: 503,
      code: 'unavailable',
    });
    expect((await p.render({ kind: 'labels', input: labels(3) })).subarray(0, 5).toString()).toBe('%PDF-');
  });
  it('answers 503 busy when more documents wait than the queue holds', async () => {
    const p = pool(1, 60_000);
    const runs = Array.from({ length: 4 }, () => p.render({ kind: 'labels', input: labels(5) }));
    const settled = await Promise.allSettled(runs);
    const busy = settled.filter((s) => s.status === 'rejected' && (s.reason as { code?: string }).code === 'busy');
    expect(busy.length).toBe(2); // one drawing, one waiting, two refused
    // in words for the owner or the client who asked for a PDF, not the engine's
    for (const b of busy) {
      const message = ((b as PromiseRejectedResult).reason as Error).message;
      expect(message).toMatch(/PDFs are being made/);
      expect(message).not.toMatch(/engine/i);
    }
    expect(settled.filter((s) => s.status === 'fulfilled').length).toBe(2);
  });
  it('counts a document’s time limit from when the thread picks it up, not while it waits behind others', async () => {
    const doc = () => ({ kind: 'labels' as const, input: labels(5) });
    const p = pool(4, 60_000);
    await p.warm();
    let t0 = performance.now();
    await p.render(doc()); // a thread's first drawing also loads the fonts
    const first = performance.now() - t0;
    let took = 0;
    for (let i = 0; i < 2; i++) {
      t0 = performance.now();
      await p.render(doc());
      took = Math.max(took, performance.now() - t0);
    }
    // each document alone (the first one on the thread too) is well inside its limit; so many wait that, were the
    // limit counted from the queue, the last would wait twice the limit
    const limit = Math.ceil(3 * Math.max(took, first));
    const n = Math.min(200, Math.ceil((2 * limit) / took) + 1);
    const limited = pool(n, limit);
    await limited.warm();
    const settled = await Promise.allSettled(Array.from({ length: n }, () => limited.render(doc())));
    expect(settled.map((s) => (s.status === 'fulfilled' ? 'drawn' : (s.reason as { code?: string }).code))).toEqual(
      Array(n).fill('drawn'),
    );
  }, 240_000);
});
