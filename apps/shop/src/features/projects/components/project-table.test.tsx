import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ProjectSummary } from '@benchwright/contracts';
import { ProjectTable } from './project-table';

const project = (n: number, status: ProjectSummary['status'] = 'requested'): ProjectSummary => ({
  id: `p${n}`,
  status,
  notes: '',
  client: { id: `c${n}`, name: `Client ${n}` },
  items: [{ design: 'bookcase', name: 'Bookcase', quantity: 2 }],
  latestEstimate: null,
  createdAt: '2026-11-20T10:00:00Z',
  updatedAt: '2026-11-20T10:00:00Z',
});

/** The API as the table sees it: every query string it asked, and a second page behind the first. */
function stubApi() {
  const asked: URLSearchParams[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string) => {
      const search = new URLSearchParams(String(url).split('?')[1]);
      asked.push(search);
      const body = search.get('cursor')
        ? { projects: [project(3)], nextCursor: null }
        : { projects: [project(1), project(2, 'estimating')], nextCursor: 'next-page' };
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return asked;
}
afterEach(() => vi.unstubAllGlobals());

function renderTable() {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <MemoryRouter>
        <ProjectTable empty="No requests yet." linkTo={(id) => `/requests/${id}`} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('ProjectTable', () => {
  it('asks for the open requests newest first, then the next page on "Load more"', async () => {
    const asked = stubApi();
    renderTable();
    expect(await screen.findByRole('link', { name: 'Client 1' })).toBeTruthy();
    expect(screen.getAllByText('2 x Bookcase')).toHaveLength(2);
    expect(asked[0]!.get('sort')).toBe('created');
    expect(asked[0]!.get('dir')).toBe('desc');
    expect(asked[0]!.get('status')!.split(',')).not.toContain('in_production');
    await userEvent.click(screen.getByRole('button', { name: 'Load more' }));
    expect(await screen.findByRole('link', { name: 'Client 3' })).toBeTruthy();
    expect(asked.at(-1)!.get('cursor')).toBe('next-page');
    expect(screen.queryByRole('button', { name: 'Load more' })).toBeNull();
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(4);
  });

  it('sends the status, the search and the sort the owner picks', async () => {
    const asked = stubApi();
    renderTable();
    await screen.findByRole('link', { name: 'Client 1' });
    await userEvent.selectOptions(screen.getByLabelText('Show'), 'all');
    await waitFor(() => expect(asked.at(-1)!.has('status')).toBe(false));
    await userEvent.selectOptions(screen.getByLabelText('Show'), 'estimate_sent');
    await waitFor(() => expect(asked.at(-1)!.get('status')).toBe('estimate_sent'));
    await userEvent.type(screen.getByLabelText('Search'), 'garage');
    await waitFor(() => expect(asked.at(-1)!.get('q')).toBe('garage'));
    await userEvent.click(screen.getByRole('button', { name: 'Client' }));
    await waitFor(() => expect(asked.at(-1)!.get('sort')).toBe('client'));
    expect(asked.at(-1)!.get('dir')).toBe('asc');
    await userEvent.click(screen.getByRole('button', { name: /Client/ }));
    await waitFor(() => expect(asked.at(-1)!.get('dir')).toBe('desc'));
  });
});
