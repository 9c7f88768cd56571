import { useState } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { designs, parseSpec, toMm, type BuildSpec, type DesignSlug } from '@benchwright/pricing/geometry';
import { Configurator, defaultsOf } from './configurator';
import { plainPath } from './issues';

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
function stubApi(slug: DesignSlug, units: 'in' | 'mm') {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      if (String(url).endsWith(`/designs/${slug}`))
        return json({ design: { ...designs[slug], options: OPTIONS, units } });
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

/**
 * The configurator holding its piece as an app does, for a shop working in `units`; `latest()` is the piece now,
 * `sent()` the last piece sent for a preview.
 */
function mount(slug: DesignSlug, units: 'in' | 'mm' = 'in') {
  stubApi(slug, units);
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
  const sent = () => {
    const calls = vi.mocked(fetch).mock.calls.filter(([url]) => String(url).endsWith('/quotes/preview'));
    const body = calls.at(-1)?.[1]?.body;
    return body ? ((JSON.parse(String(body)) as { items: { spec: BuildSpec }[] }).items[0]!.spec as BuildSpec) : null;
  };
  return { latest: () => current, sent };
}

/** The piece as a bench (the tests below configure benches). */
function bench(s: BuildSpec | null) {
  if (s?.design !== 'assembly-bench') throw new Error('not a bench');
  return s;
}

afterEach(() => vi.unstubAllGlobals());

// the bench's form is a few hundred fields, drawn again on each change: on a busy machine a test takes seconds
describe('the configurator’s choices', { timeout: 20_000 }, () => {
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

  it('hangs a single door on the side chosen, and offers no side for a pair', async () => {
    const { latest, sent } = mount('assembly-bench');
    // the first rear cabinet's door, left as the standard piece has it
    const side = screen.getByLabelText('Case 2, Bay 1, Section 1 Hinged on') as HTMLSelectElement;
    expect(side.value).toBe('left');
    fireEvent.change(side, { target: { value: 'right' } });
    expect(bench(latest()).cases[1]!.bays[0]!.compartments[0]!.hingeSide).toBe('right');
    await waitFor(() => expect(bench(sent()).cases[1]!.bays[0]!.compartments[0]!.hingeSide).toBe('right'), {
      timeout: 3000,
    });
    // the main case's pair of doors hinges on both sides: no choice, until it is one door
    expect(screen.queryByLabelText('Case 1, Bay 2, Section 1 Hinged on')).toBeNull();
    fireEvent.change(screen.getByLabelText('Case 1, Bay 2, Section 1 Doors'), { target: { value: '1' } });
    fireEvent.change(screen.getByLabelText('Case 1, Bay 2, Section 1 Hinged on'), { target: { value: 'right' } });
    expect(bench(latest()).cases[0]!.bays[1]!.compartments[0]).toMatchObject({ doors: 1, hingeSide: 'right' });
    // back to a pair: the side goes with the single door
    fireEvent.change(screen.getByLabelText('Case 1, Bay 2, Section 1 Doors'), { target: { value: '2' } });
    expect(bench(latest()).cases[0]!.bays[1]!.compartments[0]).not.toHaveProperty('hingeSide');
    expect(screen.queryByLabelText('Case 1, Bay 2, Section 1 Hinged on')).toBeNull();
  });

  it('takes the bench’s working load in pounds for an imperial shop, with the caution beside it', async () => {
    const { latest, sent } = mount('assembly-bench');
    const load = screen.getByLabelText(/^Working load/) as HTMLInputElement;
    // the standard piece's 200 kg, in pounds (1 lb = 0.45359237 kg exactly)
    expect(load.value).toBe('441 lb');
    expect(screen.getByText('0 lb to 2,205 lb')).toBeTruthy();
    expect(load.getAttribute('aria-describedby')).toContain('working-load-note');
    expect(document.getElementById('working-load-note')?.textContent).toMatch(
      /shop’s estimate, not a rating: the casters’ own rated load governs/,
    );
    fireEvent.change(load, { target: { value: '500' } });
    expect(bench(latest()).workingLoadKg).toBeCloseTo(500 * 0.45359237, 6);
    await waitFor(() => expect(bench(sent()).workingLoadKg).toBeCloseTo(226.8, 1), { timeout: 3000 });
    // past what the engine takes: said beside the field, and the piece keeps its load
    fireEvent.change(load, { target: { value: '3000' } });
    expect(screen.getByText('Enter a weight from 0 lb to 2,205 lb.')).toBeTruthy();
    expect(bench(latest()).workingLoadKg).toBeCloseTo(226.8, 1);
    // the limit as written is the limit
    fireEvent.change(load, { target: { value: '2,205' } });
    expect(bench(latest()).workingLoadKg).toBe(1000);
    // in the client's millimeters, kilograms
    fireEvent.click(screen.getByLabelText('millimeters'));
    expect(load.value).toBe('1,000 kg');
    // feet alone carry no casters to check: no load asked
    fireEvent.change(screen.getByLabelText('Stands on'), { target: { value: 'leveling-feet' } });
    expect(screen.queryByLabelText(/^Working load/)).toBeNull();
  });

  it('starts in a metric shop’s units: lengths in millimeters and the load in kilograms', async () => {
    const { latest } = mount('assembly-bench', 'mm');
    const load = screen.getByLabelText(/^Working load/) as HTMLInputElement;
    await waitFor(() => expect(load.value).toBe('200 kg'));
    expect((screen.getByLabelText('millimeters') as HTMLInputElement).checked).toBe(true);
    expect(screen.getByLabelText('Width')).toHaveProperty('value', '1829 mm');
    fireEvent.change(load, { target: { value: '150' } });
    expect(bench(latest()).workingLoadKg).toBe(150);
  });

  it('places a case at a distance from the left end, where it stood, or against the case before it', async () => {
    const { latest, sent } = mount('assembly-bench');
    // the second rear cabinet stands against the first, 31 in along
    const place = screen.getByLabelText('Case 3 Placed along the bench');
    expect(screen.queryByLabelText('Case 3 Distance from the left end, inside the overhang')).toBeNull();
    fireEvent.change(place, { target: { value: 'set' } });
    expect(bench(latest()).cases[2]!.xMm).toBeCloseTo(toMm(31), 0);
    const at = screen.getByLabelText('Case 3 Distance from the left end, inside the overhang');
    expect(at).toHaveProperty('value', '31"');
    fireEvent.change(at, { target: { value: '30 1/2' } });
    expect(bench(latest()).cases[2]!.xMm).toBeCloseTo(toMm(30.5), 6);
    await waitFor(() => expect(bench(sent()).cases[2]!.xMm).toBeCloseTo(toMm(30.5), 6), { timeout: 3000 });
    // too far along for the top: the engine's words, beside the field
    fireEvent.change(at, { target: { value: '40' } });
    const case3 = screen.getByRole('group', { name: /^Case 3:/ });
    await waitFor(() => expect(within(case3).getByText(/case 3 reaches .* along the bench/)).toBeTruthy(), {
      timeout: 3000,
    });
    expect(at.getAttribute('aria-invalid')).toBe('true');
    fireEvent.change(place, { target: { value: 'next' } });
    expect(bench(latest()).cases[2]!.xMm).toBeNull();
  });

  it('keeps the construction choices folded away, each the shop’s usual until chosen', async () => {
    const { latest, sent } = mount('assembly-bench');
    const group = screen.getByText('Construction', { selector: 'summary' }).closest('details')!;
    expect(group.open).toBe(false);
    const joints = within(group).getByLabelText('Case joints') as HTMLSelectElement;
    expect(joints.value).toBe('shop');
    fireEvent.change(joints, { target: { value: 'butt' } });
    expect(latest().joinery).toBe('butt');
    fireEvent.change(within(group).getByLabelText('Drawer fronts'), { target: { value: 'graduated' } });
    expect(latest().drawerFronts).toBe('graduated');
    await waitFor(() => expect(sent()).toMatchObject({ joinery: 'butt', drawerFronts: 'graduated' }), {
      timeout: 3000,
    });
    fireEvent.change(joints, { target: { value: 'shop' } });
    expect('joinery' in latest()).toBe(false);
    // the torsion top's grid, in inches
    const grid = within(group).getByLabelText('Top grid, rib centers');
    expect(grid).toHaveProperty('value', '8"');
    fireEvent.change(grid, { target: { value: '10' } });
    expect(bench(latest()).top.gridSpacingMm).toBeCloseTo(toMm(10), 6);
    // a laminated top has no grid
    fireEvent.change(screen.getByLabelText('Top'), { target: { value: 'laminated' } });
    expect(within(group).queryByLabelText('Top grid, rib centers')).toBeNull();
  });

  it('opens the construction group when the engine refuses a choice in it, with the message beside the field', async () => {
    mount('assembly-bench');
    const group = screen.getByText('Construction', { selector: 'summary' }).closest('details')!;
    fireEvent.change(within(group).getByLabelText('Top grid, rib centers'), { target: { value: '2' } });
    await waitFor(() => expect(within(group).getByText(/is below the .* minimum/)).toBeTruthy(), { timeout: 3000 });
    expect(group.open).toBe(true);
  });

  it('offers drawer fronts only to a piece with drawers', async () => {
    const { latest } = mount('wall-cabinet');
    expect(screen.queryByLabelText('Drawer fronts')).toBeNull();
    expect(screen.queryByLabelText('Top grid, rib centers')).toBeNull();
    fireEvent.change(screen.getByLabelText('Case joints'), { target: { value: 'dado' } });
    expect(latest().joinery).toBe('dado');
    fireEvent.change(screen.getByLabelText('Bay 1, Section 1 Kind'), { target: { value: 'drawer' } });
    expect(screen.getByLabelText('Drawer fronts')).toBeTruthy();
  });
});

describe('plainPath', () => {
  it('keeps the budget at the foot of the form, with a link to the drawing, for a phone', async () => {
    mount('wall-cabinet');
    const link = await screen.findByRole('link', { name: 'See the drawing' });
    expect(link.getAttribute('href')).toBe('#piece-preview');
    expect(document.getElementById('piece-preview')).not.toBeNull();
    await waitFor(() => expect(link.parentElement?.textContent).toMatch(/^\$1,000\.00 to \$1,200\.00/));
  });

  it('names a field of the piece in the words on the screen', () => {
    expect(plainPath('items[0].spec.cases[1].bays[0].compartments[2].heightMm')).toBe(
      'Case 2, Bay 1, Section 3, height',
    );
    expect(plainPath('items[0].spec.cases[2].xMm')).toBe('Case 3, place along the bench');
    expect(plainPath('cases[1].bays[0].compartments[0].hingeSide')).toBe('Case 2, Bay 1, Section 1, hinged on');
    expect(plainPath('workingLoadKg')).toBe('working load');
    expect(plainPath('casterId')).toBe('casters');
    expect(plainPath('top.gridSpacingMm')).toBe('top, grid spacing');
    expect(plainPath('joinery')).toBe('case joints');
    expect(plainPath('bays[0].compartments')).toBe('Bay 1, sections');
    expect(plainPath('items[0].spec')).toBe('');
  });
});
