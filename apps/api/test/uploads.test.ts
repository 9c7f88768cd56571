import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterEach, describe, expect, it } from 'vitest';
import { rmSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { jobs, projects, uploads, users } from '../src/db/schema';
import { displayName } from '../src/modules/uploads/uploads.files';
import { testApp, type TestApp } from './helpers';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

/** The app with its own empty uploads folder, and each demo person signed in. */
async function setup() {
  const dir = mkdtempSync(join(tmpdir(), 'bw-uploads-'));
  dirs.push(dir);
  const t = await testApp({ UPLOADS_DIR: dir });
  const [priya, tomasz, owner, builder] = await Promise.all([
    t.signIn('priya@example.com'),
    t.signIn('tomasz@example.com'),
    t.signIn('maren@fernhill.example'),
    t.signIn('idris@fernhill.example'),
  ]);
  const all = (await owner.get('/api/projects')).body.projects as { id: string; client: { name: string } }[];
  const priyas = all.find((p) => p.client.name === 'Priya Natarajan')!.id;
  const tomaszs = all.find((p) => p.client.name === 'Tomasz Wierzbicki')!.id;
  /** Puts a project in the shop, with its job at `stage`, as a paid deposit and a move would. */
  const inProduction = (projectId: string, stage: 'casework' | 'finish' = 'casework') => {
    t.db.update(projects).set({ status: 'in_production' }).where(eq(projects.id, projectId)).run();
    t.db.insert(jobs).values({ id: randomUUID(), projectId, stageKey: stage }).run();
  };
  const stored = () => readdirSync(dir);
  const rows = () => t.db.select().from(uploads).all();
  return { t, dir, priya, tomasz, owner, builder, priyas, tomaszs, inProduction, stored, rows };
}

const image = (format: 'jpeg' | 'png' | 'webp', width = 64, height = 48) =>
  sharp({ create: { width, height, channels: 3, background: { r: 150, g: 110, b: 70 } } })
    [format]()
    .toBuffer();
/** A JPEG carrying EXIF with a GPS position (51°30' N, 0°7' W) and a camera make. */
const jpegWithGps = () =>
  sharp({ create: { width: 80, height: 40, channels: 3, background: { r: 90, g: 60, b: 30 } } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'Fernhill test camera' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .toBuffer();
const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n',
);
/** The EXIF GPS-IFD pointer tag (0x8825) in either byte order. */
const hasGpsTag = (exif: Buffer | undefined) =>
  !!exif && (exif.includes(Buffer.from([0x88, 0x25])) || exif.includes(Buffer.from([0x25, 0x88])));

const attach = (a: Agent, projectId: string, data: Buffer, filename: string, contentType?: string) =>
  a.post(`/api/projects/${projectId}/uploads`).attach('file', data, { filename, contentType });

describe('POST /api/projects/:id/uploads', () => {
  it.each([
    ['jpeg', 'image/jpeg', 'image', 'space.jpg'],
    ['png', 'image/png', 'image', 'sketch.png'],
    ['webp', 'image/webp', 'image', 'corner.webp'],
  ] as const)('takes a %s photo from the client of the project, with a thumbnail', async (format, mime, kind, name) => {
    const s = await setup();
    const r = await attach(s.priya, s.priyas, await image(format), name);
    expect(r.status).toBe(201);
    expect(r.body.upload).toMatchObject({
      name,
      kind,
      mimeType: mime,
      by: { name: 'Priya Natarajan' },
      stageKey: null,
    });
    const file = await s.priya.get(`/api/uploads/${r.body.upload.id}`).buffer(true);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe(mime);
    expect((await sharp(file.body as Buffer).metadata()).format).toBe(format === 'jpeg' ? 'jpeg' : format);
    const thumb = await s.priya.get(`/api/uploads/${r.body.upload.id}/thumbnail`).buffer(true);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(s.stored()).toHaveLength(2);
  });

  it('takes a PDF, served as an attachment, with no thumbnail', async () => {
    const s = await setup();
    const r = await attach(s.priya, s.priyas, PDF, 'plan.pdf', 'application/octet-stream');
    expect(r.status).toBe(201);
    expect(r.body.upload).toMatchObject({ kind: 'pdf', mimeType: 'application/pdf', sizeBytes: PDF.length });
    const file = await s.priya.get(`/api/uploads/${r.body.upload.id}`).buffer(true);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="?plan\.pdf"?$/);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(file.headers['cache-control']).toBe('private, no-store');
    expect(Buffer.compare(file.body as Buffer, PDF)).toBe(0);
    expect((await s.priya.get(`/api/uploads/${r.body.upload.id}/thumbnail`)).status).toBe(404);
    // the type comes from the bytes, whatever the name says
    const named = await attach(s.priya, s.priyas, PDF, 'page.html', 'text/html');
    const served = await s.priya.get(`/api/uploads/${named.body.upload.id}`);
    expect(served.headers['content-type']).toBe('application/pdf');
    expect(served.headers['content-disposition']).toMatch(/^attachment;/);
  });

  it('answers 404, not 400 or 500, when a listed file is missing from the folder', async () => {
    const s = await setup();
    const r = await attach(s.priya, s.priyas, await image('png'), 'gone.png');
    for (const f of s.stored()) rmSync(join(s.dir, f));
    const file = await s.priya.get(`/api/uploads/${r.body.upload.id}`);
    expect(file.status).toBe(404);
    expect(file.body.error.code).toBe('not_found');
  });

  it('serves images inline, unsniffable and not for shared caches', async () => {
    const s = await setup();
    const r = await attach(s.priya, s.priyas, await image('png'), 'a.png');
    const file = await s.priya.get(`/api/uploads/${r.body.upload.id}`);
    expect(file.headers['content-disposition']).toBe('inline');
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(file.headers['cache-control']).toBe('private, no-store');
  });

  it('removes the EXIF location (and all metadata) from a JPEG that had it', async () => {
    const s = await setup();
    const original = await jpegWithGps();
    expect(hasGpsTag((await sharp(original).metadata()).exif)).toBe(true);
    const r = await attach(s.priya, s.priyas, original, 'garage.jpg');
    expect(r.status).toBe(201);
    for (const path of [`/api/uploads/${r.body.upload.id}`, `/api/uploads/${r.body.upload.id}/thumbnail`]) {
      const served = (await s.priya.get(path).buffer(true)).body as Buffer;
      const meta = await sharp(served).metadata();
      expect(meta.exif).toBeUndefined();
      expect(hasGpsTag(served)).toBe(false);
      expect(served.includes(Buffer.from('Fernhill test camera'))).toBe(false);
    }
  });

  it('turns an image upright from its EXIF orientation', async () => {
    const s = await setup();
    // 60 wide, 20 high, marked "rotate 90° clockwise to view" (orientation 6)
    const sideways = await sharp({ create: { width: 60, height: 20, channels: 3, background: '#806040' } })
      .jpeg()
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const r = await attach(s.priya, s.priyas, sideways, 'tall.jpg');
    const meta = await sharp(
      (await s.priya.get(`/api/uploads/${r.body.upload.id}`).buffer(true)).body as Buffer,
    ).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([20, 60, undefined]);
  });

  it('stores the file under a random name, keeps the uploaded name as text only, without control characters', async () => {
    const s = await setup();
    const r = await attach(s.priya, s.priyas, await image('jpeg'), '../../kitchen\u200b wall\u202e.jpg');
    expect(r.status).toBe(201);
    expect(r.body.upload.name).toBe('kitchen wall.jpg');
    const [row] = s.rows();
    expect(row!.storagePath).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    expect(row!.thumbnailPath).toMatch(/^[0-9a-f-]{36}\.webp$/);
    expect(s.stored().sort()).toEqual([row!.storagePath, row!.thumbnailPath].sort());
    expect(s.stored().join(' ')).not.toMatch(/kitchen|wall/);
    // a raw control character in the part header is malformed multipart: refused, never a 500
    const bell = await attach(s.priya, s.priyas, await image('jpeg'), 'bell\u0007.jpg');
    expect(bell.status).toBe(400);
    expect(displayName('a\u0000b\u0007c\u001b[31m\u007f\u009b.jpg')).toBe('abc[31m.jpg');
    expect(displayName('C:\\Users\\me\\plan.pdf')).toBe('plan.pdf');
    expect(displayName('\u0001\u0002')).toBe('file');
  });

  it('lists the files on the project and puts the attachment on its timeline', async () => {
    const s = await setup();
    await attach(s.priya, s.priyas, await image('png'), 'one.png');
    await attach(s.owner, s.priyas, PDF, 'drawing.pdf');
    const p = (await s.priya.get(`/api/projects/${s.priyas}`)).body.project;
    expect(p.uploads.map((u: { name: string; by: { name: string } }) => [u.name, u.by.name])).toEqual([
      ['one.png', 'Priya Natarajan'],
      ['drawing.pdf', 'Maren Holt'],
    ]);
    expect(Object.keys(p.uploads[0]).sort()).toEqual([
      'at',
      'by',
      'id',
      'kind',
      'mimeType',
      'name',
      'sizeBytes',
      'stageKey',
    ]);
    expect(
      // sorted: the timeline orders by time, and both may fall in the same millisecond
      p.timeline
        .filter((e: { kind: string }) => e.kind === 'upload')
        .map((e: { message: string }) => e.message)
        .sort(),
    ).toEqual(['Maren Holt attached a PDF: drawing.pdf.', 'Priya Natarajan attached a picture: one.png.']);
  });

  describe('refusals', () => {
    it('answers 413 for a 40 MB file and stores nothing', async () => {
      const s = await setup();
      const big = Buffer.alloc(40 * 1024 * 1024, 0x41);
      (await image('jpeg')).copy(big);
      const r = await attach(s.priya, s.priyas, big, 'huge.jpg', 'image/jpeg');
      expect(r.status).toBe(413);
      expect(r.body.error.code).toBe('payload_too_large');
      expect(s.stored()).toEqual([]);
      expect(s.rows()).toEqual([]);
    });

    it.each([
      [
        'an executable renamed .jpg',
        Buffer.concat([Buffer.from('7f454c46020101', 'hex'), Buffer.alloc(200)]),
        'photo.jpg',
        'image/jpeg',
      ],
      [
        'a Windows program renamed .png',
        Buffer.concat([Buffer.from('MZ'), Buffer.alloc(300)]),
        'sketch.png',
        'image/png',
      ],
      ['plain text called a PDF', Buffer.from('not a pdf at all'), 'plan.pdf', 'application/pdf'],
      [
        'an SVG',
        Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
        'x.svg',
        'image/svg+xml',
      ],
    ])('answers 415 for %s and stores nothing', async (_what, data, name, type) => {
      const s = await setup();
      const r = await attach(s.priya, s.priyas, data, name, type);
      expect(r.status).toBe(415);
      expect(r.body.error.code).toBe('unsupported_media_type');
      expect(s.stored()).toEqual([]);
      expect(s.rows()).toEqual([]);
    });

    it('answers 400 with no file, or a damaged image', async () => {
      const s = await setup();
      const none = await s.priya.post(`/api/projects/${s.priyas}/uploads`).field('purpose', 'attachment');
      expect(none.status).toBe(400);
      expect(none.body.error.issues[0].path).toBe('file');
      const wrongField = await s.priya
        .post(`/api/projects/${s.priyas}/uploads`)
        .attach('photo', await image('png'), 'a.png');
      expect(wrongField.status).toBe(400);
      const truncated = (await image('jpeg', 400, 300)).subarray(0, 300);
      const damaged = await attach(s.priya, s.priyas, truncated, 'cut.jpg');
      expect(damaged.status).toBe(400);
      expect(s.stored()).toEqual([]);
    });

    it("answers 404 for an upload to another client's project, and stores nothing", async () => {
      const s = await setup();
      const r = await attach(s.tomasz, s.priyas, await image('png'), 'mine.png');
      expect(r.status).toBe(404);
      expect(r.body.error.code).toBe('not_found');
      expect((await attach(s.priya, 'no-such-project', await image('png'), 'x.png')).status).toBe(404);
      expect(s.stored()).toEqual([]);
    });

    it('answers 409 for the 31st file of a project', async () => {
      const s = await setup();
      const png = await image('png', 8, 8);
      for (let i = 0; i < 30; i++) expect((await attach(s.priya, s.priyas, png, `p${i}.png`)).status).toBe(201);
      const r = await attach(s.priya, s.priyas, png, 'one-too-many.png');
      expect(r.status).toBe(409);
      expect(r.body.error.code).toBe('conflict');
      expect(s.rows()).toHaveLength(30);
      expect(s.stored()).toHaveLength(60);
    });

    it('answers 401 when not signed in', async () => {
      const s = await setup();
      expect((await attach(s.t.agent(), s.priyas, await image('png'), 'x.png')).status).toBe(401);
    });
  });

  describe('roles', () => {
    it('lets the owner attach to any project', async () => {
      const s = await setup();
      expect((await attach(s.owner, s.tomaszs, await image('png'), 'o.png')).status).toBe(201);
    });
    it('lets the builder attach only to projects in production', async () => {
      const s = await setup();
      expect((await attach(s.builder, s.priyas, await image('png'), 'b.png')).status).toBe(404);
      s.inProduction(s.priyas);
      const r = await attach(s.builder, s.priyas, await image('png'), 'b.png');
      expect(r.status).toBe(201);
      expect(r.body.upload.by.name).toBe('Idris Kane');
    });
  });

  describe('progress photos', () => {
    it('records the job’s current stage for the builder’s photo, and the client sees it', async () => {
      const s = await setup();
      s.inProduction(s.priyas, 'casework');
      const r = await s.builder
        .post(`/api/projects/${s.priyas}/uploads`)
        .field('purpose', 'progress')
        .attach('file', await image('jpeg'), 'carcass.jpg');
      expect(r.status).toBe(201);
      expect(r.body.upload.stageKey).toBe('casework');
      const p = (await s.priya.get(`/api/projects/${s.priyas}`)).body.project;
      expect(p.uploads[0]).toMatchObject({ stageKey: 'casework', name: 'carcass.jpg' });
      expect(p.timeline.at(-1)).toMatchObject({ kind: 'progress_photo' });
      expect((await s.priya.get(`/api/uploads/${r.body.upload.id}/thumbnail`)).status).toBe(200);
    });
    it('refuses a progress photo from a client (403), without a job (409), or as a PDF (400)', async () => {
      const s = await setup();
      const progress = (a: Agent, data: Buffer, name: string) =>
        a.post(`/api/projects/${s.priyas}/uploads`).field('purpose', 'progress').attach('file', data, name);
      expect((await progress(s.owner, await image('png'), 'x.png')).status).toBe(409);
      s.inProduction(s.priyas);
      expect((await progress(s.priya, await image('png'), 'x.png')).status).toBe(403);
      expect((await progress(s.builder, PDF, 'x.pdf')).status).toBe(400);
      expect(s.stored()).toEqual([]);
    });
  });
});

describe('GET /api/uploads/:id', () => {
  it("answers 404 for another client's file and its thumbnail, and to a builder before the job is in the shop", async () => {
    const s = await setup();
    const id = (await attach(s.priya, s.priyas, await image('png'), 'private.png')).body.upload.id;
    for (const path of [`/api/uploads/${id}`, `/api/uploads/${id}/thumbnail`]) {
      const r = await s.tomasz.get(path);
      expect(r.status).toBe(404);
      expect(JSON.stringify(r.body)).not.toContain('private');
      expect((await s.builder.get(path)).status).toBe(404);
      expect((await s.owner.get(path)).status).toBe(200);
      expect((await s.t.agent().get(path)).status).toBe(401);
    }
    expect((await s.tomasz.get(`/api/projects/${s.priyas}`)).status).toBe(404);
    s.inProduction(s.priyas);
    expect((await s.builder.get(`/api/uploads/${id}`)).status).toBe(200);
    expect((await s.priya.get('/api/uploads/no-such')).status).toBe(404);
  });
});

describe('DELETE /api/uploads/:id', () => {
  it('lets the uploader or the owner remove a file, with its bytes; others 403 or 404', async () => {
    const s = await setup();
    s.inProduction(s.priyas);
    const mine = (await attach(s.priya, s.priyas, await image('png'), 'a.png')).body.upload.id;
    const builders = (await attach(s.builder, s.priyas, await image('png'), 'b.png')).body.upload.id;
    expect((await s.tomasz.delete(`/api/uploads/${mine}`)).status).toBe(404);
    expect((await s.builder.delete(`/api/uploads/${mine}`)).status).toBe(403);
    expect((await s.priya.delete(`/api/uploads/${builders}`)).status).toBe(403);
    expect(s.stored()).toHaveLength(4);
    expect((await s.priya.delete(`/api/uploads/${mine}`)).status).toBe(204);
    expect((await s.owner.delete(`/api/uploads/${builders}`)).status).toBe(204);
    expect(s.rows()).toEqual([]);
    expect(s.stored()).toEqual([]);
    expect((await s.priya.get(`/api/uploads/${mine}`)).status).toBe(404);
    expect(s.t.db.select().from(users).all().length).toBeGreaterThan(0);
  });
});
