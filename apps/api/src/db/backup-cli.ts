/** `pnpm db:backup [--out DIR]`: a dated archive of the database, PDFs and uploads (default: data/backups/). */
import { dirname, resolve } from 'node:path';
import { REPO_ROOT, loadEnv } from '../env';
import { backup } from './backup';

const env = loadEnv();
const i = process.argv.indexOf('--out');
const outDir =
  i > 0 && process.argv[i + 1]
    ? resolve(REPO_ROOT, process.argv[i + 1]!)
    : resolve(dirname(env.DATABASE_PATH), 'backups');
const started = Date.now();
const { file, manifest } = await backup(
  { databasePath: env.DATABASE_PATH, pdfDir: env.PDF_DIR, uploadsDir: env.UPLOADS_DIR },
  outDir,
);
const rows = Object.values(manifest.rows).reduce((a, b) => a + b, 0);
console.log(
  `backup written: ${file}\n  ${rows} rows in ${Object.keys(manifest.rows).length} tables, ${manifest.files.estimates} PDFs, ${manifest.files.uploads} uploads, in ${Date.now() - started} ms`,
);
