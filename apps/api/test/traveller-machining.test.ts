import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { partDrawings, type LengthUnit, type Traveller } from '@benchwright/pricing';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAILS, seededWorld, type World } from './world';

/** The PDF's text in reading order (columns kept apart), whitespace made single spaces. */
function pdfText(buf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'bw-machining-'));
  try {
    writeFileSync(join(dir, 'a.pdf'), buf);
    return execFileSync('pdftotext', [join(dir, 'a.pdf'), '-'])
      .toString()
      .replace(/\s+/g, ' ');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The demo's job: Tomasz's bookcase, paid, in the shop with Idris. */
describe('the traveller PDF’s machining drawings', () => {
  let w: World;
  beforeAll(async () => {
    w = await seededWorld();
  }, 120_000);
  afterAll(async () => {
    await w?.close();
  });
  it('draws the bookcase side with its dado located from the bottom end, as the shop app does', async () => {
    const builder = await w.signIn(EMAILS.builder);
    const t = (await builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller`)).body.traveller as Traveller & {
      units: LengthUnit;
    };
    const side = partDrawings(t, t.units).find((d) => d.name === 'side');
    const dado = side?.notes.find((n) => n.startsWith('Dado for the bottom'));
    // the default bookcase: a 3 in toe kick under the bottom, whose dado starts 3 in up the side
    expect(dado).toBe('Dado for the bottom, inside face: 23/32" wide, 1/4" deep, 3" from the bottom end.');
    const r = await builder
      .get(`/api/jobs/${w.ids.tomaszJob}/traveller.pdf`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (b: Buffer) => chunks.push(b));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(r.status).toBe(200);
    const text = pdfText(r.body as Buffer);
    expect(text).toContain('Machining');
    expect(text).toContain(`side x ${side!.quantity} ${side!.size}`);
    expect(text).toContain(dado);
  }, 120_000);
});
