import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

function mockApi(handler: (path: string, init?: RequestInit) => [number, unknown]) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const [status, body] = handler(String(url), init);
      return new Response(status === 204 ? null : JSON.stringify(body), {
        status,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
}
afterEach(() => vi.unstubAllGlobals());

describe('the sign-up page', () => {
  it('shows field errors beside the fields and keeps what was typed', async () => {
    mockApi(() => [401, { error: { code: 'unauthenticated', message: 'Sign in to continue.' } }]);
    render(<App router={createTestRouter('/sign-up')} />);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your name'), 'Ada');
    await user.type(screen.getByLabelText('E-mail'), 'not-an-email');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('enter a valid e-mail address')).toBeTruthy();
    expect(screen.getByText('use at least 10 characters')).toBeTruthy();
    expect((screen.getByLabelText('E-mail') as HTMLInputElement).value).toBe('not-an-email');
    expect((screen.getByLabelText('Your name') as HTMLInputElement).value).toBe('Ada');
  });

  it("puts the server's answer for a taken e-mail on the page, keeping the form", async () => {
    mockApi((path) =>
      path.endsWith('/auth/sign-up')
        ? [
            409,
            {
              error: {
                code: 'conflict',
                message: 'An account with this e-mail already exists; sign in or reset the password.',
              },
            },
          ]
        : [401, { error: { code: 'unauthenticated', message: 'x' } }],
    );
    render(<App router={createTestRouter('/sign-up')} />);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your name'), 'Priya');
    await user.type(screen.getByLabelText('E-mail'), 'priya@example.com');
    await user.type(screen.getByLabelText('Password'), 'a-long-password');
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText(/already exists/)).toBeTruthy();
    expect((screen.getByLabelText('E-mail') as HTMLInputElement).value).toBe('priya@example.com');
  });
});

describe('my projects', () => {
  it('sends a visitor who is not signed in to the sign-in page', async () => {
    mockApi(() => [401, { error: { code: 'unauthenticated', message: 'Sign in to continue.' } }]);
    render(<App router={createTestRouter('/projects')} />);
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
  });
  it("lists the client's projects with their status", async () => {
    mockApi((path) =>
      path.endsWith('/auth/me')
        ? [200, { user: { id: 'u', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true } }]
        : [
            200,
            {
              projects: [
                {
                  id: 'p1',
                  status: 'requested',
                  notes: 'For the garage',
                  client: { id: 'u', name: 'Priya' },
                  items: [{ id: 'i', spec: { design: 'assembly-bench' }, quantity: 1 }],
                  estimates: [],
                  timeline: [],
                  createdAt: '2026-11-20T10:00:00Z',
                },
              ],
            },
          ],
    );
    render(<App router={createTestRouter('/projects')} />);
    await waitFor(() => expect(screen.getByRole('list', { name: 'My projects' })).toBeTruthy());
    expect(screen.getByText('Rolling assembly bench')).toBeTruthy();
    expect(screen.getByText('Estimate requested')).toBeTruthy();
  });
});
