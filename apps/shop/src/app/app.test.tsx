import { render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

function signedInAs(role: 'owner' | 'builder' | 'client') {
  vi.stubGlobal('fetch', vi.fn(async (url: string) => {
    const body = String(url).endsWith('/auth/me') ? { user: { id: 'u', email: 'x@example.com', name: `A ${role}`, role, emailVerified: true } } : String(url).endsWith('/users') ? { users: [] } : { projects: [] };
    return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
  }));
}
afterEach(() => vi.unstubAllGlobals());

describe('the shop layout', () => {
  it('gives a builder only the board', async () => {
    signedInAs('builder');
    render(<App router={createTestRouter('/board')} />);
    const nav = await screen.findByRole('navigation', { name: 'Shop' });
    expect(within(nav).getAllByRole('link').map((a) => a.textContent)).toEqual(['Board']);
    expect(screen.getByRole('heading', { name: 'Production board' })).toBeTruthy();
  });
  it('tells a builder plainly when a page is not theirs', async () => {
    signedInAs('builder');
    render(<App router={createTestRouter('/team')} />);
    expect(await screen.findByText('Your role does not include this page.')).toBeTruthy();
  });
  it('gives the owner requests, board and team', async () => {
    signedInAs('owner');
    render(<App router={createTestRouter('/requests')} />);
    const nav = await screen.findByRole('navigation', { name: 'Shop' });
    expect(within(nav).getAllByRole('link').map((a) => a.textContent)).toEqual(['Requests', 'Board', 'Team']);
  });
  it('tells a client that this app is for the shop', async () => {
    signedInAs('client');
    render(<App router={createTestRouter('/board')} />);
    expect(await screen.findByRole('heading', { name: 'This app is for the shop' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the client portal' })).toBeTruthy();
    expect(screen.queryByRole('navigation', { name: 'Shop' })).toBeNull();
  });
});
