import { pino } from 'pino';
import { createApp } from './app';
import { applyMigrations, openDb } from './db/client';
import { relativeFilePaths } from './db/relative-paths';
import { seedDemo, seedShop } from './db/seed';
import { seedDemoFlow } from './db/seed-flow';
import { loadEnv } from './env';
import { loadPricing, projectSpecs } from './lib/engine';
import { createMailWorker } from './lib/mailer';
import { createPaymentSweeper } from './modules/payments/payments.sweeper';
import { backfillRecords } from './lib/record';

const env = loadEnv();
const log = pino({ level: env.LOG_LEVEL });
const db = openDb(env.DATABASE_PATH);
let ready = false;
const app = createApp({ db, env, log, ready: () => ready });
const worker = createMailWorker(db, env.SMTP_URL, env.MAIL_FROM, log, env.PDF_DIR);
const sweeper = createPaymentSweeper(
  app.services.payments,
  { everyMs: env.PAYMENT_SWEEP_MS, olderThanMs: env.PAYMENT_SWEEP_AGE_MS },
  log,
);

const server = app.listen(env.PORT, env.HOST, () => log.info(`API listening on http://${env.HOST}:${env.PORT}/api`));

async function boot() {
  applyMigrations(db);
  relativeFilePaths(db, env.PDF_DIR);
  if (env.SEED_DEMO) await seedDemo(db);
  else seedShop(db);
  worker.start();
  sweeper.start();
  app.pool.warm().catch((err) => log.warn({ err: String(err) }, 'the engine pool did not start'));
  if (env.SEED_DEMO) {
    try {
      await seedDemoFlow(db, app.services, log);
    } catch (err) {
      log.warn(
        { err: String(err) },
        'demo estimates and payments not seeded (is the Stripe stand-in running on STRIPE_API_BASE?)',
      );
    }
  }
  ready = true;
  log.info('migrations and seed done; ready');
  if (env.RECORD_BACKFILL)
    backfillRecords(db, app.pool, (projectId) => ({ ...loadPricing(db), items: projectSpecs(db, projectId) }))
      .then((n) => n && log.info(`${n} revision(s) priced before records were kept now have their record`))
      .catch((err) => log.warn({ err: String(err) }, 'revision records not filled in'));
}
boot().catch((err) => {
  log.fatal({ err }, 'start-up failed');
  process.exit(1);
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  log.info(`${signal}: shutting down`);
  server.close();
  server.closeIdleConnections();
  await Promise.all([worker.stop(), sweeper.stop()]);
  await Promise.all([app.pool.close(), app.pdfs.close()]);
  db.$client.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
