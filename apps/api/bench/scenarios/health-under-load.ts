import { designs } from '@benchwright/pricing';
import { defineScenario } from '../scenario';

const PRICINGS = 4;
/** three base cabinets, two wall cabinets, a bookcase and the default bench */
const mixedJob = [
  { spec: designs['base-cabinet'].defaults, quantity: 3 },
  { spec: designs['wall-cabinet'].defaults, quantity: 2 },
  { spec: designs.bookcase.defaults, quantity: 1 },
  { spec: designs['assembly-bench'].defaults, quantity: 1 },
];

/**
 * The price-once issue's figure: how fast GET /api/health and GET /api/auth/me answer while 4 thorough pricings
 * of the mixed job run (each loop: the client requests the job, the owner prices it, again until stopped), with
 * the same two measured idle first as a baseline. Two connections: the latency one person sees, not the queue of
 * a flood. Target p99 <= 50 ms under load.
 */
export default defineScenario({
  description: `GET /api/health and /api/auth/me idle, then while ${PRICINGS} thorough pricings of the mixed job run; 2 connections`,
  connections: 2,
  durationSeconds: 10,
  target: { p99Ms: 50 },
  async setup({ signIn, postJson }) {
    const owner = await signIn('maren@fernhill.example');
    const client = await signIn('priya@example.com');
    let stop = false;
    let started = 0;
    const pricings: { status: number; ms: number }[] = [];
    const loop = async () => {
      let first = true;
      while (!stop) {
        const p = await postJson<{ project?: { id: string } }>(
          '/api/projects',
          { items: mixedJob, notes: 'bench' },
          client,
        );
        if (p.status !== 201 || !p.body.project) throw new Error(`request: ${p.status} ${JSON.stringify(p.body)}`);
        const t0 = performance.now();
        const priced = postJson(`/api/projects/${p.body.project.id}/estimates`, { source: 'engine' }, owner);
        if (first) started++;
        first = false;
        const e = await priced;
        pricings.push({ status: e.status, ms: performance.now() - t0 });
      }
    };
    let loops: Promise<void>[] = [];
    const me = [{ method: 'GET' as const, path: '/api/auth/me', headers: { cookie: owner } }];
    const health = [{ method: 'GET' as const, path: '/api/health' }];
    return {
      unjudged: ['idle /api/health', 'idle /api/auth/me'],
      parts: [
        { label: 'idle /api/health', requests: health },
        { label: 'idle /api/auth/me', requests: me },
        {
          label: 'loaded /api/health',
          requests: health,
          async before() {
            loops = Array.from({ length: PRICINGS }, () => loop());
            // every loop has asked for its first pricing, and the first has had a moment to reach a worker
            while (started < PRICINGS) await new Promise((r) => setTimeout(r, 20));
            await new Promise((r) => setTimeout(r, 200));
          },
        },
        { label: 'loaded /api/auth/me', requests: me },
      ],
      async after() {
        stop = true;
        await Promise.all(loops);
        const ms = pricings.map((p) => p.ms).sort((a, b) => a - b);
        return [
          `pricings of the mixed job while measuring: ${pricings.length} (${pricings.filter((p) => p.status === 201).length} priced, ${pricings.filter((p) => p.status === 422).length} too complex, ${pricings.filter((p) => p.status === 503).length} busy); median ${Math.round(ms[Math.floor(ms.length / 2)] ?? 0)} ms to answer, with ${PRICINGS} at once`,
        ];
      },
    };
  },
});
