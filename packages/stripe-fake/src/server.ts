import { createHash, createHmac, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import express, { type NextFunction, type Request, type Response } from 'express';

/**
 * A local stand-in for the parts of the Stripe API that Benchwright uses:
 * Checkout Sessions (payment mode), PaymentIntents, Refunds, signed webhook
 * events and a hosted test checkout page. It speaks Stripe's wire format
 * (form-encoded requests with nested keys, JSON objects with Stripe's shapes
 * and id prefixes, Stripe's error objects and idempotency keys), so the
 * official SDK is its client. Written here because stripe-mock (a Go binary)
 * is not on the package registries, and stripe-stateful-mock lacks Checkout
 * Sessions, PaymentIntents and webhooks.
 */

export const API_VERSION = '2026-10-28.endive';

export interface FakeOptions {
  /** where the state is kept between restarts; omitted: memory only */
  stateFile?: string;
  /** public base URL of this server, for the hosted page's address */
  baseUrl: string;
  webhookUrl: string;
  webhookSecret: string;
  /** the business the hosted page says the client pays, as Stripe shows the account's business name */
  businessName?: string;
  /** first retry after this many ms, doubling; default 1000 */
  retryBaseMs?: number;
  maxAttempts?: number;
}

type Obj = Record<string, unknown>;

interface State {
  sessions: Record<string, Obj>;
  paymentIntents: Record<string, Obj>;
  charges: Record<string, Obj>;
  refunds: Record<string, Obj>;
  events: Obj[];
  /** webhook deliveries not yet acknowledged, kept with the state so that a restart resumes them */
  pending?: { eventId: string; attempt: number; dueAt: number }[];
  idempotency: Record<string, { fingerprint: string; status: number; body: unknown }>;
}

class StripeError extends Error {
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

const ALNUM = 'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789';
function newId(prefix: string): string {
  const bytes = randomBytes(24);
  let s = '';
  for (const b of bytes) s += ALNUM[b % ALNUM.length];
  return `${prefix}${s}`;
}

const now = () => Math.floor(Date.now() / 1000);

/** Stripe's header: t=<unix>,v1=<hex HMAC-SHA256 of "<t>.<payload>" under the endpoint secret>. */
export function signPayload(payload: string, secret: string, timestamp = now()): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`).digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

function int(v: unknown, param: string, { min = 0 }: { min?: number } = {}): number {
  const n = typeof v === 'number' ? v : typeof v === 'string' && /^-?\d+$/.test(v) ? Number(v) : NaN;
  if (!Number.isInteger(n) || n < min)
    throw new StripeError(
      400,
      'invalid_request_error',
      `Invalid integer: ${String(v)}`,
      'parameter_invalid_integer',
      param,
    );
  return n;
}

function str(v: unknown, param: string, required = true): string | null {
  if (v === undefined || v === '') {
    if (required)
      throw new StripeError(
        400,
        'invalid_request_error',
        `Missing required param: ${param}.`,
        'parameter_missing',
        param,
      );
    return null;
  }
  if (typeof v !== 'string')
    throw new StripeError(400, 'invalid_request_error', `Invalid string: ${param}`, 'parameter_invalid_string', param);
  return v;
}

function metadataOf(v: unknown): Record<string, string> {
  if (v === undefined || v === '') return {};
  if (typeof v !== 'object' || v === null || Array.isArray(v))
    throw new StripeError(
      400,
      'invalid_request_error',
      'Invalid object: metadata',
      'parameter_invalid_object',
      'metadata',
    );
  return Object.fromEntries(Object.entries(v as Obj).map(([k, x]) => [k, String(x)]));
}

function listOf(v: unknown): Obj[] {
  if (Array.isArray(v)) return v as Obj[];
  if (v && typeof v === 'object')
    return Object.keys(v as Obj)
      .sort((a, b) => Number(a) - Number(b))
      .map((k) => (v as Obj)[k] as Obj);
  return [];
}

function esc(s: unknown): string {
  return String(s ?? '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;');
}

function money(cents: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}

export function createStripeFake(opts: FakeOptions) {
  const state: State =
    opts.stateFile && existsSync(opts.stateFile)
      ? JSON.parse(readFileSync(opts.stateFile, 'utf8'))
      : { sessions: {}, paymentIntents: {}, charges: {}, refunds: {}, events: [], idempotency: {} };
  const retryBase = opts.retryBaseMs ?? 1000;
  const maxAttempts = opts.maxAttempts ?? 8;
  const timers = new Set<NodeJS.Timeout>();
  state.pending ??= [];
  const pending = state.pending;
  let stopped = false;

  function save(): void {
    if (!opts.stateFile) return;
    mkdirSync(dirname(opts.stateFile), { recursive: true });
    const tmp = `${opts.stateFile}.tmp`;
    writeFileSync(tmp, JSON.stringify(state));
    renameSync(tmp, opts.stateFile);
  }

  /**
   * Queues a delivery of the event. Pending deliveries live in the state (saved to the state file), so
   * that a restart of the stand-in resumes them, as Stripe keeps retrying through an outage of its own.
   */
  function deliver(event: Obj): void {
    const entry = { eventId: String(event.id), attempt: 1, dueAt: Date.now() };
    pending.push(entry);
    save();
    attempt(entry);
  }

  function later(entry: (typeof pending)[number]): void {
    if (stopped) return;
    const t = setTimeout(
      () => {
        timers.delete(t);
        attempt(entry);
      },
      Math.max(0, entry.dueAt - Date.now()),
    );
    t.unref();
    timers.add(t);
  }

  function settle(entry: (typeof pending)[number]): void {
    const i = pending.indexOf(entry);
    if (i >= 0) pending.splice(i, 1);
    save();
  }

  function attempt(entry: (typeof pending)[number]): void {
    if (stopped) return;
    const event = state.events.find((e) => e.id === entry.eventId);
    if (!event) return settle(entry);
    const payload = JSON.stringify(event, null, 2);
    fetch(opts.webhookUrl, {
      method: 'POST',
      headers: {
        'Content-Type': 'application/json',
        'Stripe-Signature': signPayload(payload, opts.webhookSecret),
        'User-Agent': 'Stripe/1.0 (+local stand-in)',
      },
      body: payload,
    })
      .then((r) => {
        if (!r.ok) throw new Error(`status ${r.status}`);
        if (!stopped) settle(entry);
      })
      .catch(() => {
        if (stopped) return; // left pending on disk for the next start
        if (entry.attempt >= maxAttempts) return settle(entry); // given up, as Stripe does after its retries
        entry.dueAt = Date.now() + retryBase * 2 ** (entry.attempt - 1);
        entry.attempt += 1;
        save();
        later(entry);
      });
  }

  function emit(type: string, object: Obj): Obj {
    const event = {
      id: newId('evt_'),
      object: 'event',
      api_version: API_VERSION,
      created: now(),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    state.events.push(event);
    deliver(event);
    return event;
  }

  function session(id: string): Obj {
    const s = state.sessions[id];
    if (!s)
      throw new StripeError(
        404,
        'invalid_request_error',
        `No such checkout.session: '${id}'`,
        'resource_missing',
        'id',
      );
    expireIfDue(s);
    return s;
  }

  function expireIfDue(s: Obj): void {
    if (s.status === 'open' && typeof s.expires_at === 'number' && s.expires_at <= now()) {
      s.status = 'expired';
      emit('checkout.session.expired', s);
      save();
    }
  }

  // deliveries left pending by the last run are resumed
  for (const entry of pending) later(entry);

  const sweep = setInterval(() => {
    for (const s of Object.values(state.sessions)) expireIfDue(s);
  }, 1000);
  sweep.unref();

  function createSession(body: Obj): Obj {
    if (body.mode !== 'payment')
      throw new StripeError(
        400,
        'invalid_request_error',
        'This stand-in supports mode=payment only.',
        'parameter_invalid_string',
        'mode',
      );
    const items = listOf(body.line_items);
    if (!items.length)
      throw new StripeError(
        400,
        'invalid_request_error',
        'Missing required param: line_items.',
        'parameter_missing',
        'line_items',
      );
    let total = 0;
    let currency = '';
    const lines = items.map((li, i) => {
      const pd = li.price_data as Obj | undefined;
      if (!pd)
        throw new StripeError(
          400,
          'invalid_request_error',
          `Missing required param: line_items[${i}][price_data].`,
          'parameter_missing',
          `line_items[${i}][price_data]`,
        );
      const amount = int(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`);
      const quantity = int(li.quantity ?? '1', `line_items[${i}][quantity]`, { min: 1 });
      currency = String(str(pd.currency, `line_items[${i}][price_data][currency]`)).toLowerCase();
      const name = str((pd.product_data as Obj | undefined)?.name, `line_items[${i}][price_data][product_data][name]`)!;
      total += amount * quantity;
      return { description: name, quantity, amount_total: amount * quantity, currency };
    });
    const success = str(body.success_url, 'success_url')!;
    const expiresAt = body.expires_at !== undefined ? int(body.expires_at, 'expires_at') : now() + 24 * 3600;
    if (expiresAt < now() + 30 * 60 - 5 || expiresAt > now() + 24 * 3600 + 5)
      throw new StripeError(
        400,
        'invalid_request_error',
        'The `expires_at` timestamp must be between 30 minutes and 24 hours from now.',
        'parameter_invalid_integer',
        'expires_at',
      );
    const id = newId('cs_test_');
    const pid = body.payment_intent_data as Obj | undefined;
    const s: Obj = {
      id,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      cancel_url: str(body.cancel_url, 'cancel_url', false),
      client_reference_id: str(body.client_reference_id, 'client_reference_id', false),
      created: now(),
      currency,
      customer_email: str(body.customer_email, 'customer_email', false),
      expires_at: expiresAt,
      livemode: false,
      metadata: metadataOf(body.metadata),
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: success,
      url: `${opts.baseUrl}/pay/${id}`,
      _lines: lines,
      _pi_metadata: metadataOf(pid?.metadata),
    };
    state.sessions[id] = s;
    return s;
  }

  function pay(s: Obj): Obj {
    const pi: Obj = {
      id: newId('pi_test_'),
      object: 'payment_intent',
      amount: s.amount_total,
      amount_received: s.amount_total,
      currency: s.currency,
      status: 'succeeded',
      metadata: s._pi_metadata,
      created: now(),
      livemode: false,
      latest_charge: null,
    };
    const ch: Obj = {
      id: newId('ch_test_'),
      object: 'charge',
      amount: s.amount_total,
      amount_refunded: 0,
      refunded: false,
      currency: s.currency,
      payment_intent: pi.id,
      status: 'succeeded',
      paid: true,
      metadata: s._pi_metadata,
      created: now(),
      livemode: false,
    };
    pi.latest_charge = ch.id;
    state.paymentIntents[pi.id as string] = pi;
    state.charges[ch.id as string] = ch;
    s.status = 'complete';
    s.payment_status = 'paid';
    s.payment_intent = pi.id;
    emit('checkout.session.completed', s);
    emit('payment_intent.succeeded', pi);
    save();
    return pi;
  }

  function refund(body: Obj): Obj {
    const piId = str(body.payment_intent, 'payment_intent')!;
    const pi = state.paymentIntents[piId];
    if (!pi)
      throw new StripeError(
        404,
        'invalid_request_error',
        `No such payment_intent: '${piId}'`,
        'resource_missing',
        'payment_intent',
      );
    const ch = state.charges[pi.latest_charge as string];
    if (!ch) throw new Error(`payment_intent ${piId} has no charge`); // pay() stores both together
    const left = (ch.amount as number) - (ch.amount_refunded as number);
    const amount = body.amount !== undefined ? int(body.amount, 'amount', { min: 1 }) : left;
    if (left <= 0)
      throw new StripeError(
        400,
        'invalid_request_error',
        `Charge ${ch.id} has already been refunded.`,
        'charge_already_refunded',
      );
    if (amount > left)
      throw new StripeError(
        400,
        'invalid_request_error',
        `Refund amount (${money(amount, ch.currency as string)}) is greater than unrefunded amount on charge (${money(left, ch.currency as string)})`,
        'amount_too_large',
        'amount',
      );
    const re: Obj = {
      id: newId('re_test_'),
      object: 'refund',
      amount,
      charge: ch.id,
      payment_intent: pi.id,
      currency: ch.currency,
      status: 'succeeded',
      metadata: metadataOf(body.metadata),
      created: now(),
    };
    state.refunds[re.id as string] = re;
    ch.amount_refunded = (ch.amount_refunded as number) + amount;
    ch.refunded = ch.amount_refunded === ch.amount;
    emit('refund.created', re);
    emit('charge.refunded', ch);
    save();
    return re;
  }

  const publicView = (s: Obj) => Object.fromEntries(Object.entries(s).filter(([k]) => !k.startsWith('_')));

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '1mb' }));

  // the hosted test checkout page
  app.get('/pay/:id', (req, res) => {
    const s = state.sessions[req.params.id];
    if (!s)
      return void res
        .status(404)
        .type('html')
        .send(page('Payment not found', '<p>This payment link is not known.</p>'));
    expireIfDue(s);
    res.type('html').send(payPage(s, opts.businessName));
  });
  app.post('/pay/:id', (req, res) => {
    const s = state.sessions[req.params.id];
    if (!s)
      return void res
        .status(404)
        .type('html')
        .send(page('Payment not found', '<p>This payment link is not known.</p>'));
    expireIfDue(s);
    if (s.status !== 'open') return void res.status(409).type('html').send(payPage(s, opts.businessName));
    const body = req.body as Obj;
    const card = String(body.card_number ?? '').replace(/[\s-]/g, '');
    const exp = /^(\d{2})\s*\/\s*(\d{2})$/.exec(String(body.exp ?? ''));
    const cvc = String(body.cvc ?? '');
    const problems: string[] = [];
    if (!/^\d{12,19}$/.test(card)) problems.push('Enter the card number.');
    if (!exp || Number(exp[1]) < 1 || Number(exp[1]) > 12) problems.push('Enter the expiry as MM/YY.');
    else if (new Date(2000 + Number(exp[2]), Number(exp[1])) <= new Date()) problems.push('The card has expired.');
    if (!/^\d{3,4}$/.test(cvc)) problems.push('Enter the 3 or 4 digit security code.');
    if (!String(body.name ?? '').trim()) problems.push('Enter the name on the card.');
    if (problems.length)
      return void res
        .status(400)
        .type('html')
        .send(payPage(s, opts.businessName, problems.join(' ')));
    if (card !== '4242424242424242') {
      // 4000 0000 0000 0002 and any other number: declined, no event, the session stays open
      return void res
        .status(402)
        .type('html')
        .send(payPage(s, opts.businessName, 'Your card was declined. No payment was taken; try another card.'));
    }
    pay(s);
    res.redirect(303, String(s.success_url).replace('{CHECKOUT_SESSION_ID}', String(s.id)));
  });

  // test helpers
  app.get('/__fake/events', (_req, res) => {
    res.json({ object: 'list', data: [...state.events].reverse(), has_more: false, url: '/__fake/events' });
  });
  app.post('/__fake/events/:id/resend', (req, res) => {
    const e = state.events.find((x) => x.id === req.params.id);
    if (!e)
      return void res.status(404).json({
        error: {
          type: 'invalid_request_error',
          code: 'resource_missing',
          message: `No such event: '${req.params.id}'`,
          param: 'id',
        },
      });
    deliver(e);
    res.json(e);
  });

  // the API: Bearer sk_test_...
  const v1 = express.Router();
  v1.use((req, _res, next) => {
    const auth = req.headers.authorization ?? '';
    const key = /^Bearer (sk_test_\w+)$/.exec(auth)?.[1];
    if (!key)
      throw new StripeError(
        401,
        'invalid_request_error',
        auth
          ? 'Invalid API Key provided.'
          : 'You did not provide an API key. Provide your API key in the Authorization header, using Bearer auth.',
        'api_key_invalid',
      );
    next();
  });
  const idempotent = (handler: (req: Request) => { status?: number; body: Obj }) => (req: Request, res: Response) => {
    const key = req.headers['idempotency-key'];
    const fingerprint = createHash('sha256')
      .update(`${req.method} ${req.path} ${JSON.stringify(req.body ?? {})}`)
      .digest('hex');
    if (typeof key === 'string' && key) {
      const seen = state.idempotency[key];
      if (seen) {
        if (seen.fingerprint !== fingerprint)
          throw new StripeError(
            400,
            'idempotency_error',
            `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
          );
        res.setHeader('Idempotent-Replayed', 'true');
        return void res.status(seen.status).json(seen.body);
      }
    }
    const out = handler(req);
    const status = out.status ?? 200;
    if (typeof key === 'string' && key) state.idempotency[key] = { fingerprint, status, body: out.body };
    save();
    res.status(status).json(out.body);
  };
  v1.post(
    '/checkout/sessions',
    idempotent((req) => ({ body: publicView(createSession(req.body as Obj)) })),
  );
  v1.get('/checkout/sessions/:id', (req, res) => {
    res.json(publicView(session(req.params.id)));
  });
  v1.post(
    '/checkout/sessions/:id/expire',
    idempotent((req) => {
      const s = session(String(req.params.id));
      if (s.status !== 'open')
        throw new StripeError(
          400,
          'invalid_request_error',
          `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${s.status}".`,
          'checkout_session_not_open',
        );
      s.status = 'expired';
      emit('checkout.session.expired', s);
      return { body: publicView(s) };
    }),
  );
  v1.get('/payment_intents/:id', (req, res) => {
    const pi = state.paymentIntents[req.params.id];
    if (!pi)
      throw new StripeError(
        404,
        'invalid_request_error',
        `No such payment_intent: '${req.params.id}'`,
        'resource_missing',
        'id',
      );
    res.json(pi);
  });
  v1.post(
    '/refunds',
    idempotent((req) => ({ body: refund(req.body as Obj) })),
  );
  v1.get('/refunds/:id', (req, res) => {
    const re = state.refunds[req.params.id];
    if (!re)
      throw new StripeError(
        404,
        'invalid_request_error',
        `No such refund: '${req.params.id}'`,
        'resource_missing',
        'id',
      );
    res.json(re);
  });
  app.use('/v1', v1);
  app.use((req, _res, next) =>
    next(new StripeError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.path}).`)),
  );
  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    const e =
      err instanceof StripeError
        ? err
        : new StripeError(400, 'invalid_request_error', 'The request could not be read.');
    res.status(e.status).json({ error: { type: e.type, code: e.code, message: e.message, param: e.param } });
  });

  return {
    app,
    state,
    stop() {
      stopped = true;
      clearInterval(sweep);
      for (const t of timers) clearTimeout(t);
      timers.clear();
    },
  };
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(title)}</title>
<style>body{margin:0;background:#eef1ec;font-family:system-ui,sans-serif;color:#1f2a1f}main{max-width:420px;margin:48px auto;background:#fff;border:1px solid #c9d3c4;border-radius:6px;padding:28px}
h1{font-size:20px;margin:0 0 6px}.amount{font-size:30px;font-weight:700;margin:8px 0 18px}label{display:block;font-weight:600;margin:12px 0 4px}input{width:100%;box-sizing:border-box;padding:9px;border:1px solid #9aa796;border-radius:4px;font-size:16px}
.row{display:flex;gap:10px}.row div{flex:1}button{margin-top:18px;width:100%;padding:11px;border:0;border-radius:4px;background:#2f5d3a;color:#fff;font-size:16px;font-weight:600}
.problem{background:#f8e3df;border-left:4px solid #a33;padding:10px;margin:10px 0}.note{font-size:13px;color:#56624f;margin-top:16px}</style></head><body><main>${body}</main></body></html>`;
}

