import { designs } from '@benchwright/pricing';
import type { WorldIds } from './world';

/**
 * Who may call what: the expected answer to each role for every route the API has (DESIGN.md sections 2 and 10,
 * and issue 13's fixes). `ok` means the role gets through (any answer but 401, 403 or 404: a 400 or 409 about
 * the request itself still counts as access); 401 not signed in, 403 wrong role, 404 not theirs to see.
 * The resource under test is client A's: Tomasz's project, his accepted estimate, his deposit and his job.
 * Client B is Priya, another client of the shop. test/access.test.ts checks this table against the routes
 * Express actually has, in both directions.
 */
export const ROLES = ['anonymous', 'clientA', 'clientB', 'builder', 'owner'] as const;
export type Role = (typeof ROLES)[number];
export type Access = 'ok' | 401 | 403 | 404;

export interface RouteAccess {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  path: string;
  expect: Record<Role, Access>;
  /** values for the path's parameters; by default the resource of client A that the path names */
  params?: (ids: WorldIds) => Record<string, string>;
  /** a body that would be accepted, so that a 400 cannot hide the answer on access */
  body?: (ids: WorldIds, role: Role) => unknown;
  /** a query string that would be accepted */
  query?: Record<string, string>;
  /** the request ends the session it is made with, so it gets a session of its own */
  endsSession?: boolean;
}

/** `a(anonymous, clientA, clientB, builder, owner)` */
const a = (anonymous: Access, clientA: Access, clientB: Access, builder: Access, owner: Access) => ({
  anonymous,
  clientA,
  clientB,
  builder,
  owner,
});
const anyone = a('ok', 'ok', 'ok', 'ok', 'ok');
const signedIn = a(401, 'ok', 'ok', 'ok', 'ok');
const ownerOnly = a(401, 403, 403, 403, 'ok');
const shopStaff = a(401, 403, 403, 'ok', 'ok');
/** the project's client; another client gets 404, the shop 403 */
const ownClient = a(401, 'ok', 404, 403, 403);

