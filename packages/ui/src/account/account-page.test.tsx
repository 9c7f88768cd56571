import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AccountPage, describeBrowser } from './account-page';

const account = {
  id: 'u1',
  email: 'priya@example.com',
  name: 'Priya Natarajan',
  role: 'client',
  emailVerified: true,
  pendingEmail: null,
};
const sessions = [
  {
    id: 'a'.repeat(32),
    createdAt: '2026-11-30T10:00:00.000Z',
    lastSeenAt: '2026-12-01T09:00:00.000Z',
    userAgent: 'Mozilla/5.0 (X11; Linux x86_64) Chrome/120.0 Safari/537.36',
    current: true,
  },
  {
    id: 'b'.repeat(32),
    createdAt: '2026-11-20T10:00:00.000Z',
    lastSeenAt: null,
    userAgent: 'Mozilla/5.0 (Android 14; Mobile; rv:120.0) Gecko/120.0 Firefox/120.0',
    current: false,
  },
];

function stubApi() {
  const calls: { method: string; url: string; body?: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const method = init?.method ?? 'GET';
      calls.push({ method, url, body: init?.body ? JSON.parse(String(init.body)) : undefined });
      const json = (status: number, body: unknown) =>
        new Response(status === 204 ? null : JSON.stringify(body), {
          status,
          headers: { 'Content-Type': 'application/json' },
        });
      if (url === '/api/account' && method === 'GET') return json(200, { account });
      if (url === '/api/account/sessions') return json(200, { sessions });
      if (url === '/api/account/password')
        return json(400, {
          error: {
            code: 'invalid_input',
            message: 'The current password is not right.',
            issues: [{ path: 'currentPassword', message: 'the current password is not right' }],
          },
        });
      if (url.startsWith('/api/account/sessions/') && method === 'DELETE') return json(204, null);
      return json(404, { error: { code: 'not_found', message: 'no' } });
    }),
  );
  return calls;
}
afterEach(() => vi.unstubAllGlobals());

const renderPage = (onSignedOut = vi.fn()) =>
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <AccountPage onSignedOut={onSignedOut} />
    </QueryClientProvider>,
  );

describe('AccountPage', () => {
  it('lists the sessions with this browser marked, and ends another by its id', async () => {
    const calls = stubApi();
    renderPage();
    expect(await screen.findByRole('heading', { level: 1, name: 'Your account' })).toBeTruthy();
    const list = await screen.findByRole('list', { name: 'Signed-in sessions' });
    expect(list.textContent).toContain('Chrome on Linux');
    expect(list.textContent).toContain('this browser');
    expect(list.textContent).toContain('Firefox on Android');
    fireEvent.click(screen.getByRole('button', { name: /End the session of Firefox on Android/ }));
    await waitFor(() =>
      expect(calls).toContainEqual({ method: 'DELETE', url: `/api/account/sessions/${'b'.repeat(32)}` }),
    );
  });
  it('puts a wrong current password beside its field', async () => {
    stubApi();
    renderPage();
    const form = await screen.findByRole('form', { name: 'Your password' });
    const [current, next] = Array.from(form.querySelectorAll('input'));
    fireEvent.input(current!, { target: { value: 'wrong-one-here' } });
    fireEvent.input(next!, { target: { value: 'a-brand-new-password' } });
    fireEvent.submit(form);
    expect(await screen.findByText('the current password is not right')).toBeTruthy();
  });
});

describe('describeBrowser', () => {
  it('names the browser and the system, or says it does not know', () => {
    expect(describeBrowser('Mozilla/5.0 (iPhone; CPU iPhone OS 17_0 like Mac OS X) Safari/604.1')).toBe(
      'Safari on iOS',
    );
    expect(describeBrowser('')).toBe('An unknown browser');
  });
});
