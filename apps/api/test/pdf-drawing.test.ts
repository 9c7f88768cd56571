import { Document, Page, renderToBuffer } from '@react-pdf/renderer';
import { createElement } from 'react';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import type { Drawing } from '@benchwright/pricing';
import { PdfDrawing } from '../src/lib/pdf/pdf-drawing';

const dir = mkdtempSync(join(tmpdir(), 'bw-pdf-drawing-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function textOf(drawing: Drawing): Promise<string> {
  // plain createElement: the API's tests are .ts files
  const buf = await renderToBuffer(
    createElement(
      Document,
      null,
      createElement(Page, { size: 'LETTER' }, createElement(PdfDrawing, { drawing, width: 400 })),
    ),
  );
  const file = join(dir, 'd.pdf');
  writeFileSync(file, buf);
  return execFileSync('pdftotext', [file, '-']).toString();
}

describe('a drawing in a PDF', () => {
  it('draws the dimension lines with their sizes, as the screen does', async () => {
    const drawing: Drawing = {
      title: 'a panel',
      viewBox: { x: -20, y: -20, width: 640, height: 440 },
      shapes: [
        { type: 'rect', x: 0, y: 0, width: 600, height: 400, style: 'case' },
        { type: 'dimension', x1: 0, y1: 400, x2: 600, y2: 400, offset: 10, text: 'width 23 5/8 in', size: 14 },
        { type: 'dimension', x1: 600, y1: 0, x2: 600, y2: 400, offset: 10, text: 'height 15 3/4 in', size: 14 },
      ],
    };
    // react-pdf skips, with a console warning, any node its SVG does not support (a dimension once sat in a View)
    const warn = vi.spyOn(console, 'warn');
    const text = await textOf(drawing);
    expect(warn.mock.calls.flat().join('\n')).not.toMatch(/not currently supported/);
    warn.mockRestore();
    expect(text).toContain('width 23 5/8 in');
    expect(text).toContain('height 15 3/4 in');
  });
});
