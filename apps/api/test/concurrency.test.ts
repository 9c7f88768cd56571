import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { testApp, type TestApp } from './helpers';

/**
 * Concurrent edits (issue 13): two owner sessions save the same draft version at the same moment, 50 rounds.
 * Each round exactly one save wins and the other is told 409; the draft then holds the winner's change and
 * nothing else (no lost update).
 */
const ROUNDS = 50;
let t: TestApp;
let base: string;
const server = createServer();

beforeAll(async () => {
  t = await testApp();
  server.on('request', t.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}, 60_000);
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
});

it(`lets exactly one of two simultaneous saves of the same version win, ${ROUNDS} rounds, with no lost update`, async () => {
  const signIn = async () => {
    const a = request.agent(base);
    expect(
      (await a.post('/api/auth/sign-in').send({ email: 'maren@fernhill.example', password: 'bench-demo-2026' })).status,
    ).toBe(200);
    return a;
  };
  const one = await signIn();
  const two = await signIn();
  const priya = await t.signIn('priya@example.com');
  const projectId = (await priya.get('/api/projects')).body.projects[0].id as string;
  const created = await one.post(`/api/projects/${projectId}/estimates`).send({});
  expect(created.status).toBe(201);
  const id = created.body.estimate.id as string;
  let version = created.body.estimate.version as number;
  const firstLine = created.body.estimate.lines[0];

  const outcomes: string[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    // different changes from each session: a discount and a line's description
    const edits = [
      { version, discountCents: 1000 + round },
      {
        version,
        discountCents: 5000 + round,
        lines: created.body.estimate.lines.map((l: Record<string, unknown>, i: number) => ({
          ...(i === 0 ? { ...l, description: `${String(firstLine.description)} (round ${round})` } : l),
        })),
      },
    ];
    const [a, b] = await Promise.all([
      one.patch(`/api/estimates/${id}`).send(edits[0]),
      two.patch(`/api/estimates/${id}`).send(edits[1]),
    ]);
    const statuses = [a.status, b.status].sort();
    outcomes.push(statuses.join('/'));
    expect(statuses, `round ${round}: ${JSON.stringify([a.body, b.body]).slice(0, 400)}`).toEqual([200, 409]);
    const winner = a.status === 200 ? 0 : 1;
    const loser = a.status === 200 ? b : a;
    expect(loser.body.error.code).toBe('conflict');
    const now = (await one.get(`/api/estimates/${id}`)).body.estimate;
    expect(now.version).toBe(version + 1);
    expect(now.totals.discountCents).toBe(edits[winner]!.discountCents);
    expect(now.lines[0].description.endsWith(`(round ${round})`)).toBe(winner === 1);
    version = now.version;
  }
  expect(outcomes.filter((o) => o === '200/409')).toHaveLength(ROUNDS);
});
