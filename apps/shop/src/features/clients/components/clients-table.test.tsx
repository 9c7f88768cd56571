import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ClientsTable } from './clients-table';

const clients = [
  {
    id: 'c1',
    name: 'Priya Natarajan',
    email: 'priya@example.com',
    phone: '',
    claimed: true,
    projectCount: 2,
    acceptedCents: 150_500,
    paidCents: 115_000,
    lastActivityAt: '2026-12-01T10:00:00.000Z',
  },
  {
    id: 'c2',
    name: 'Hollis Reed',
    email: 'hollis@example.com',
    phone: '555-0111',
    claimed: false,
    projectCount: 0,
    acceptedCents: 0,
    paidCents: 0,
    lastActivityAt: '2026-11-01T10:00:00.000Z',
  },
];

/** The API stand-in: the clients a page at a time (`limit`), the cursor the index of the next one. */
function withClients(pageSize?: number) {
  const urls: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string) => {
      urls.push(String(url));
      const qs = new URL(String(url), 'http://x').searchParams;
      const from = Number(qs.get('cursor') ?? 0);
      const limit = Number(qs.get('limit') ?? 50);
      const page = clients.slice(from, from + limit);
      const nextCursor = from + limit < clients.length ? String(from + limit) : null;
      return new Response(JSON.stringify({ clients: page, nextCursor }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <MemoryRouter>
        <ClientsTable linkTo={(id) => `/clients/${id}`} pageSize={pageSize} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return urls;
}
afterEach(() => vi.unstubAllGlobals());

describe('the clients table', () => {
  it('shows each client’s figures and links to their page', async () => {
    withClients();
    const link = await screen.findByRole('link', { name: 'Priya Natarajan' });
    expect(link.getAttribute('href')).toBe('/clients/c1');
    expect(screen.getByText('$1,505.00')).toBeTruthy();
    expect(screen.getByText('$1,150.00')).toBeTruthy();
    expect(screen.getByText(/has not claimed the account yet/)).toBeTruthy();
  });

  it('asks the API to sort by a column, the other way on a second click, and to search', async () => {
    const urls = withClients();
    await screen.findByRole('link', { name: 'Priya Natarajan' });
    expect(urls.at(-1)).toContain('sort=activity&order=desc');
    fireEvent.click(screen.getByRole('button', { name: 'Client' }));
    await vi.waitFor(() => expect(urls.at(-1)).toContain('sort=name&order=asc'));
    fireEvent.click(screen.getByRole('button', { name: /Client/ }));
    await vi.waitFor(() => expect(urls.at(-1)).toContain('sort=name&order=desc'));
    fireEvent.change(screen.getByLabelText('Search clients'), { target: { value: 'hol' } });
    await vi.waitFor(() => expect(urls.at(-1)).toContain('q=hol'));
  });

  it('loads the next page by the cursor the API gave, keeping the rows already shown', async () => {
    const urls = withClients(1);
    await screen.findByRole('link', { name: 'Priya Natarajan' });
    expect(screen.queryByRole('link', { name: 'Hollis Reed' })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Load more' }));
    await screen.findByRole('link', { name: 'Hollis Reed' });
    expect(screen.getByRole('link', { name: 'Priya Natarajan' })).toBeTruthy();
    expect(urls.at(-1)).toContain('cursor=1');
    expect(screen.queryByRole('button', { name: 'Load more' })).toBeNull();
  });
});
