import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ImportPreview as Preview } from '@benchwright/contracts';
import { CsvImport } from './csv-import';
import { ImportPreview } from './import-preview';

const ply = {
  id: 'birch-ply-18',
  name: '3/4 in birch plywood',
  kind: 'plywood',
  nominalThicknessIn: 0.75,
  thicknessMm: 18,
  sheetLengthMm: 2440,
  sheetWidthMm: 1220,
  grain: 'lengthwise',
  densityKgM3: 680,
  modulusMPa: 9000,
  priceCents: 6800,
};
const changed: Preview = {
  added: [{ ...ply, id: 'oak-ply-18', name: '3/4 in oak plywood', priceCents: 9150 }],
  changed: [
    { id: 'birch-ply-18', before: { ...ply, retired: false }, after: { ...ply, priceCents: 7250, retired: false } },
  ],
  errors: [],
};
const imperial = { units: 'in' as const };
afterEach(() => vi.unstubAllGlobals());

describe('the import preview', () => {
  it('shows the rows to add and each changed field with its old and new value, and confirms', () => {
    const onConfirm = vi.fn();
    render(
      <ImportPreview kind="sheet-goods" cu={imperial} preview={changed} onConfirm={onConfirm} onCancel={() => {}} />,
    );
    const add = screen.getByRole('table', { name: 'Rows to add' });
    expect(within(add).getByText('oak-ply-18')).toBeTruthy();
    expect(within(add).getByText('91.50')).toBeTruthy();
    // in the shop's units, as the table reads: an 18 mm sheet is 23/32 in, a 2440 mm one 96 1/16 in long
    expect(within(add).getByRole('columnheader', { name: 'Thickness (in)' })).toBeTruthy();
    expect(
      within(add)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual(expect.arrayContaining(['23/32', '96 1/16', '3/4']));
    const change = screen.getByRole('table', { name: 'Rows to change' });
    const rows = within(change).getAllByRole('row');
    // the header and one row: only the price differs
    expect(rows).toHaveLength(2);
    expect(rows[1]!.textContent).toBe('birch-ply-18Price ($)68.0072.50');
    const confirm = screen.getByRole('button', { name: 'Confirm the import' }) as HTMLButtonElement;
    expect(confirm.disabled).toBe(false);
    fireEvent.click(confirm);
    expect(onConfirm).toHaveBeenCalledOnce();
  });

  it('lists errors by row and column, and will not confirm while there is any', () => {
    const preview: Preview = {
      ...changed,
      errors: [{ row: 4, column: 'price_usd', message: 'Too small: expected number to be >=0' }],
    };
    render(
      <ImportPreview kind="sheet-goods" cu={imperial} preview={preview} onConfirm={() => {}} onCancel={() => {}} />,
    );
    const errors = screen.getByRole('table', { name: 'Errors' });
    expect(within(errors).getByRole('row', { name: /4 price_usd Too small/ })).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Confirm the import' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('always asks the API for the preview first, and saves only on confirm', async () => {
    const calls: { url: string; type: string | null; body: unknown }[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        calls.push({ url: String(url), type: new Headers(init?.headers).get('content-type'), body: init?.body });
        const body = String(url).includes('dryRun=1') ? { preview: changed } : { preview: changed, version: 7 };
        return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
      }),
    );
    render(
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <CsvImport kind="sheet-goods" cu={imperial} label="Sheet goods" />
      </QueryClientProvider>,
    );
    const file = new File(['id,name\n'], 'sheet-goods.csv', { type: 'text/csv' });
    fireEvent.change(screen.getByLabelText('Import sheet goods CSV'), { target: { files: [file] } });
    await screen.findByRole('table', { name: 'Rows to change' });
    expect(calls).toEqual([
      { url: '/api/price-book/sheet-goods/import?dryRun=1', type: 'text/csv; charset=utf-8', body: 'id,name\n' },
    ]);
    fireEvent.click(screen.getByRole('button', { name: 'Confirm the import' }));
    expect(await screen.findByText(/Imported: 1 added, 1 changed \(price book version 7\)/)).toBeTruthy();
    expect(calls[1]).toEqual({
      url: '/api/price-book/sheet-goods/import',
      type: 'text/csv; charset=utf-8',
      body: 'id,name\n',
    });
  });
});