const unique = (role: Role) => `${role.toLowerCase()}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
const item = () => ({ spec: { ...designs.bookcase.defaults }, quantity: 1 });

export const ACCESS: RouteAccess[] = [
  { method: 'GET', path: '/api/health', expect: anyone },
  { method: 'POST', path: '/api/webhooks/stripe', expect: anyone, body: () => ({ id: 'evt_x', type: 'ping' }) },

  // accounts
  {
    method: 'POST',
    path: '/api/auth/sign-up',
    expect: anyone,
    body: (_ids, role) => ({ email: `${unique(role)}@example.com`, password: 'a-long-password-1', name: 'Ash Brook' }),
  },
  {
    method: 'POST',
    path: '/api/auth/sign-in',
    expect: anyone,
    // the guild's account: none of the roles under test, so their sessions stay as they are
    body: () => ({ email: 'guild@example.com', password: 'bench-demo-2026' }),
  },
  { method: 'POST', path: '/api/auth/sign-out', expect: signedIn, endsSession: true },
  { method: 'GET', path: '/api/auth/me', expect: signedIn },
  { method: 'POST', path: '/api/auth/verify-email', expect: anyone, body: () => ({ token: 'a'.repeat(43) }) },
  { method: 'POST', path: '/api/auth/resend-verification', expect: signedIn },
  { method: 'POST', path: '/api/auth/forgot-password', expect: anyone, body: () => ({ email: 'nobody@example.com' }) },
  {
    method: 'POST',
    path: '/api/auth/reset-password',
    expect: anyone,
    body: () => ({ token: 'a'.repeat(43), password: 'a-long-password-1' }),
  },
  {
    method: 'POST',
    path: '/api/auth/accept-invitation',
    expect: anyone,
    body: () => ({ token: 'a'.repeat(43), password: 'a-long-password-1' }),
  },
  {
    method: 'POST',
    path: '/api/auth/confirm-email-change',
    expect: anyone,
    body: () => ({ token: 'a'.repeat(43) }),
  },
  // the account page: each signed-in person's own (empty bodies: a 400 is access, and nothing changes)
  { method: 'GET', path: '/api/account', expect: signedIn },
  { method: 'PATCH', path: '/api/account', expect: signedIn },
  { method: 'POST', path: '/api/account/email', expect: signedIn },
  { method: 'POST', path: '/api/account/password', expect: signedIn },
  { method: 'GET', path: '/api/account/sessions', expect: signedIn },
  // ends the role's other sessions; the one the table walks with stays
  { method: 'POST', path: '/api/account/sessions/end-others', expect: signedIn },
  // a session that is not the caller's (here nobody's) is 404 to everyone signed in
  {
    method: 'DELETE',
    path: '/api/account/sessions/:id',
    expect: a(401, 404, 404, 404, 404),
    params: () => ({ id: 'f'.repeat(32) }),
  },
  { method: 'GET', path: '/api/users', expect: ownerOnly },
  {
    method: 'POST',
    path: '/api/users/invitations',
    expect: ownerOnly,
    body: (_ids, role) => ({ email: `${unique(role)}@fernhill.example`, name: 'Wren Dale' }),
  },

  // the catalogue and the preview: open to all
  { method: 'GET', path: '/api/designs', expect: anyone },
  { method: 'GET', path: '/api/designs/:slug', expect: anyone, params: () => ({ slug: 'bookcase' }) },
  { method: 'POST', path: '/api/quotes/preview', expect: anyone, body: () => ({ items: [item()] }) },

  // projects
  { method: 'GET', path: '/api/projects', expect: signedIn },
  // the owner may start one for a client (`clientId`); without it, the owner's answer is a 400 about the body
  {
    method: 'POST',
    path: '/api/projects',
    expect: a(401, 'ok', 'ok', 403, 'ok'),
    body: () => ({ items: [item()], notes: 'A bookcase for the hall.' }),
  },
  // the builder sees a project in production (Tomasz's is, with its job in Casework)
  { method: 'GET', path: '/api/projects/:id', expect: a(401, 'ok', 404, 'ok', 'ok') },
  { method: 'GET', path: '/api/projects/:id/layouts', expect: ownerOnly },
  {
    method: 'POST',
    path: '/api/projects/:id/comments',
    expect: a(401, 'ok', 404, 403, 'ok'),
    body: () => ({ message: 'Could the top be a little thicker?' }),
  },
  { method: 'POST', path: '/api/projects/:id/estimates', expect: ownerOnly, body: () => ({}) },
  { method: 'POST', path: '/api/projects/:id/balance-checkout', expect: ownClient },
  // files: whoever may see the project attaches and reads; the uploader or the owner removes
  { method: 'POST', path: '/api/projects/:id/uploads', expect: a(401, 'ok', 404, 'ok', 'ok') },
  { method: 'GET', path: '/api/uploads/:id', expect: a(401, 'ok', 404, 'ok', 'ok') },
  { method: 'GET', path: '/api/uploads/:id/thumbnail', expect: a(401, 'ok', 404, 'ok', 'ok') },
  // the owner's sketch: the client and the builder see it but did not attach it (403); the owner, walked last, removes it
  {
    method: 'DELETE',
    path: '/api/uploads/:id',
    expect: a(401, 403, 404, 403, 'ok'),
    params: (ids) => ({ id: ids.ownerUpload }),
  },
  // an hour count and a week are not prices
  { method: 'GET', path: '/api/lead-time', expect: anyone, query: { hours: '35' } },

  // estimates: the owner's to edit and send, the client's (own, once sent) to read, accept and pay
  { method: 'GET', path: '/api/estimates/:id', expect: a(401, 'ok', 404, 403, 'ok') },
  { method: 'GET', path: '/api/estimates/:id/pdf', expect: a(401, 'ok', 404, 403, 'ok') },
  { method: 'PATCH', path: '/api/estimates/:id', expect: ownerOnly, body: () => ({ version: 1 }) },
  { method: 'POST', path: '/api/estimates/:id/send', expect: ownerOnly },
  {
    method: 'POST',
    path: '/api/estimates/:id/accept',
    expect: ownClient,
    body: () => ({ acceptedName: 'Tomasz Wierzbicki' }),
  },
  { method: 'POST', path: '/api/estimates/:id/deposit-checkout', expect: ownClient },
  // the deposit is paid, so the owner's withdrawal is refused with 409: access, and the world stays as it is
  {
    method: 'POST',
    path: '/api/estimates/:id/withdraw',
    expect: ownerOnly,
    body: () => ({ reason: 'The client asked for a different finish.' }),
  },
  // the client's return from Checkout: their own session (already recorded, so nothing changes)
  {
    method: 'POST',
    path: '/api/payments/confirm',
    expect: a(401, 'ok', 404, 403, 403),
    body: (ids) => ({ sessionId: ids.tomaszSession }),
  },
  { method: 'POST', path: '/api/jobs/:id/relayout', expect: ownerOnly },

  // money: the owner's alone
  { method: 'GET', path: '/api/payments', expect: ownerOnly },
  { method: 'POST', path: '/api/payments/:id/refund', expect: ownerOnly, body: () => ({ amountCents: 1 }) },

  // the board: the shop's; the owner alone assigns the builder and the due date (issue 13, defect 4)
  { method: 'GET', path: '/api/jobs', expect: shopStaff },
  { method: 'GET', path: '/api/jobs/stages', expect: shopStaff },
  { method: 'GET', path: '/api/jobs/:id', expect: shopStaff },
  { method: 'GET', path: '/api/jobs/:id/traveller', expect: shopStaff },
  { method: 'GET', path: '/api/jobs/:id/traveller.pdf', expect: shopStaff },
  { method: 'GET', path: '/api/jobs/:id/labels.pdf', expect: shopStaff },
  {
    method: 'PUT',
    path: '/api/jobs/:id/checks/:key',
    expect: shopStaff,
    params: (ids) => ({ id: ids.tomaszJob, key: 'cutting.parts' }),
    body: () => ({ done: true }),
  },
  {
    method: 'PATCH',
    path: '/api/jobs/:id',
    expect: a(401, 403, 403, 403, 'ok'),
    body: (ids) => ({ builderId: ids.builderId, dueDate: '2027-03-01' }),
  },
  {
    method: 'POST',
    path: '/api/jobs/:id/time',
    expect: shopStaff,
    body: () => ({ stageKey: 'casework', hours: 1.5, note: 'carcass glued up' }),
  },

  // the owner's pages
  { method: 'GET', path: '/api/mail/failed', expect: ownerOnly },
  { method: 'POST', path: '/api/mail/:id/retry', expect: ownerOnly },
  { method: 'GET', path: '/api/overview', expect: ownerOnly },
  { method: 'GET', path: '/api/hours-feedback', expect: ownerOnly },
  {
    method: 'POST',
    path: '/api/hours-feedback/:stage/dismiss',
    expect: ownerOnly,
    params: () => ({ stage: 'casework' }),
  },
  {
    // the demo has no suggestion standing, so the owner's answer is a 409 about the request: access all the same
    method: 'POST',
    path: '/api/hours-feedback/:stage/apply',
    expect: ownerOnly,
    params: () => ({ stage: 'casework' }),
    body: () => ({ version: 1 }),
  },

  // the price book: the owner's alone
  { method: 'GET', path: '/api/price-book', expect: ownerOnly },
  { method: 'GET', path: '/api/price-book/versions', expect: ownerOnly },
  { method: 'GET', path: '/api/price-book/:kind.csv', expect: ownerOnly, params: () => ({ kind: 'lumber' }) },
  {
    method: 'POST',
    path: '/api/price-book/:kind',
    expect: ownerOnly,
    params: () => ({ kind: 'banding' }),
    body: (_ids, role) => ({
      item: { id: unique(role), name: 'Ash banding 22 mm', widthMm: 22, pricePerMetreCents: 60 },
    }),
  },
  {
    method: 'PATCH',
    path: '/api/price-book/:kind/:id',
    expect: ownerOnly,
    params: () => ({ kind: 'sheet-goods', id: 'birch-ply-18' }),
    body: () => ({ retired: false }),
  },
  {
    method: 'POST',
    path: '/api/price-book/:kind/import',
    expect: ownerOnly,
    params: () => ({ kind: 'lumber' }),
    query: { dryRun: '1' },
  },
  { method: 'GET', path: '/api/clients', expect: ownerOnly },
  { method: 'GET', path: '/api/clients/:id', expect: ownerOnly, params: (ids) => ({ id: ids.tomaszId }) },
  {
    method: 'POST',
    path: '/api/clients',
    expect: ownerOnly,
    body: (_ids, role) => ({ name: 'Ash Brook', email: `${unique(role)}@example.com`, phone: '555-0100' }),
  },
  { method: 'GET', path: '/api/settings', expect: ownerOnly },
  { method: 'PATCH', path: '/api/settings', expect: ownerOnly, body: () => ({ version: 1 }) },
  // no file: the owner's answer is a 400 about the request
  { method: 'POST', path: '/api/settings/logo', expect: ownerOnly },
  // public, but the seeded shop has no logo yet: not found alike for everyone (settings.routes.test.ts serves one)
  { method: 'GET', path: '/api/settings/logo', expect: a(404, 404, 404, 404, 404) },
];

/** The default value of a path parameter: client A's resource of the kind the path names. */
export function defaultParams(path: string, ids: WorldIds): Record<string, string> {
  if (path.startsWith('/api/projects/')) return { id: ids.tomaszProject };
  if (path.startsWith('/api/estimates/')) return { id: ids.tomaszEstimate };
  if (path.startsWith('/api/jobs/')) return { id: ids.tomaszJob };
  if (path.startsWith('/api/payments/')) return { id: ids.tomaszDeposit };
  if (path.startsWith('/api/uploads/')) return { id: ids.tomaszUpload };
  if (path.startsWith('/api/mail/')) return { id: ids.mailId };
  if (path.startsWith('/api/designs/')) return { slug: 'bookcase' };
  return {};
}

/** The path with its parameters filled in. */
export function fill(path: string, params: Record<string, string>): string {
  return path.replace(/:(\w+)/g, (_m, k: string) => {
    const v = params[k];
    if (v === undefined) throw new Error(`no value for :${k} in ${path}`);
    return encodeURIComponent(v);
  });
}
