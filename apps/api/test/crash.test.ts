import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { designs } from '@benchwright/pricing';
import { afterAll, expect, it } from 'vitest';
import { freePort } from './helpers';
import { signInCookie, startApi, waitFor, type ChildApi } from './child-api';

/**
 * kill -9 under write load (issue 13): the API in a process of its own on a file database, concurrent writes
 * (requests and comments from a client, estimate edits from the owner), SIGKILL mid-load, a restart, then
 * `PRAGMA integrity_check` and every write that was answered 2xx looked for. Five rounds.
 */
const ROUNDS = 5;
/** writes answered before the kill, each round: enough to be mid-load, few enough for a busy machine */
const ACKED_BEFORE_KILL = 120;
const WRITERS = 6;

const dir = mkdtempSync(join(tmpdir(), 'bw-crash-'));
let api: ChildApi | undefined;
afterAll(async () => {
  await api?.kill();
  rmSync(dir, { recursive: true, force: true });
});

interface Acked {
  projects: string[];
  comments: string[];
  /** the last edit the owner was told was saved: the version it made and the discount it set */
  lastEdit: { version: number; discountCents: number } | null;
}

it(
  'keeps every acknowledged write and a sound database through five kills under write load',
  async () => {
    const dbPath = join(dir, 'crash.db');
    const env = {
      DATABASE_PATH: dbPath,
      UPLOADS_DIR: join(dir, 'uploads'),
      PDF_DIR: join(dir, 'pdf'),
      SEED_DEMO: 'true',
      // nothing listens on these: mail stays queued and the demo payment is skipped
      SMTP_URL: `smtp://127.0.0.1:${await freePort()}`,
      STRIPE_API_BASE: `http://127.0.0.1:${await freePort()}`,
    };
    api = await startApi(env);
    const owner = await signInCookie(api.url, 'maren@fernhill.example');
    const get = async <T>(path: string, cookie: string): Promise<T> => {
      const r = await fetch(`${api!.url}${path}`, { headers: { Cookie: cookie } });
      if (r.status !== 200) throw new Error(`GET ${path}: ${r.status} ${await r.text()}`);
      return (await r.json()) as T;
    };
    type Listed = { projects: { id: string; client: { name: string } }[] };
    const all = (await get<Listed>('/api/projects', owner)).projects;
    const projectOf = (name: string) => all.find((p) => p.client.name.startsWith(name))!.id;
    // the guild's request gets a draft for the owner to edit; Priya's project takes the comments
    const draft = await fetch(`${api.url}/api/projects/${projectOf('Alder Cross')}/estimates`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: owner },
      body: '{}',
    });
    expect(draft.status, await draft.clone().text()).toBe(201);
    const estimateId = ((await draft.json()) as { estimate: { id: string } }).estimate.id;
    const priyaProject = projectOf('Priya');

    const acked: Acked = { projects: [], comments: [], lastEdit: null };
    const figures: string[] = [];
    let totalAcked = 0;
    let totalPresent = 0;

    for (let round = 1; round <= ROUNDS; round++) {
      const client = await signInCookie(api.url, 'priya@example.com');
      const ownerNow = await signInCookie(api.url, 'maren@fernhill.example');
      const url = api.url;
      let count = 0;
      let stop = false;
      const post = (path: string, cookie: string, body: unknown, method = 'POST') =>
        fetch(`${url}${path}`, {
          method,
          headers: { 'Content-Type': 'application/json', Cookie: cookie },
          body: JSON.stringify(body),
        });
      const writer = async (w: number) => {
        for (let i = 0; !stop; i++) {
          try {
            if (i % 2 === 0) {
              const r = await post('/api/projects', client, {
                items: [{ spec: { ...designs.bookcase.defaults }, quantity: 1 }],
                notes: `round ${round} writer ${w} request ${i}`,
              });
              if (r.status === 201) {
                acked.projects.push(((await r.json()) as { project: { id: string } }).project.id);
                count++;
              }
            } else {
              const message = `r${round}-w${w}-c${i}-${Math.random().toString(36).slice(2)}`;
              const r = await post(`/api/projects/${priyaProject}/comments`, client, { message });
              if (r.status === 201) {
                acked.comments.push(message);
                count++;
              }
            }
          } catch {
            return; // the API has gone
          }
        }
      };
      const editor = async () => {
        let version = acked.lastEdit?.version ?? 1;
        for (let i = 0; !stop; i++) {
          try {
            const discountCents = 100 + ((round * 7919 + i) % 5000);
            const r = await post(`/api/estimates/${estimateId}`, ownerNow, { version, discountCents }, 'PATCH');
            if (r.status === 200) {
              version = ((await r.json()) as { estimate: { version: number } }).estimate.version;
              acked.lastEdit = { version, discountCents };
              count++;
            } else if (r.status === 409) {
              const g = await fetch(`${url}/api/estimates/${estimateId}`, { headers: { Cookie: ownerNow } });
              version = ((await g.json()) as { estimate: { version: number } }).estimate.version;
            }
          } catch {
            return;
          }
        }
      };
      const load = Promise.all([...Array.from({ length: WRITERS }, (_, w) => writer(w)), editor()]);
      await waitFor(`${ACKED_BEFORE_KILL} acknowledged writes`, 120_000, () =>
        count >= ACKED_BEFORE_KILL ? true : undefined,
      );
      await api.kill();
      stop = true;
      await load;

      // restarted as an operator would after a crash; the demo is there already
      api = await startApi({ ...env, SEED_DEMO: 'false' });
      const db = new Database(dbPath, { readonly: true });
      try {
        expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
        // what was acknowledged, looked for through the API as its users would
        const ownerAfter = await signInCookie(api.url, 'maren@fernhill.example');
        // every page of the list (it is paged: 200 at most a page)
        const projectIds = new Set<string>();
        for (let cursor: string | null = ''; cursor !== null; ) {
          const page: Listed & { nextCursor: string | null } = await get(
            `/api/projects?limit=200${cursor ? `&cursor=${cursor}` : ''}`,
            ownerAfter,
          );
          for (const p of page.projects) projectIds.add(p.id);
          cursor = page.nextCursor;
        }
        type One = { project: { timeline: { kind: string; message: string }[] } };
        const messages = new Set(
          (await get<One>(`/api/projects/${priyaProject}`, ownerAfter)).project.timeline.map((e) => e.message),
        );
        type Est = { estimate: { version: number; totals: { discountCents: number } } };
        const e = (await get<Est>(`/api/estimates/${estimateId}`, ownerAfter)).estimate;
        const est = { version: e.version, d: e.totals.discountCents };
        const missing = [
          ...acked.projects.filter((id) => !projectIds.has(id)).map((id) => `project ${id}`),
          ...acked.comments.filter((m) => !messages.has(m)).map((m) => `comment ${m}`),
        ];
        if (acked.lastEdit && !(est.version > acked.lastEdit.version || est.d === acked.lastEdit.discountCents))
          missing.push(`the estimate edit to version ${acked.lastEdit.version}`);
        totalAcked += count;
        totalPresent += count - missing.length;
        figures.push(
          `round ${round}: ${count} acknowledged, ${count - missing.length} present (all ${acked.projects.length} requests and ${acked.comments.length} comments so far looked for, and the last estimate edit); integrity_check ok`,
        );
        expect(missing).toEqual([]);
      } finally {
        db.close();
      }
    }
    console.log(
      `kill -9 under write load: ${totalAcked} writes acknowledged over ${ROUNDS} rounds, ${totalPresent} present\n${figures.join('\n')}`,
    );
    expect(totalPresent).toBe(totalAcked);
  },
  15 * 60_000,
);
