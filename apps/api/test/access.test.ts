import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACCESS, defaultParams, fill, ROLES, type Access, type Role, type RouteAccess } from './access-table';
import { appRoutes, routeKey } from './routes';
import { EMAILS, seededWorld, type World } from './world';

/**
 * The authorisation review kept in the repository (issue 13): every route Express has, as every role, against
 * the table of expected access in access-table.ts.
 */
let w: World;
const cookies = {} as Record<Role, string>;
const emailOf: Record<Exclude<Role, 'anonymous'>, string> = {
  clientA: EMAILS.tomasz,
  clientB: EMAILS.priya,
  builder: EMAILS.builder,
  owner: EMAILS.owner,
};
const sessionFor = (role: Role) => (role === 'anonymous' ? Promise.resolve('') : w.cookie(emailOf[role]));

beforeAll(async () => {
  w = await seededWorld();
  for (const role of ROLES) cookies[role] = await sessionFor(role);
}, 60_000);
afterAll(async () => {
  await w?.close();
});

const classOf = (status: number): Access | number =>
  status === 401 || status === 403 || status === 404 ? status : status >= 500 ? status : 'ok';

async function call(route: RouteAccess, role: Role, cookie: string) {
  const path = fill(route.path, (route.params ?? ((ids) => defaultParams(route.path, ids)))(w.ids));
  let req = request(w.api)[route.method.toLowerCase() as 'get'](path);
  if (cookie) req = req.set('Cookie', cookie);
  if (route.query) req = req.query(route.query);
  if (route.method !== 'GET') req = req.send((route.body?.(w.ids, role) ?? {}) as object);
  // PDFs and other bodies that are not JSON: read as bytes, never parsed
  return req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => {
      const raw = Buffer.concat(chunks);
      const json = /json/.test(String(res.headers['content-type'] ?? ''));
      try {
        cb(null, json ? JSON.parse(raw.toString('utf8')) : raw);
      } catch {
        cb(null, raw);
      }
    });
  });
}

describe('the access table', () => {
  it('names every route the API has, and no route it does not have', () => {
    const actual = appRoutes(w.app as never)
      .map(routeKey)
      .sort();
    const table = ACCESS.map((r) => `${r.method} ${r.path}`).sort();
    expect(new Set(table).size, 'a route is named twice in the table').toBe(table.length);
    expect(
      actual.filter((k) => !table.includes(k)),
      'routes missing from test/access-table.ts',
    ).toEqual([]);
    expect(
      table.filter((k) => !actual.includes(k)),
      'routes in test/access-table.ts that the API does not have',
    ).toEqual([]);
  });
});

for (const role of ROLES) {
  describe(`as ${role}`, () => {
    for (const route of ACCESS) {
      const want = route.expect[role];
      it(`${route.method} ${route.path} answers ${want === 'ok' ? 'through' : want}`, async () => {
        const cookie = route.endsSession ? await sessionFor(role) : cookies[role];
        const r = await call(route, role, cookie);
        expect(
          classOf(r.status),
          `${role} ${route.method} ${route.path}: ${r.status} ${JSON.stringify(r.body).slice(0, 200)}`,
        ).toBe(want);
        if (r.status >= 400) expect(r.body.error?.code, 'the error shape').toEqual(expect.any(String));
      });
    }
  });
}

describe('a malformed session cookie', () => {
  // issue 13, defect 7: a cookie with broken %-encoding is no session, never a 500
  it('counts as no session on every route', async () => {
    const wrong: string[] = [];
    for (const route of ACCESS) {
      const r = await call(route, 'anonymous', 'bw_session=%zz');
      if (classOf(r.status) !== route.expect.anonymous)
        wrong.push(`${route.method} ${route.path}: ${r.status}, want ${route.expect.anonymous}`);
    }
    expect(wrong).toEqual([]);
  });
});

describe('what a builder sees', () => {
  // DESIGN.md section 2 and issue 13, defect 3: builders see no prices or payments
  const moneyKeys = (v: unknown, at = ''): string[] =>
    Array.isArray(v)
      ? v.flatMap((x, i) => moneyKeys(x, `${at}[${i}]`))
      : v && typeof v === 'object'
        ? Object.entries(v).flatMap(([k, x]) => [
            ...(/cents$|price|deposit|refund|payment/i.test(k) ? [`${at}.${k}`] : []),
            ...moneyKeys(x, `${at}.${k}`),
          ])
        : typeof v === 'string' && /\$\s?\d/.test(v)
          ? [`${at}: ${v}`]
          : [];
  for (const route of ACCESS.filter((r) => r.method === 'GET' && r.expect.builder === 'ok')) {
    it(`holds no prices or payments in GET ${route.path}`, async () => {
      const r = await call(route, 'builder', cookies.builder);
      expect(r.status).toBe(200);
      if (Buffer.isBuffer(r.body)) return;
      expect(moneyKeys(r.body)).toEqual([]);
    });
  }
  it('holds no conversation between the client and the owner in GET /api/projects/:id', async () => {
    const owner = cookies.owner;
    const msg = `Private note ${Date.now()}`;
    const c = await request(w.api)
      .post(`/api/projects/${w.ids.tomaszProject}/comments`)
      .set('Cookie', owner)
      .send({ message: msg });
    expect(c.status).toBe(201);
    const r = await request(w.api).get(`/api/projects/${w.ids.tomaszProject}`).set('Cookie', cookies.builder);
    expect(r.status).toBe(200);
    expect(JSON.stringify(r.body)).not.toContain(msg);
  });
  it('may still move the job along the board', async () => {
    const r = await request(w.api)
      .patch(`/api/jobs/${w.ids.tomaszJob}`)
      .set('Cookie', cookies.builder)
      .send({ stageKey: 'drawers_doors' });
    expect(r.status).toBe(200);
    expect(r.body.job.stage).toBe('drawers_doors');
  });
});
