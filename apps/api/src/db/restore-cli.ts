/** `pnpm db:restore FILE`: puts a backup back, with the API stopped; what was there is kept in data/backups/. */
import { existsSync } from 'node:fs';
import { dirname, isAbsolute, resolve } from 'node:path';
import { REPO_ROOT, loadEnv } from '../env';
import { isListening, restore } from './backup';

const env = loadEnv();
const arg = process.argv[2];
if (!arg) {
  console.error('usage: pnpm db:restore FILE   (a .tar.gz written by pnpm db:backup)');
  process.exit(2);
}
const file = isAbsolute(arg) ? arg : resolve(REPO_ROOT, arg);
if (!existsSync(file)) {
  console.error(`no such file: ${file}`);
  process.exit(2);
}
const host = env.HOST === '0.0.0.0' || env.HOST === '::' ? '127.0.0.1' : env.HOST;
if (await isListening(host, env.PORT)) {
  console.error(
    `The API is running (something answers on ${host}:${env.PORT}). Stop it first: a restore under a running API would be overwritten or corrupt.`,
  );
  process.exit(1);
}
const aside = resolve(
  dirname(env.DATABASE_PATH),
  'backups',
  `before-restore-${new Date()
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-')}`,
);
const manifest = await restore(
  file,
  { databasePath: env.DATABASE_PATH, pdfDir: env.PDF_DIR, uploadsDir: env.UPLOADS_DIR },
  aside,
);
console.log(`restored the backup of ${manifest.createdAt} into ${dirname(env.DATABASE_PATH)}`);
if (existsSync(aside)) console.log(`  what was there before is kept in ${aside}`);
