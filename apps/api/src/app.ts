import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import { createLucia } from './auth/lucia';
import { migrationLevel, type Db } from './db/client';
import { appOrigins, type Env } from './env';
import { errorHandler, notFoundRoute } from './middleware/errors';
import { noStore } from './middleware/cache';
import { idempotency } from './middleware/idempotency';
import { originCheck } from './middleware/origin';
import { requireRole, sessionMiddleware } from './middleware/session';
import { priceBookRoutes } from './modules/price-book/price-book.routes';
import { createPriceBookService } from './modules/price-book/price-book.service';
import { accountRoutes, confirmEmailChangeRoute } from './modules/account/account.routes';
import { createAccountService } from './modules/account/account.service';
import { authRoutes } from './modules/auth/auth.routes';
import { createAuthService } from './modules/auth/auth.service';
import { designsRoutes } from './modules/designs/designs.routes';
import { createProjectsService } from './modules/projects/projects.service';
import { projectsRoutes } from './modules/projects/projects.routes';
import { quotesRoutes } from './modules/quotes/quotes.routes';
import { usersRoutes } from './modules/users/users.routes';
import { loadPricing } from './lib/engine';
import { createEnginePool, type EnginePool } from './lib/engine-pool';
import { createPdfPool } from './lib/pdf-pool';
import { createStripe } from './lib/stripe';
import { createEstimatesService } from './modules/estimates/estimates.service';
import { estimatesRoutes, projectMoneyRoutes } from './modules/estimates/estimates.routes';
import { createJobsService } from './modules/jobs/jobs.service';
import { jobsRoutes } from './modules/jobs/jobs.routes';
import { mailRoutes } from './modules/mail/mail.routes';
import { overviewRoutes } from './modules/overview/overview.routes';
import { createHoursService } from './modules/hours/hours.service';
import { hoursRoutes } from './modules/hours/hours.routes';
import { createOverviewService } from './modules/overview/overview.service';
import { createMailService } from './modules/mail/mail.service';
import { createPaymentsService } from './modules/payments/payments.service';
import { paymentConfirmRoute, paymentsRoutes, webhookRoute } from './modules/payments/payments.routes';
import { createUploadsService } from './modules/uploads/uploads.service';
import { projectUploadsRoutes, uploadsRoutes } from './modules/uploads/uploads.routes';
import { leadTimeRoutes } from './modules/lead-time/lead-time.routes';
import { createClientsService } from './modules/clients/clients.service';
import { clientsRoutes } from './modules/clients/clients.routes';
import { createSettingsService } from './modules/settings/settings.service';
import { logoRoute, settingsRoutes } from './modules/settings/settings.routes';

export const VERSION = '0.1.0';

export interface AppDeps {
  db: Db;
  env: Env;
  log: Logger;
  /** true once migrations and the seed are done */
  ready: () => boolean;
  /** the engine's worker pool; made from the environment when not given */
  pool?: EnginePool;
}

