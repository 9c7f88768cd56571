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
                  items: [{ design: 'assembly-bench', name: 'Rolling assembly bench', quantity: 1 }],
                  latestEstimate: null,
                  createdAt: '2026-11-20T10:00:00Z',
                  updatedAt: '2026-11-20T10:00:00Z',
                },
              ],
              nextCursor: null,
            },
          ],
    );
    render(<App router={createTestRouter('/projects')} />);
    await waitFor(() => expect(screen.getByRole('list', { name: 'My projects' })).toBeTruthy());
    expect(screen.getByText('Rolling assembly bench')).toBeTruthy();
    expect(screen.getByText('Estimate requested')).toBeTruthy();
  });
});

describe('the sign-in page', () => {
  const signedInApi = () => {
    let signedIn = false;
    mockApi((path) => {
      if (path.endsWith('/auth/sign-in')) {
        signedIn = true;
        return [200, { user: { id: 'u', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true } }];
      }
      if (path.endsWith('/auth/me') && signedIn)
        return [200, { user: { id: 'u', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true } }];
      if (path.includes('/projects?') && signedIn) return [200, { projects: [], nextCursor: null }];
      return [401, { error: { code: 'unauthenticated', message: 'Sign in to continue.' } }];
    });
  };
  const signInAt = async (url: string) => {
    signedInApi();
    const router = createTestRouter(url);
    render(<App router={router} />);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'p@example.com');
    await user.type(screen.getByLabelText('Password'), 'a-long-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    return router;
  };
  it('goes on to the redirect when it is a path of the portal', async () => {
    const router = await signInAt('/sign-in?redirect=%2Fdesigns%2Fbookcase');
    await waitFor(() => expect(router.state.location.pathname).toBe('/designs/bookcase'));
  });
  it('ignores a redirect to another site (//host, /\\host) and goes to my projects', async () => {
    for (const target of ['//evil.example/x', '/\\evil.example']) {
      const router = await signInAt(`/sign-in?redirect=${encodeURIComponent(target)}`);
      await waitFor(() => expect(router.state.location.pathname).toBe('/projects'));
      router.dispose();
      document.body.innerHTML = '';
    }
  });
});

describe('asking for an estimate', () => {
  const client = { id: 'u', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true };
  /** answers /api/projects POSTs in turn from `answers` ('network' = a dropped connection), recording their keys */
  const api = (answers: ('network' | 201 | 500)[]) => {
    const keys: (string | null)[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        const path = String(url);
        const json = (status: number, body: unknown) =>
          new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
        if (path.endsWith('/api/projects') && init?.method === 'POST') {
          keys.push(new Headers(init.headers).get('Idempotency-Key'));
          const a = answers[keys.length - 1];
          if (a === 'network') throw new TypeError('Failed to fetch');
          if (a === 500)
            return json(500, { error: { code: 'internal', message: 'Something went wrong on our side.' } });
          return json(201, { project: { id: 'p9' } });
        }
        if (path.endsWith('/auth/me')) return json(200, { user: client });
        // the preview and the project page are not this test's: left unanswered, so nothing retries after it
        return new Promise<Response>(() => {});
      }),
    );
    return keys;
  };
  it('sends one Idempotency-Key for an attempt, through a dropped connection and a second press of the button', async () => {
    const keys = api(['network', 500, 201]);
    const router = createTestRouter('/designs/bookcase');
    render(<App router={router} />);
    const user = userEvent.setup();
    const button = await screen.findByRole('button', { name: 'Request an estimate' });
    await user.click(button);
    // the dropped connection is retried by itself; the server's error is shown
    expect(await screen.findByText(/went wrong on our side/, {}, { timeout: 5000 })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Request an estimate' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/p9'));
    expect(keys).toHaveLength(3);
    expect(keys[0]).toMatch(/^[0-9a-f]{32}$/);
    expect(new Set(keys).size).toBe(1);
  });
  it('uses a new key when the request is changed after a failed attempt', async () => {
    const keys = api([500, 201]);
    const router = createTestRouter('/designs/bookcase');
    render(<App router={router} />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Request an estimate' }));
    expect(await screen.findByText(/went wrong on our side/)).toBeTruthy();
    await user.type(screen.getByLabelText('Anything the shop should know'), 'For the hall');
    await user.click(screen.getByRole('button', { name: 'Request an estimate' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/p9'));
    expect(keys).toHaveLength(2);
    expect(keys[0]).not.toBe(keys[1]);
  });
});
