import { demoPriceBook, designs, estimate, PriceBook } from '@benchwright/pricing';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadPricing } from '../src/lib/engine';
import { testApp, type TestApp } from './helpers';

/** The labour list as books were stored before operations were open: a fixed key and a `per`, no driver. */
const OLD_LABOUR = [
  { key: 'job_setup', name: 'Job set-up and material order', per: 'job', minutes: 45, stage: 'material' },
  { key: 'sheet_breakdown', name: 'Break down sheets', per: 'sheet', minutes: 12, stage: 'cutting' },
  { key: 'part_cut', name: 'Cut parts to size', per: 'part', minutes: 2, stage: 'cutting' },
  { key: 'edge_banding', name: 'Edge banding', per: 'metre', minutes: 1.5, stage: 'casework' },
  { key: 'pocket_hole', name: 'Pocket holes', per: 'hole', minutes: 0.5, stage: 'casework' },
  { key: 'case_assembly', name: 'Assemble cases', per: 'case', minutes: 60, stage: 'casework' },
  { key: 'drawer_box', name: 'Build drawer boxes', per: 'drawer', minutes: 35, stage: 'drawers_doors' },
  { key: 'slide_pair', name: 'Fit slides', per: 'pair', minutes: 15, stage: 'drawers_doors' },
  { key: 'door_hang', name: 'Hang doors', per: 'door', minutes: 20, stage: 'drawers_doors' },
  { key: 'torsion_top', name: 'Build torsion-box top', per: 'top', minutes: 180, stage: 'casework' },
  { key: 'trim_piece', name: 'Fit solid trim', per: 'piece', minutes: 12, stage: 'casework' },
  { key: 'finish_coat', name: 'Finish, per coat', per: 'm2_coat', minutes: 10, stage: 'finish' },
  { key: 'caster', name: 'Fit casters and feet', per: 'caster', minutes: 8, stage: 'casework' },
  { key: 'final_check', name: 'Final check and wrap', per: 'job', minutes: 30, stage: 'ready' },
];

describe('a price book stored before labour operations were open', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
  });
  afterAll(() => t.app.pool.close());

  it('reads the seeded book, whose operations carry drivers', () => {
    const { book } = loadPricing(t.db);
    expect(book.labour.length).toBe(demoPriceBook.labour.length);
    expect(book.labour.every((o) => typeof o.driver === 'string')).toBe(true);
  });

  it('reads an old stored book, each operation given the driver its `per` meant, and prices with it', () => {
    // written as an older build stored it: the labour entries with `per` and no driver, hinges with no overlay
    const stored = JSON.parse(JSON.stringify(demoPriceBook)) as Record<string, unknown>;
    stored.labour = OLD_LABOUR;
    stored.hardware = (stored.hardware as { overlay?: string; fastens?: string; kind: string }[])
      .filter((h) => h.kind !== 'screw' && h.kind !== 'bolt')
      .map(({ overlay: _o, ...h }) => h);
    // the start-up move (src/db/price-book-move.ts, tested in price-book.routes.test.ts) reads such a document
    // through the engine's schema, which converts it
    const book = PriceBook.parse(stored);
    const { settings } = loadPricing(t.db);
    expect(book.labour.find((o) => o.key === 'edge_banding')?.driver).toBe('banding_metre');
    expect(book.labour.find((o) => o.key === 'torsion_top')?.driver).toBe('top');
    const e = estimate([{ spec: designs['assembly-bench'].defaults, quantity: 1 }], book, settings);
    expect(e.totalHours).toBeGreaterThan(0);
    // the old flat torsion-top standard still counts once per top: 3 h in casework among the rest
    expect(e.hoursByStage.casework).toBeGreaterThan(3);
  });
});
