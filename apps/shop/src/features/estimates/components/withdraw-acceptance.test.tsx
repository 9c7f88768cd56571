import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OwnerEstimate } from '../api/estimates';
import { WithdrawAcceptance } from './withdraw-acceptance';

const estimate = { id: 'e1', revision: 1, status: 'accepted' } as OwnerEstimate;

function withServer(answer: { status: number; body: unknown }) {
  const calls: { url: string; method: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({
        url: String(url),
        method: init?.method ?? 'GET',
        body: init?.body ? JSON.parse(String(init.body)) : null,
      });
      return new Response(JSON.stringify(answer.body), {
        status: answer.status,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <WithdrawAcceptance estimate={estimate} />
    </QueryClientProvider>,
  );
  return calls;
}
afterEach(() => vi.unstubAllGlobals());

describe('withdrawing an accepted revision', () => {
  it('asks for a reason first, then posts it to the withdraw route', async () => {
    const calls = withServer({ status: 200, body: { estimate: { ...estimate, status: 'withdrawn' } } });
    fireEvent.click(screen.getByRole('button', { name: 'Withdraw revision 1' }));
    expect(await screen.findByText('say why the revision is withdrawn')).toBeTruthy();
    expect(calls).toEqual([]);
    fireEvent.change(screen.getByLabelText(/Why withdraw it/), { target: { value: 'The walnut price went up.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Withdraw revision 1' }));
    await vi.waitFor(() =>
      expect(calls).toContainEqual({
        url: '/api/estimates/e1/withdraw',
        method: 'POST',
        body: { reason: 'The walnut price went up.' },
      }),
    );
  });
  it('shows the server’s refusal in its words', async () => {
    withServer({
      status: 409,
      body: {
        error: {
          code: 'conflict',
          message: 'The deposit for revision 1 is paid; an acceptance can be withdrawn only before that.',
        },
      },
    });
    fireEvent.change(screen.getByLabelText(/Why withdraw it/), { target: { value: 'Changed plans.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Withdraw revision 1' }));
    expect(await screen.findByText(/deposit for revision 1 is paid/)).toBeTruthy();
  });
});
