import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { VersionHistory } from './version-history';

const page1 = {
  versions: [
    {
      version: 3,
      createdAt: '2026-12-01T10:00:00.000Z',
      by: { id: 'u1', name: 'Maren Holt' },
      summary: 'Labour standards for Casework × 1.2 from hours (3 delivered jobs).',
    },
    {
      version: 2,
      createdAt: '2026-11-30T10:00:00.000Z',
      by: { id: 'u1', name: 'Maren Holt' },
      summary: 'Hardware imported from CSV: 0 added, 3 changed.',
    },
  ],
  nextCursor: 'abc',
};
const page2 = {
  versions: [{ version: 1, createdAt: '2026-11-01T10:00:00.000Z', by: null, summary: 'The demo price book.' }],
  nextCursor: null,
};

afterEach(() => vi.unstubAllGlobals());

describe('the price book’s history', () => {
  it('lists the changes, the latest first, and loads older ones by the cursor', async () => {
    const urls: string[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        urls.push(String(url));
        const body = String(url).includes('cursor=abc') ? page2 : page1;
        return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
      }),
    );
    render(
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <VersionHistory />
      </QueryClientProvider>,
    );
    expect(await screen.findByText(/Casework × 1.2 from hours/)).toBeTruthy();
    expect(screen.getAllByText('Maren Holt')).toHaveLength(2);
    fireEvent.click(screen.getByRole('button', { name: 'Show older changes' }));
    expect(await screen.findByText('The demo price book.')).toBeTruthy();
    expect(screen.getByText('Set up')).toBeTruthy();
    expect(urls.at(-1)).toContain('cursor=abc');
    expect(screen.queryByRole('button', { name: 'Show older changes' })).toBeNull();
  });
});
