import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FailedMailList } from './failed-mail-list';

function withMail(mails: unknown[]) {
  const calls: { url: string; method: string }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url: String(url), method: init?.method ?? 'GET' });
      const body = String(url).endsWith('/retry') ? { mail: { id: 'm1' } } : { mails };
      return new Response(JSON.stringify(body), {
        status: String(url).endsWith('/retry') ? 202 : 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <FailedMailList />
    </QueryClientProvider>,
  );
  return calls;
}
afterEach(() => vi.unstubAllGlobals());

describe('the failed e-mails page', () => {
  it('lists what the mail server refused, with the error, and tries one again on request', async () => {
    const calls = withMail([
      {
        id: 'm1',
        to: 'guild@example.com',
        subject: 'Your estimate E-1A2B3C',
        attempts: 3,
        lastError: 'connect ECONNREFUSED 127.0.0.1:1025',
        nextAttemptAt: '2026-12-01T10:00:00.000Z',
        createdAt: '2026-12-01T09:59:00.000Z',
      },
    ]);
    const table = await screen.findByRole('table', { name: 'Failed e-mails' });
    const row = within(table).getByRole('row', { name: /guild@example\.com/ });
    expect(within(row).getByText('connect ECONNREFUSED 127.0.0.1:1025')).toBeTruthy();
    expect(within(row).getByText('3')).toBeTruthy();
    fireEvent.click(within(row).getByRole('button', { name: 'Try now' }));
    await vi.waitFor(() => expect(calls).toContainEqual({ url: '/api/mail/m1/retry', method: 'POST' }));
  });
  it('says so when every e-mail has gone out', async () => {
    withMail([]);
    expect(await screen.findByText('Every e-mail has gone out.')).toBeTruthy();
  });
});
