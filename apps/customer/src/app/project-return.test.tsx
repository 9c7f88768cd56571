import { render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

afterEach(() => vi.unstubAllGlobals());

describe('the project page on the return from checkout', () => {
  it('asks once for the payment to be recorded, then shows it paid', async () => {
    let status = 'accepted';
    const confirms: unknown[] = [];
    const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
      const path = String(url);
      let body: unknown;
      if (path.endsWith('/auth/me'))
        body = { user: { id: 'u', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true } };
      else if (path.endsWith('/payments/confirm')) {
        confirms.push(JSON.parse(String(init?.body)));
        status = 'deposit_paid';
        body = { payment: { id: 'pay', kind: 'deposit', status: 'paid', amountCents: 5000 } };
      } else if (path.endsWith('/projects/p1'))
        body = {
          project: {
            id: 'p1',
            status,
            notes: '',
            client: { id: 'u', name: 'Priya' },
            items: [{ id: 'i', spec: { design: 'assembly-bench' }, quantity: 1 }],
            estimates: [],
            timeline: [],
            createdAt: '2026-11-20T10:00:00Z',
          },
        };
      else return new Response(JSON.stringify({ error: { code: 'not_found', message: 'x' } }), { status: 404 });
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    });
    vi.stubGlobal('fetch', fetchMock);
    render(<App router={createTestRouter('/projects/p1?session_id=cs_test_abc')} />);
    expect(await screen.findByText(/your deposit is paid/)).toBeTruthy();
    expect(confirms).toEqual([{ sessionId: 'cs_test_abc' }]);
  });
});
