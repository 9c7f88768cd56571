import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PriceBookEntry, PriceBookKind } from '@benchwright/contracts';
import { demoPriceBook } from '@benchwright/pricing';
import { PriceTable } from './price-table';
import type { CellUnits } from './cells';

const wood = (id: string, name: string, cents: number, retiredAt: string | null = null): PriceBookEntry => ({
  id,
  retiredAt,
  item: {
    id,
    name,
    species: name.split(' ')[0],
    roughThicknessIn: 1,
    densityKgM3: 600,
    modulusMPa: 10000,
    pricePerBoardFootCents: cents,
  },
});
const entries = [
  wood('walnut-4-4', 'Walnut 4/4', 1450),
  wood('maple-4-4', 'Maple 4/4', 700),
  wood('cherry-4-4', 'Cherry 4/4', 1100),
  wood('poplar-4-4', 'Poplar 4/4', 450, '2026-11-01T00:00:00.000Z'),
];

function show(
  answer: { status: number; body: unknown },
  kind: PriceBookKind = 'lumber',
  rows: PriceBookEntry[] = entries,
  cu: CellUnits = { units: 'in' },
) {
  const calls: { url: string; method: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url: String(url), method: init?.method ?? 'GET', body: JSON.parse(String(init?.body ?? 'null')) });
      return new Response(JSON.stringify(answer.body), {
        status: answer.status,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <PriceTable kind={kind} entries={rows} cu={cu} />
    </QueryClientProvider>,
  );
  return calls;
}
const ids = () =>
  within(screen.getByRole('table', { name: 'Lumber' }))
    .getAllByRole('row')
    .slice(1)
    .map((r) => r.querySelector('td')?.textContent);
afterEach(() => vi.unstubAllGlobals());

