import { mkdtempSync, rmSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterEach, describe, expect, it } from 'vitest';
import { ProjectResponse } from '@benchwright/contracts';
import { jobs, projects } from '../src/db/schema';
import { testApp } from './helpers';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

const photo = (shade: number) =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: { r: shade, g: 110, b: 70 } } })
    .jpeg()
    .toBuffer();

/** Priya's project with its deposit paid and its job in Material, everyone signed in. */
async function setup() {
  const dir = mkdtempSync(join(tmpdir(), 'bw-progress-'));
  dirs.push(dir);
  const t = await testApp({ UPLOADS_DIR: dir });
  const [priya, owner, builder] = await Promise.all([
    t.signIn('priya@example.com'),
    t.signIn('maren@fernhill.example'),
    t.signIn('idris@fernhill.example'),
  ]);
  const all = (await owner.get('/api/projects')).body.projects as { id: string; client: { name: string } }[];
  const projectId = all.find((p) => p.client.name === 'Priya Natarajan')!.id;
  t.db.update(projects).set({ status: 'deposit_paid' }).where(eq(projects.id, projectId)).run();
  const jobId = randomUUID();
  t.db.insert(jobs).values({ id: jobId, projectId, stageKey: 'material' }).run();
  const toPriya = () => t.mails().filter((m) => m.to === 'priya@example.com');
  const move = async (stageKey: string) =>
    expect((await builder.patch(`/api/jobs/${jobId}`).send({ stageKey })).status).toBe(200);
  const addPhoto = async (shade: number) => {
    const r = await builder
      .post(`/api/projects/${projectId}/uploads`)
      .field('purpose', 'progress')
      .attach('file', await photo(shade), `progress-${shade}.jpg`);
    expect(r.status).toBe(201);
    return r.body.upload.id as string;
  };
  return { t, priya, owner, builder, projectId, toPriya, move, addPhoto };
}

describe('progress photos and the stage mail', () => {
  it('two photos then a move: one mail naming the new stage, showing both photos of the stage left; none per photo', async () => {
    const s = await setup();
    await s.move('cutting');
    const before = s.toPriya().length;
    await s.addPhoto(120);
    await s.addPhoto(160);
    expect(s.toPriya().length, 'no mail for a photo').toBe(before);
    await s.move('casework');
    const mails = s.toPriya().slice(before);
    expect(mails).toHaveLength(1);
    const m = mails[0]!;
    expect(m.subject).toMatch(/The cases of your piece are being put together/);
    expect(m.text).toContain('2 photos from the Cutting stage');
    const inline = m.attachments.filter((a) => 'cid' in a);
    expect(inline).toHaveLength(2);
    for (const a of inline) {
      expect(a.contentType).toBe('image/webp');
      expect(m.html).toContain(`cid:${'cid' in a ? a.cid : ''}`);
      // the thumbnail, not the full photo: a small mail
      expect(Buffer.from('content' in a ? a.content : '', 'base64').length).toBeLessThan(50_000);
    }
  });

  it('a move with no photos still sends one mail, with nothing attached', async () => {
    const s = await setup();
    await s.move('cutting');
    await s.addPhoto(120);
    await s.move('casework');
    const before = s.toPriya().length;
    await s.move('drawers_doors');
    const mails = s.toPriya().slice(before);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/drawers and doors of your piece are being made/);
    expect(mails[0]!.attachments).toEqual([]);
    expect(mails[0]!.text).not.toMatch(/photo/);
  });

  it('the client sees the photos under the stage they were taken in, and the stage news in their words', async () => {
    const s = await setup();
    await s.move('cutting');
    const a = await s.addPhoto(120);
    const b = await s.addPhoto(160);
    await s.move('casework');
    const client = ProjectResponse.parse((await s.priya.get(`/api/projects/${s.projectId}`)).body).project.timeline;
    const stages = client.filter((e) => e.kind === 'stage');
    expect(stages.map((e) => [e.message, e.photos ?? []])).toEqual([
      ['Your piece is being cut.', [a, b]],
      ['The cases of your piece are being put together.', []],
    ]);
    expect(client.some((e) => e.kind === 'progress_photo')).toBe(false);
    expect(JSON.stringify(client)).not.toMatch(/Moved to/);
    // the owner keeps the shop's own record: each move and each photo as it happened
    const owner = ProjectResponse.parse((await s.owner.get(`/api/projects/${s.projectId}`)).body).project.timeline;
    expect(owner.filter((e) => e.kind === 'stage').map((e) => e.message)).toEqual([
      'Moved to Cutting.',
      'Moved to Casework.',
    ]);
    expect(owner.filter((e) => e.kind === 'progress_photo').map((e) => e.photos)).toEqual([[a], [b]]);
  });
});