function payPage(s: Obj, businessName: string | undefined, problem?: string): string {
  const lines = (s._lines as { description: string; quantity: number }[])
    .map((l) => `<li>${esc(l.description)}${l.quantity > 1 ? ` x ${l.quantity}` : ''}</li>`)
    .join('');
  const head = `<p class="note">Test payment page (local Stripe stand-in)</p><h1>${esc(businessName ? `Pay ${businessName}` : 'Pay')}</h1><div class="amount">${esc(money(s.amount_total as number, s.currency as string))}</div><ul>${lines}</ul>`;
  if (s.status === 'complete') return page('Paid', `${head}<p>This payment is complete. Thank you.</p>`);
  if (s.status === 'expired')
    return page('Expired', `${head}<p>This payment link has expired. Ask for a new one from the portal.</p>`);
  return page(
    'Pay',
    `${head}${problem ? `<div class="problem" role="alert">${esc(problem)}</div>` : ''}<form method="post" action="/pay/${esc(s.id)}">
<label for="card_number">Card number</label><input id="card_number" name="card_number" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242">
<div class="row"><div><label for="exp">Expiry (MM/YY)</label><input id="exp" name="exp" autocomplete="cc-exp" placeholder="12/34"></div><div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123"></div></div>
<label for="name">Name on card</label><input id="name" name="name" autocomplete="cc-name">
<button type="submit">Pay ${esc(money(s.amount_total as number, s.currency as string))}</button></form>
<p class="note">Stripe's published test cards: 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined. No real card is charged.</p>`,
  );
}
