import { render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

function signedInAs(role: 'owner' | 'builder' | 'client') {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string) => {
      const u = String(url);
      const body = u.endsWith('/auth/me')
        ? { user: { id: 'u', email: 'x@example.com', name: `A ${role}`, role, emailVerified: true } }
        : u.endsWith('/users')
          ? { users: [] }
          : u.endsWith('/jobs/stages')
            ? {
                stages: [
                  { key: 'material', label: 'Material', position: 0 },
                  { key: 'cutting', label: 'Cutting', position: 1 },
                ],
              }
            : u.endsWith('/jobs')
              ? {
                  jobs: [
                    {
                      id: 'j1',
                      project: { id: 'p1', status: 'deposit_paid', notes: 'Walnut bookcase' },
                      clientName: 'Tomasz',
                      stage: 'material',
                      position: 0,
                      builder: null,
                      dueDate: null,
                      hoursBudgeted: { material: 1, total: 8 },
                      hoursLogged: { total: 9 },
                    },
                  ],
                }
              : { projects: [], nextCursor: null };
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
}
afterEach(() => vi.unstubAllGlobals());

describe('the shop layout', () => {
  it('gives a builder only the board', async () => {
    signedInAs('builder');
    render(<App router={createTestRouter('/board')} />);
    const nav = await screen.findByRole('navigation', { name: 'Shop' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((a) => a.textContent),
    ).toEqual(['Board']);
    expect(screen.getByRole('heading', { name: 'Production board' })).toBeTruthy();
    const material = await screen.findByRole('region', { name: 'Material' });
    expect(within(material).getByRole('article', { name: 'Job for Tomasz' })).toBeTruthy();
    // over budget is marked
    expect(within(material).getByLabelText('Hours used').textContent).toBe(
      '9.0 of 8.0 h used; this stage 0.0 of 1.0 h',
    );
  });
  it('tells a builder plainly when a page is not theirs', async () => {
    signedInAs('builder');
    render(<App router={createTestRouter('/team')} />);
    expect(await screen.findByText('Your role does not include this page.')).toBeTruthy();
  });
  it('gives the owner requests, clients, board, team, price book and settings', async () => {
    signedInAs('owner');
    render(<App router={createTestRouter('/requests')} />);
    const nav = await screen.findByRole('navigation', { name: 'Shop' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((a) => a.textContent),
    ).toEqual(['Overview', 'Requests', 'Clients', 'Board', 'Payments', 'Team', 'Mail', 'Price book', 'Settings']);
  });
  it('tells a client that this app is for the shop', async () => {
    signedInAs('client');
    render(<App router={createTestRouter('/board')} />);
    expect(await screen.findByRole('heading', { name: 'This app is for the shop' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the client portal' })).toBeTruthy();
    expect(screen.queryByRole('navigation', { name: 'Shop' })).toBeNull();
  });
});
