import Database from 'better-sqlite3';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../src/app';
import { backup, restore, type DataPaths } from '../src/db/backup';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { relativeFilePaths } from '../src/db/relative-paths';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { loadEnv } from '../src/env';
import { freePort } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'bw-backup-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const folder = (name: string): DataPaths => ({
  databasePath: join(dir, name, 'benchwright.db'),
  pdfDir: join(dir, name, 'estimates'),
  uploadsDir: join(dir, name, 'uploads'),
});
const envFor = (p: DataPaths) =>
  loadEnv({
    DATABASE_PATH: p.databasePath,
    PDF_DIR: p.pdfDir,
    UPLOADS_DIR: p.uploadsDir,
    LOG_LEVEL: 'silent',
    RATE_LIMITS: 'false',
  });
const appOn = (db: Db, p: DataPaths) =>
  createApp({ db, env: envFor(p), log: pino({ level: 'silent' }), ready: () => true });
async function signedIn(app: ReturnType<typeof createApp>, email: string) {
  const a = request.agent(app);
  expect((await a.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD })).status).toBe(200);
  return a;
}
async function until<T>(what: string, probe: () => T | undefined, timeoutMs = 20_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = probe();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe('backup and restore', () => {
  const live = folder('live');
  const other = folder('elsewhere');
  let archive = '';
  let committedBefore = 0;
  let estimateId = '';

  it('takes a consistent backup while another process writes, with the estimate PDFs', async () => {
    const db = openDb(live.databasePath);
    applyMigrations(db);
    await seedDemo(db);
    // the owner prices and sends an estimate: its PDF goes into the PDF folder, its mail into the outbox
    const app = appOn(db, live);
    const owner = await signedIn(app, 'maren@fernhill.example');
    const priya = await signedIn(app, 'priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id;
    estimateId = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate.id;
    expect((await owner.post(`/api/estimates/${estimateId}/send`)).status).toBe(200);

    // some bulk, so that the copy takes a while, then a writer in its own process
    const sql = db.$client;
    sql.exec('create table load_rows (seq integer primary key, at integer not null, pad text not null)');
    const fill = sql.prepare('insert into load_rows (at, pad) values (0, ?)');
    sql.transaction(() => {
      for (let i = 0; i < 40_000; i++) fill.run('y'.repeat(200));
    })();
    const maxSeq = () => sql.prepare('select max(seq) from load_rows').pluck().get() as number;
    const writer: ChildProcess = spawn(
      process.execPath,
      [resolve(import.meta.dirname, 'support/write-load.cjs'), live.databasePath],
      {
        stdio: 'ignore',
      },
    );
    try {
      await until('the writer to commit', () => (maxSeq() > 40_050 ? true : undefined));
      committedBefore = maxSeq();
      const started = Date.now();
      const result = await backup(live, join(dir, 'backups'));
      const ended = Date.now();
      archive = result.file;
      // the writer kept committing while the backup ran
      const during = sql
        .prepare('select count(*) from load_rows where at between ? and ?')
        .pluck()
        .get(started, ended) as number;
      expect(during).toBeGreaterThan(0);
      expect(result.manifest.files.estimates).toBe(1);
      expect(result.manifest.rows.load_rows).toBeGreaterThanOrEqual(committedBefore);
    } finally {
      writer.kill();
      await new Promise((r) => (writer.exitCode !== null ? r(null) : writer.once('exit', r)));
    }
    expect(archive).toMatch(/backups\/benchwright-\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ\.tar\.gz$/);
    db.$client.close();
  }, 120_000);

  it('restores into another folder whole: integrity ok, every row committed before it began, the PDF found', async () => {
    // the original folder is gone, as on a new machine
    rmSync(live.databasePath.replace(/benchwright\.db$/, ''), { recursive: true, force: true });
    await restore(archive, other, join(dir, 'aside'));
    const sql = new Database(other.databasePath, { readonly: true });
    expect(sql.pragma('integrity_check', { simple: true })).toBe('ok');
    const upTo = sql.prepare('select count(*) from load_rows where seq <= ?').pluck().get(committedBefore);
    expect(upTo).toBe(committedBefore);
    const pdfPath = sql.prepare('select pdf_path from estimates where id = ?').pluck().get(estimateId) as string;
    const attachment = (
      JSON.parse(sql.prepare("select attachments from outbox where attachments != '[]'").pluck().get() as string) as {
        path: string;
      }[]
    )[0]!;
    sql.close();
    expect(existsSync(resolve(other.pdfDir, pdfPath))).toBe(true);
    expect(existsSync(resolve(other.pdfDir, attachment.path))).toBe(true);

    const db = openDb(other.databasePath);
    const priya = await signedIn(appOn(db, other), 'priya@example.com');
    const pdf = await priya
      .get(`/api/estimates/${estimateId}/pdf`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    db.$client.close();
  }, 60_000);

  it('rewrites absolute paths left by earlier versions as paths relative to the PDF folder, once', () => {
    const db = openDb(other.databasePath);
    const sql = db.$client;
    sql.prepare('update estimates set pdf_path = ? where id = ?').run(`/old/place/estimates/E-1-r1.pdf`, estimateId);
    sql
      .prepare("update outbox set attachments = json_set(attachments, '$[0].path', ?) where attachments != '[]'")
      .run(join(other.pdfDir, 'sub', 'E-1-r1.pdf'));
    expect(relativeFilePaths(db, other.pdfDir)).toBe(2);
    expect(sql.prepare('select pdf_path from estimates where id = ?').pluck().get(estimateId)).toBe('E-1-r1.pdf');
    const att = sql.prepare("select attachments from outbox where attachments != '[]'").pluck().get() as string;
    expect(JSON.parse(att)[0].path).toBe(join('sub', 'E-1-r1.pdf'));
    expect(relativeFilePaths(db, other.pdfDir)).toBe(0);
    db.$client.close();
  });

  it('refuses to restore while the API answers on its port', async () => {
    const port = await freePort();
    const server = createServer().listen(port, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      const cli = spawn(
        process.execPath,
        ['--import', 'tsx', resolve(import.meta.dirname, '../src/db/restore-cli.ts'), archive],
        {
          env: {
            ...process.env,
            PORT: String(port),
            HOST: '127.0.0.1',
            DATABASE_PATH: join(dir, 'third', 'benchwright.db'),
          },
          stdio: ['ignore', 'pipe', 'pipe'],
        },
      );
      let err = '';
      cli.stderr.on('data', (b: Buffer) => (err += b.toString()));
      const code = await new Promise((r) => cli.once('exit', r));
      expect(code).toBe(1);
      expect(err).toContain('The API is running');
      expect(existsSync(join(dir, 'third', 'benchwright.db'))).toBe(false);
    } finally {
      server.close();
    }
  }, 60_000);
});
