import { useState } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { designs, parseSpec, toMm, type BuildSpec, type DesignSlug } from '@benchwright/pricing/geometry';
import { Configurator, defaultsOf } from './configurator';

const OPTIONS = {
  carcassMaterialId: [
    {
      id: 'birch-ply-18',
      name: '3/4 in birch plywood',
      note: 'veneered faces, takes a clear finish',
      thicknessMm: 18.3,
    },
    { id: 'mdf-18', name: '3/4 in MDF', note: 'paint-grade, no grain', thicknessMm: 19.05 },
  ],
  finishId: [{ id: 'waterborne-poly', name: 'Waterborne polyurethane, satin', note: '3 coats as standard' }],
  'trim.lumberId': [
    { id: 'hard-maple-4-4', name: 'Hard maple, 4/4', note: 'solid hard maple' },
    { id: 'walnut-4-4', name: 'Black walnut, 4/4', note: 'solid black walnut' },
  ],
};

const json = (body: unknown, status = 200) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** The API as the form meets it: the design's options, and a preview that checks the piece with the engine's schema. */
function stubApi(slug: DesignSlug) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      if (String(url).endsWith(`/designs/${slug}`)) return json({ design: { ...designs[slug], options: OPTIONS } });
      if (String(url).endsWith('/quotes/preview')) {
        const spec = (JSON.parse(String(init?.body)) as { items: { spec: unknown }[] }).items[0]!.spec;
        const r = parseSpec(spec, 'in');
        if (!r.ok)
          return json(
            {
              error: {
                code: 'invalid',
                message: 'The piece cannot be built as set.',
                issues: r.issues.map((i) => ({ path: `items[0].spec.${i.path}`, message: i.message })),
              },
            },
            400,
          );
        return json({
          quote: {
            budget: { lowCents: 100_000, highCents: 120_000 },
            checks: [],
            items: [{ drawingSvg: '<svg></svg>', massKg: 50 }],
            hours: 30,
          },
        });
      }
      return json({ error: { code: 'not_found', message: 'x' } }, 404);
    }),
  );
}

/** The configurator holding its piece as an app does; `latest()` is the piece now. */
function mount(slug: DesignSlug) {
  stubApi(slug);
  let current: BuildSpec = defaultsOf(slug);
  function Harness() {
    const [spec, setSpec] = useState<BuildSpec>(() => defaultsOf(slug));
    const [quantity, setQuantity] = useState(1);
    current = spec;
    return <Configurator slug={slug} spec={spec} setSpec={setSpec} quantity={quantity} setQuantity={setQuantity} />;
  }
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <Harness />
    </QueryClientProvider>,
  );
  return { latest: () => current };
}

afterEach(() => vi.unstubAllGlobals());

describe('the configurator’s choices', () => {
  it('lists the shop’s materials by name and note, and a choice changes the piece', async () => {
    const { latest } = mount('bookcase');
    const select = screen.getByLabelText('Case') as HTMLSelectElement;
    await waitFor(() => expect(select.options).toHaveLength(2));
    expect(Array.from(select.options).map((o) => o.textContent)).toEqual([
      '3/4 in birch plywood (veneered faces, takes a clear finish)',
      '3/4 in MDF (paint-grade, no grain)',
    ]);
    fireEvent.change(select, { target: { value: 'mdf-18' } });
    expect(latest().carcassMaterialId).toBe('mdf-18');
    // no finish at all, then a finish with its coats
    fireEvent.change(screen.getByLabelText('Finish'), { target: { value: '' } });
    expect(latest()).toMatchObject({ finishId: null, coats: null });
    expect(screen.queryByLabelText('Coats')).toBeNull();
    fireEvent.change(screen.getByLabelText('Finish'), { target: { value: 'waterborne-poly' } });
    fireEvent.change(screen.getByLabelText('Coats'), { target: { value: '2' } });
    expect(latest()).toMatchObject({ finishId: 'waterborne-poly', coats: 2 });
    fireEvent.change(screen.getByLabelText('Installation'), { target: { value: 'built-in' } });
    expect(latest()).toMatchObject({ installation: 'built-in' });
    // inset fronts for this piece, then back to the shop's own default (no field at all)
    fireEvent.change(screen.getByLabelText('Doors and drawer fronts sit'), { target: { value: 'inset' } });
    expect(latest().frontStyle).toBe('inset');
    fireEvent.change(screen.getByLabelText('Doors and drawer fronts sit'), { target: { value: 'shop' } });
    expect('frontStyle' in latest()).toBe(false);
  });

  it('adds a rear case to the bench, back to back, and takes one away', async () => {
    const { latest } = mount('assembly-bench');
    const cases = () => {
      const s = latest();
      if (s.design !== 'assembly-bench') throw new Error('not a bench');
      return s.cases;
    };
    expect(cases()).toHaveLength(3);
    fireEvent.click(screen.getByRole('button', { name: 'Add a rear case, back to back' }));
    const s = latest();
    if (s.design !== 'assembly-bench') throw new Error('not a bench');
    expect(s.cases).toHaveLength(4);
    expect(s.cases[3]).toMatchObject({ row: 'back', facing: 'back' });
    expect(screen.getByRole('group', { name: /^Case 4: back row, facing the back/ })).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Remove case 2' }));
    expect(cases()).toHaveLength(3);
  });

  it('resizes the main case when the bench gets wider, so the overhangs stay', async () => {
    const { latest } = mount('assembly-bench');
    const width = screen.getByLabelText('Width');
    fireEvent.focus(width);
    // typed a character at a time: "8" on the way to "80" leaves nothing behind
    fireEvent.change(width, { target: { value: '8' } });
    fireEvent.change(width, { target: { value: '80' } });
    fireEvent.blur(width);
    const s = latest();
    if (s.design !== 'assembly-bench') throw new Error('not a bench');
    expect(s.widthMm).toBeCloseTo(toMm(80), 1);
    expect(s.overhangLeftMm).toBeCloseTo(toMm(5), 1);
    expect(s.cases[0]!.widthMm).toBeCloseTo(toMm(70), 0);
    expect(screen.getByLabelText('Case 1 Width')).toHaveProperty('value', '70"');
    // the trim: walnut from the shop's lumber
    await waitFor(() => expect((screen.getByLabelText('Trim wood') as HTMLSelectElement).options.length).toBe(2));
    fireEvent.change(screen.getByLabelText('Trim wood'), { target: { value: 'walnut-4-4' } });
    expect(latest().trim?.lumberId).toBe('walnut-4-4');
  });

  it('says beside the bay which section leaves no room, and what to change', async () => {
    mount('wall-cabinet');
    const height = screen.getByLabelText('Bay 1, Section 1 Height');
    const bay = screen.getByRole('group', { name: /^Bay 1/ });
    fireEvent.change(height, { target: { value: '40' } });
    await act(async () => {});
    await waitFor(
      () => expect(within(bay).getByText(/Bay 1, Section 1 is set at 40 in; make it at most/)).toBeTruthy(),
      { timeout: 3000 },
    );
    expect(screen.getByRole('button', { name: /standard piece/ })).toBeTruthy();
  });
});
