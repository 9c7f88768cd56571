/**
 * Backup and restore of everything a shop's business lives in: the SQLite database, the estimate PDFs and the
 * uploads, in one dated .tar.gz (made with the `tar` package from npm).
 *
 * The database is copied with `VACUUM INTO`: one read transaction, so the copy is the database as it stood when the
 * backup began, and in WAL mode it does not stop the running API from writing meanwhile (SQLite's page-by-page
 * online backup starts over whenever another connection writes, so under steady writes it may never finish).
 * The files are copied after the database: a row only ever names a file written before the row was committed, so
 * every file the copied database names is in the archive.
 */
import Database from 'better-sqlite3';
import {
  cpSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { connect } from 'node:net';
import { dirname, join } from 'node:path';
import * as tar from 'tar';

export interface DataPaths {
  databasePath: string;
  pdfDir: string;
  uploadsDir: string;
}

export interface Manifest {
  format: 'benchwright-backup';
  version: 1;
  createdAt: string;
  migrations: number;
  rows: Record<string, number>;
  files: { estimates: number; uploads: number };
}

const DB_FILE = 'benchwright.db';
const stamp = (d: Date) =>
  d
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-');

function countFiles(dir: string): number {
  if (!existsSync(dir)) return 0;
  return readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).length;
}

function rowCounts(db: Database.Database): Record<string, number> {
  const tables = db
    .prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name")
    .pluck()
    .all() as string[];
  return Object.fromEntries(
    tables.map((t) => [
      t,
      db
        .prepare(`select count(*) from "${t.replace(/"/g, '""')}"`)
        .pluck()
        .get() as number,
    ]),
  );
}

/** Writes `benchwright-<UTC time>.tar.gz` into `outDir` and returns its path and manifest. */
export async function backup(
  paths: DataPaths,
  outDir: string,
  now = new Date(),
): Promise<{ file: string; manifest: Manifest }> {
  mkdirSync(outDir, { recursive: true });
  const work = mkdtempSync(join(outDir, '.backup-'));
  try {
    const src = new Database(paths.databasePath, { fileMustExist: true });
    try {
      src.pragma('busy_timeout = 10000');
      src.prepare('VACUUM INTO ?').run(join(work, DB_FILE));
    } finally {
      src.close();
    }
    const copy = new Database(join(work, DB_FILE), { readonly: true });
    let manifest: Manifest;
    try {
      const migrations = copy
        .prepare("select count(*) from sqlite_master where type = 'table' and name = '__drizzle_migrations'")
        .pluck()
        .get()
        ? (copy.prepare('select count(*) from __drizzle_migrations').pluck().get() as number)
        : 0;
      manifest = {
        format: 'benchwright-backup',
        version: 1,
        createdAt: now.toISOString(),
        migrations,
        rows: rowCounts(copy),
        files: { estimates: 0, uploads: 0 },
      };
    } finally {
      copy.close();
    }
    for (const [name, dir] of [
      ['estimates', paths.pdfDir],
      ['uploads', paths.uploadsDir],
    ] as const) {
      mkdirSync(join(work, name), { recursive: true });
      if (existsSync(dir)) cpSync(dir, join(work, name), { recursive: true });
      manifest.files[name] = countFiles(join(work, name));
    }
    writeFileSync(join(work, 'manifest.json'), JSON.stringify(manifest, null, 2));
    const file = join(outDir, `benchwright-${stamp(now)}.tar.gz`);
    await tar.c({ gzip: true, file: `${file}.partial`, cwd: work, portable: true }, [
      'manifest.json',
      DB_FILE,
      'estimates',
      'uploads',
    ]);
    renameSync(`${file}.partial`, file);
    return { file, manifest };
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** Moves a file or folder, copying when the two places are on different file systems. */
function move(from: string, to: string) {
  mkdirSync(dirname(to), { recursive: true });
  try {
    renameSync(from, to);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
    cpSync(from, to, { recursive: true });
    rmSync(from, { recursive: true, force: true });
  }
}

/** True when something accepts connections on host:port (the API, for the restore's refusal). */
export function isListening(host: string, port: number, timeoutMs = 1000): Promise<boolean> {
  return new Promise((resolve) => {
    const s = connect({ host, port });
    const done = (up: boolean) => {
      s.destroy();
      resolve(up);
    };
    s.setTimeout(timeoutMs, () => done(false));
    s.once('connect', () => done(true));
    s.once('error', () => done(false));
  });
}

/**
 * Puts a backup in place of the current data (the API must be stopped: the caller checks). The archive is unpacked
 * and its database checked (`PRAGMA integrity_check`) before anything is touched; what was there is then moved
 * aside into `asideDir`, never deleted, so a restore can itself be undone.
 */
export async function restore(archive: string, paths: DataPaths, asideDir: string): Promise<Manifest> {
  const base = dirname(paths.databasePath);
  mkdirSync(base, { recursive: true });
  const work = mkdtempSync(join(base, '.restore-'));
  try {
    await tar.x({ file: archive, cwd: work, strict: true });
    const manifestPath = join(work, 'manifest.json');
    if (!existsSync(manifestPath) || !existsSync(join(work, DB_FILE)))
      throw new Error(`${archive} is not a Benchwright backup (no manifest.json or ${DB_FILE} in it)`);
    const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest;
    if (manifest.format !== 'benchwright-backup' || manifest.version !== 1)
      throw new Error(`${archive} is not a Benchwright backup this version can read`);
    const db = new Database(join(work, DB_FILE), { readonly: true });
    try {
      const check = db.pragma('integrity_check', { simple: true });
      if (check !== 'ok') throw new Error(`the database in ${archive} fails its integrity check: ${String(check)}`);
    } finally {
      db.close();
    }
    for (const suffix of ['', '-wal', '-shm']) {
      const f = `${paths.databasePath}${suffix}`;
      if (existsSync(f)) move(f, join(asideDir, `${DB_FILE}${suffix}`));
    }
    if (existsSync(paths.pdfDir)) move(paths.pdfDir, join(asideDir, 'estimates'));
    if (existsSync(paths.uploadsDir)) move(paths.uploadsDir, join(asideDir, 'uploads'));
    move(join(work, DB_FILE), paths.databasePath);
    move(join(work, 'estimates'), paths.pdfDir);
    move(join(work, 'uploads'), paths.uploadsDir);
    return manifest;
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