describe('a price-book table', () => {
  it('sorts by a column, filters, and hides retired items until asked', () => {
    show({ status: 200, body: {} });
    expect(ids()).toEqual(['walnut-4-4', 'maple-4-4', 'cherry-4-4']);
    fireEvent.click(screen.getByRole('button', { name: 'Price per board foot ($)' }));
    expect(ids()).toEqual(['maple-4-4', 'cherry-4-4', 'walnut-4-4']);
    fireEvent.change(screen.getByLabelText('Filter lumber'), { target: { value: 'walnut' } });
    expect(ids()).toEqual(['walnut-4-4']);
    fireEvent.change(screen.getByLabelText('Filter lumber'), { target: { value: '' } });
    fireEvent.click(screen.getByLabelText('Show retired'));
    expect(ids()).toEqual(['poplar-4-4(retired)', 'maple-4-4', 'cherry-4-4', 'walnut-4-4']);
  });

  it('edits in place and shows the API’s error beside the field', async () => {
    const calls = show({
      status: 400,
      body: {
        error: {
          code: 'invalid_input',
          message: 'Some fields need attention.',
          issues: [{ path: 'item.pricePerBoardFootCents', message: 'Too small: expected number to be >=0' }],
        },
      },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Edit maple-4-4' }));
    const price = screen.getByLabelText('Price per board foot ($) of maple-4-4');
    expect((price as HTMLInputElement).value).toBe('7.00');
    fireEvent.change(price, { target: { value: '-1' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect((await screen.findByRole('alert')).textContent).toBe('Too small: expected number to be >=0');
    expect(calls[0]).toEqual({
      url: '/api/price-book/lumber/maple-4-4',
      method: 'PATCH',
      body: { item: { pricePerBoardFootCents: -100 } },
    });
  });

  it('retires an item (there is no delete)', async () => {
    const calls = show({ status: 200, body: { entry: entries[0], version: 3 } });
    expect(screen.queryByRole('button', { name: /Delete/ })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Retire walnut-4-4' }));
    await vi.waitFor(() =>
      expect(calls).toContainEqual({
        url: '/api/price-book/lumber/walnut-4-4',
        method: 'PATCH',
        body: { retired: true },
      }),
    );
  });
});

/** The demo shop's items of a kind, as the API lists them. */
const demo = (list: { id?: string; key?: string }[]): PriceBookEntry[] =>
  list.map((item) => ({ id: String(item.id ?? item.key), retiredAt: null, item: item as Record<string, unknown> }));
const cell = (table: string, row: string, header: string) => {
  const t = within(screen.getByRole('table', { name: table }));
  const headers = t.getAllByRole('columnheader').map((h) => h.textContent);
  const i = headers.indexOf(header);
  expect(headers, `a column "${header}"`).toContain(header);
  const r = t.getAllByRole('row').find((x) => x.querySelector('td')?.textContent === row);
  if (!r) throw new Error(`no row ${row}`);
  return within(r).getAllByRole('cell')[i]?.textContent;
};

describe('a price-book table in the shop’s units', () => {
  it('reads inches, feet and pounds for an imperial shop', () => {
    show({ status: 200, body: {} }, 'sheet-goods', demo(demoPriceBook.sheetGoods));
    expect(cell('Sheet goods', 'birch-ply-18', 'Thickness (in)')).toBe('23/32'); // stored 18.26 mm
    expect(cell('Sheet goods', 'birch-ply-18', 'Sheet length (in)')).toBe('96');
    expect(cell('Sheet goods', 'birch-ply-18', 'Nominal thickness (in)')).toBe('3/4');
    expect(cell('Sheet goods', 'mdf-18', 'Kind')).toBe('MDF');
  });

  it('prices edge banding per foot for an imperial shop and per metre for a metric one', () => {
    const banding = demo([
      { id: 'oak-banding-22', name: 'Oak banding', widthMm: 22.2, pricePerMetreCents: 46 },
    ] as never);
    show({ status: 200, body: {} }, 'banding', banding);
    expect(cell('Edge banding', 'oak-banding-22', 'Price per ft ($)')).toBe('0.14'); // $0.46 x 0.3048
    expect(cell('Edge banding', 'oak-banding-22', 'Width (in)')).toBe('7/8');
    cleanup();
    show({ status: 200, body: {} }, 'banding', banding, { units: 'mm' });
    expect(cell('Edge banding', 'oak-banding-22', 'Price per m ($)')).toBe('0.46');
    expect(cell('Edge banding', 'oak-banding-22', 'Width (mm)')).toBe('22.2');
  });

  it('gives a caster’s rated load and weight in pounds, or kilograms', () => {
    show({ status: 200, body: {} }, 'hardware', demo(demoPriceBook.hardware));
    expect(cell('Hardware', 'caster-locking-5in', 'Rated load (lb)')).toBe('220'); // 100 kg
    expect(cell('Hardware', 'caster-locking-5in', 'Weight (lb)')).toBe('1.98'); // 0.9 kg
    expect(cell('Hardware', 'caster-locking-5in', 'Height (in)')).toBe('5 3/4');
    expect(cell('Hardware', 'caster-locking-5in', 'Kind')).toBe('caster');
    expect(cell('Hardware', 'leveling-foot', 'Kind')).toBe('leveling foot');
    cleanup();
    show({ status: 200, body: {} }, 'hardware', demo(demoPriceBook.hardware), { units: 'mm' });
    expect(cell('Hardware', 'caster-locking-5in', 'Rated load (kg)')).toBe('100');
    expect(cell('Hardware', 'caster-locking-5in', 'Height (mm)')).toBe('146.05');
  });

  it('names a labour standard’s driver in words, and its minutes per foot for an imperial shop', () => {
    const ops = demo([
      { key: 'edge_banding', name: 'Edge banding', driver: 'banding_metre', minutes: 1.5, stage: 'casework' },
      { key: 'drawer_box', name: 'Drawer boxes', driver: 'drawer_box', minutes: 35, stage: 'drawers_doors' },
    ] as never);
    show({ status: 200, body: {} }, 'labour', ops, { units: 'in', stageLabels: { drawers_doors: 'Boxes & fronts' } });
    expect(cell('Labour operations', 'edge_banding', 'Counted per')).toBe('foot banded');
    expect(cell('Labour operations', 'edge_banding', 'Minutes')).toBe('0.457'); // 1.5 min a metre
    expect(cell('Labour operations', 'drawer_box', 'Counted per')).toBe('drawer box');
    expect(cell('Labour operations', 'drawer_box', 'Stage')).toBe('Boxes & fronts');
    expect(screen.queryByText('banding_metre')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Edit edge_banding' }));
    const per = screen.getByLabelText('Counted per of edge_banding') as HTMLSelectElement;
    expect(per.selectedOptions[0]?.textContent).toBe('foot banded');
  });

  it('takes an edit in the shown units and sends the stored ones, leaving untouched cells alone', async () => {
    const calls = show({ status: 200, body: { entry: {}, version: 2 } }, 'sheet-goods', demo(demoPriceBook.sheetGoods));
    fireEvent.click(screen.getByRole('button', { name: 'Edit birch-ply-12' }));
    const thickness = screen.getByLabelText('Thickness (in) of birch-ply-12') as HTMLInputElement;
    expect(thickness.value).toBe('15/32'); // stored 11.9 mm
    fireEvent.change(thickness, { target: { value: '1/2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    await vi.waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toEqual({
      url: '/api/price-book/sheet-goods/birch-ply-12',
      method: 'PATCH',
      body: { item: { thicknessMm: 12.7 } },
    });
  });

  it('says beside the cell what it cannot read, and sends nothing', () => {
    const calls = show({ status: 200, body: {} }, 'sheet-goods', demo(demoPriceBook.sheetGoods));
    fireEvent.click(screen.getByRole('button', { name: 'Edit birch-ply-12' }));
    fireEvent.change(screen.getByLabelText('Thickness (in) of birch-ply-12'), { target: { value: 'half' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect(screen.getByRole('alert').textContent).toBe('write inches, e.g. 23/32 or 1 1/4');
    expect(calls).toEqual([]);
  });
});
