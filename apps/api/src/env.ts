import { isIP } from 'node:net';
import { isAbsolute, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as z from 'zod';

/** The repository root: relative data paths are taken from here, whatever the working directory. */
export const REPO_ROOT = resolve(fileURLToPath(new URL('../../../', import.meta.url)));
const fromRoot = (p: string) => (p === ':memory:' || isAbsolute(p) ? p : resolve(REPO_ROOT, p));

/** Local stand-in values, fine on a laptop and refused in production (anyone can sign events with them). */
const LOCAL_DEFAULTS = {
  STRIPE_SECRET_KEY: 'sk_test_local_benchwright',
  STRIPE_WEBHOOK_SECRET: 'whsec_local_benchwright',
} as const;

const bool = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/**
 * Which proxies may set X-Forwarded-For: off (`false`, the default: the client is the TCP peer), a hop count, or a
 * comma-separated list of addresses, subnets (CIDR) and Express's names `loopback`, `linklocal`, `uniquelocal`.
 * `true` (trust every hop, so any client can name its own address) is refused.
 */
const trustProxy = z
  .string()
  .default('false')
  .transform((v, ctx): false | number | string[] => {
    const s = v.trim();
    if (s === '' || s === 'false' || s === '0') return false;
    if (/^\d+$/.test(s)) return Number(s);
    const list = s
      .split(',')
      .map((x) => x.trim())
      .filter(Boolean);
    const bad = list.filter((x) => {
      if (['loopback', 'linklocal', 'uniquelocal'].includes(x)) return false;
      const [addr, bits, ...rest] = x.split('/');
      if (rest.length || !addr || !isIP(addr)) return true;
      return bits !== undefined && !/^\d{1,3}$/.test(bits);
    });
    if (bad.length || !list.length) {
      ctx.addIssue({
        code: 'custom',
        message: `name the proxies (addresses, subnets, loopback) or a hop count, or false; not ${JSON.stringify(s)}`,
      });
      return z.NEVER;
    }
    return list;
  });

const Env = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_PATH: z.string().default('data/benchwright.db').transform(fromRoot),
  UPLOADS_DIR: z.string().default('data/uploads').transform(fromRoot),
  APP_ORIGINS: z
    .string()
    .default('http://127.0.0.1:5173,http://localhost:5173,http://127.0.0.1:5174,http://localhost:5174'),
  PORTAL_URL: z.url().default('http://127.0.0.1:5173'),
  SHOP_URL: z.url().default('http://127.0.0.1:5174'),
  SMTP_URL: z.string().default('smtp://127.0.0.1:1025'),
  MAIL_FROM: z.string().default('Fernhill Joinery <shop@fernhill.example>'),
  TRUST_PROXY: trustProxy,
  RATE_LIMITS: bool.default(true),
  SIGNIN_FAILS_PER_EMAIL_IP: z.coerce.number().int().positive().default(10),
  SIGNIN_ATTEMPTS_PER_IP: z.coerce.number().int().positive().default(50),
  /** wrong current passwords on the account page per account in 15 minutes */
  ACCOUNT_PASSWORD_CHECKS: z.coerce.number().int().positive().default(10),
  SIGNUPS_PER_IP: z.coerce.number().int().positive().default(20),
  PASSWORD_RESETS_PER_IP: z.coerce.number().int().positive().default(30),
  RESET_MAILS_PER_HOUR: z.coerce.number().int().positive().default(3),
  VERIFY_MAILS_PER_HOUR: z.coerce.number().int().positive().default(3),
  COMMENTS_PER_MINUTE: z.coerce.number().int().positive().default(10),
  PREVIEWS_PER_MINUTE: z.coerce.number().int().positive().default(120),
  /** a session ends this many days after sign-in, however active (Lucia's own expiry slides 30 days on use) */
  SESSION_MAX_DAYS: z.coerce.number().positive().max(365).default(30),
  // the engine's worker pool (lib/engine-pool.ts): threads (default: cores - 1, at least 1), queue length, time limits
  ENGINE_THREADS: z.coerce.number().int().positive().optional(),
  ENGINE_QUEUE: z.coerce.number().int().min(0).default(16),
  ENGINE_QUICK_MS: z.coerce.number().int().positive().default(2_000),
  ENGINE_THOROUGH_MS: z.coerce.number().int().positive().default(10_000),
  // the PDF worker (lib/pdf-pool.ts): documents that may wait for it, and the time limit per document
  PDF_QUEUE: z.coerce.number().int().min(0).default(8),
  PDF_TIMEOUT_MS: z.coerce.number().int().positive().default(30_000),
  JSON_LIMIT: z.string().default('100kb'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: bool.default(true),
  /** price, in the background after start-up, every revision stored before revisions kept their record */
  RECORD_BACKFILL: bool.default(true),
  PDF_DIR: z.string().default('data/estimates').transform(fromRoot),
  // Stripe: the local stand-in by default; real Stripe is only a matter of these three
  STRIPE_SECRET_KEY: z
    .string()
    .regex(/^sk_(test|live)_\w+$/, 'a Stripe secret key (sk_test_... or sk_live_...)')
    .default(LOCAL_DEFAULTS.STRIPE_SECRET_KEY),
  STRIPE_API_BASE: z.url().default('http://127.0.0.1:12111'),
  STRIPE_WEBHOOK_SECRET: z.string().min(8).default(LOCAL_DEFAULTS.STRIPE_WEBHOOK_SECRET),
  // open payments older than PAYMENT_SWEEP_AGE_MS are asked of Stripe every PAYMENT_SWEEP_MS
  PAYMENT_SWEEP_MS: z.coerce.number().int().positive().default(60_000),
  PAYMENT_SWEEP_AGE_MS: z.coerce
    .number()
    .int()
    .min(0)
    .default(5 * 60_000),
});
export type Env = z.infer<typeof Env>;

/** Reads and checks the environment; the only reader of process.env. */
export function loadEnv(source: Record<string, string | undefined> = process.env): Env {
  const r = Env.safeParse(source);
  if (!r.success) {
    const lines = r.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`The environment is not valid:\n${lines}`);
  }
  if (r.data.NODE_ENV === 'production') {
    const local = (Object.keys(LOCAL_DEFAULTS) as (keyof typeof LOCAL_DEFAULTS)[]).filter(
      (k) => r.data[k] === LOCAL_DEFAULTS[k],
    );
    if (local.length)
      throw new Error(
        `Refusing to start in production with the local default ${local.join(' and ')}: set the real values from the Stripe dashboard.`,
      );
  }
  return r.data;
}

export function appOrigins(env: Env): string[] {
  return env.APP_ORIGINS.split(',')
    .map((s) => s.trim())
    .filter(Boolean);
}