/** Builds the API (no listen). */
export function createApp({ db, env, log, ready, pool: given }: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  // every answer is `Cache-Control: no-store` (middleware/cache.ts), so no cache ever revalidates with an ETag:
  // hashing each body for one was wasted work on every request
  app.set('etag', false);
  // X-Forwarded-For is believed only from the proxies named in TRUST_PROXY (none by default)
  app.set('trust proxy', env.TRUST_PROXY);
  const secure = env.PORTAL_URL.startsWith('https:');
  const lucia = createLucia(db, secure);
  const auth = createAuthService({
    db,
    shopName: () => loadPricing(db).shopName,
    portalUrl: env.PORTAL_URL,
    shopUrl: env.SHOP_URL,
    mailLimits: {
      enabled: env.RATE_LIMITS,
      resetsPerHour: env.RESET_MAILS_PER_HOUR,
      verificationsPerHour: env.VERIFY_MAILS_PER_HOUR,
    },
  });

  const account = createAccountService({
    db,
    shopName: () => loadPricing(db).shopName,
    portalUrl: env.PORTAL_URL,
    shopUrl: env.SHOP_URL,
    sessionMaxAgeMs: env.SESSION_MAX_DAYS * 24 * 3600_000,
    mailLimits: { enabled: env.RATE_LIMITS, perHour: env.VERIFY_MAILS_PER_HOUR },
  });

  const pool =
    given ??
    createEnginePool({
      threads: env.ENGINE_THREADS,
      maxQueue: env.ENGINE_QUEUE,
      quickMs: env.ENGINE_QUICK_MS,
      thoroughMs: env.ENGINE_THOROUGH_MS,
    });
  const pdfs = createPdfPool({ maxQueue: env.PDF_QUEUE, timeoutMs: env.PDF_TIMEOUT_MS });
  const estimatesService = createEstimatesService({
    db,
    pdfDir: env.PDF_DIR,
    portalUrl: env.PORTAL_URL,
    pool,
    pdfs,
  });
  const paymentsService = createPaymentsService({
    db,
    stripe: createStripe(env),
    webhookSecret: env.STRIPE_WEBHOOK_SECRET,
    portalUrl: env.PORTAL_URL,
    shopUrl: env.SHOP_URL,
  });
  const jobsService = createJobsService(db, env.PORTAL_URL, pool, env.SHOP_URL, pdfs, env.PDF_DIR, env.UPLOADS_DIR);

  app.use(pinoHttp({ logger: log, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(helmet());
  // the Stripe webhook (raw body, signed) comes before JSON parsing and the origin check
  app.use('/api/webhooks/stripe', webhookRoute(paymentsService));
  app.use(express.json({ limit: env.JSON_LIMIT }));
  app.use(originCheck(appOrigins(env)));
  app.use(sessionMiddleware(lucia, env.SESSION_MAX_DAYS * 24 * 3600_000, account.touch));
  // what the API answers is personal or changes by the minute: no cache keeps it (the estimate PDF says private)
  app.use('/api', noStore);

  app.get('/api/health', (_req, res) => {
    let database = 'ok';
    let migrations = 0;
    try {
      db.$client.prepare('select 1').get();
      migrations = migrationLevel(db);
    } catch {
      database = 'unreachable';
    }
    const ok = database === 'ok' && ready();
    res
      .status(ok ? 200 : 503)
      .json({ health: { status: ok ? 'ok' : 'starting', database, migrations, version: VERSION } });
  });

  const limits = {
    enabled: env.RATE_LIMITS,
    signInFailsPerEmailIp: env.SIGNIN_FAILS_PER_EMAIL_IP,
    signInAttemptsPerIp: env.SIGNIN_ATTEMPTS_PER_IP,
    signUpsPerIp: env.SIGNUPS_PER_IP,
    passwordResetsPerIp: env.PASSWORD_RESETS_PER_IP,
  };
  app.use(
    '/api/auth',
    authRoutes(auth, lucia, limits),
    confirmEmailChangeRoute(account, { enabled: env.RATE_LIMITS, failuresPerIp: env.SIGNIN_ATTEMPTS_PER_IP }),
  );
  app.use(
    '/api/account',
    requireRole(),
    accountRoutes(account, lucia, { enabled: env.RATE_LIMITS, passwordChecksPerUser: env.ACCOUNT_PASSWORD_CHECKS }),
  );
  app.use('/api/users', requireRole('owner'), usersRoutes(auth));
  app.use('/api/designs', designsRoutes(db));
  app.use('/api/quotes', quotesRoutes(db, pool, { enabled: env.RATE_LIMITS, perMinute: env.PREVIEWS_PER_MINUTE }));
  const clientsService = createClientsService(db, { portalUrl: env.PORTAL_URL });
  const projectsService = createProjectsService(db, { portalUrl: env.PORTAL_URL, shopUrl: env.SHOP_URL }, pool);
  const uploadsService = createUploadsService({ db, dir: env.UPLOADS_DIR, projects: projectsService });
  app.use(
    '/api/projects',
    requireRole('client', 'owner', 'builder'),
    projectMoneyRoutes(estimatesService, paymentsService),
    projectUploadsRoutes(uploadsService),
    projectsRoutes(
      projectsService,
      (id) => clientsService.clientUser(id),
      {
        enabled: env.RATE_LIMITS,
        commentsPerMinute: env.COMMENTS_PER_MINUTE,
      },
      idempotency(db),
    ),
  );
  app.use('/api/uploads', requireRole('client', 'owner', 'builder'), uploadsRoutes(uploadsService));
  app.use('/api/lead-time', leadTimeRoutes(db));
  app.use('/api/estimates', requireRole('owner', 'client'), estimatesRoutes(estimatesService, paymentsService));
  app.use('/api/payments/confirm', requireRole('client'), paymentConfirmRoute(paymentsService));
  app.use('/api/payments', requireRole('owner'), paymentsRoutes(paymentsService));
  app.use('/api/jobs', requireRole('owner', 'builder'), jobsRoutes(jobsService));
  app.use('/api/mail', requireRole('owner'), mailRoutes(createMailService(db)));
  app.use('/api/overview', requireRole('owner'), overviewRoutes(createOverviewService(db)));
  app.use('/api/hours-feedback', requireRole('owner'), hoursRoutes(createHoursService(db)));
  app.use('/api/price-book', requireRole('owner'), priceBookRoutes(createPriceBookService(db)));
  app.use('/api/clients', requireRole('owner'), clientsRoutes(clientsService, idempotency(db)));
  const settingsService = createSettingsService(db, env.PDF_DIR);
  // the logo is public (the portal's header, the mail); changing it is the owner's, below
  app.use('/api/settings/logo', logoRoute(settingsService));
  app.use('/api/settings', requireRole('owner'), settingsRoutes(settingsService));
  app.use('/api', notFoundRoute);
  app.use(errorHandler(log));
  return Object.assign(app, {
    services: { estimates: estimatesService, payments: paymentsService, jobs: jobsService, auth },
    pool,
    pdfs,
  });
}
