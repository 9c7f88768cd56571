import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PriceBookEntry } from '@benchwright/contracts';
import { PriceTable } from './price-table';

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

function show(answer: { status: number; body: unknown }) {
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
      <PriceTable kind="lumber" entries={entries} />
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
    expect(calls[0]).toMatchObject({
      url: '/api/price-book/lumber/maple-4-4',
      method: 'PATCH',
      body: { item: { pricePerBoardFootCents: -100, name: 'Maple 4/4' } },
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
