import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { EstimateView as Estimate } from '@benchwright/contracts';
import { EstimateView } from './estimate-view';

afterEach(() => vi.unstubAllGlobals());

const estimate = (over: Partial<Estimate>): Estimate => ({
  id: 'e1',
  projectId: 'p1',
  number: 'E-P1',
  revision: 1,
  status: 'sent',
  units: 'in',
  replacedBy: null,
  version: 2,
  validUntil: '2026-12-30T00:00:00Z',
  sentAt: '2026-12-01T00:00:00Z',
  acceptedAt: null,
  acceptedName: null,
  lines: [],
  totals: { subtotalCents: 0, discountCents: 0, taxCents: 0, totalCents: 0, depositCents: 0, balanceCents: 0 },
  drawings: [],
  choices: [],
  checks: [],
  ...over,
});

function show(e: Estimate) {
  vi.stubGlobal(
    'fetch',
    vi.fn(
      async () =>
        new Response(JSON.stringify({ estimate: e }), { status: 200, headers: { 'Content-Type': 'application/json' } }),
    ),
  );
  render(
    <QueryClientProvider client={new QueryClient()}>
      <EstimateView estimateId="e1" canAct={false} depositDue={false} />
    </QueryClientProvider>,
  );
}

describe('the estimate in the portal', () => {
  it('lists the client’s choices as the revision was priced', async () => {
    show(
      estimate({
        choices: [
          [
            { label: 'Case', value: '3/4 in birch plywood' },
            { label: 'Trim', value: 'Black walnut, 3 1/2 in wide, 3/4 in thick' },
            { label: 'Finish', value: 'No finish' },
          ],
        ],
      }),
    );
    const list = within(await screen.findByRole('region', { name: 'Your choices' }));
    expect(list.getByText('Trim').nextElementSibling?.textContent).toBe('Black walnut, 3 1/2 in wide, 3/4 in thick');
    expect(list.getByText('Finish').nextElementSibling?.textContent).toBe('No finish');
  });

  it('shows no choices for a revision recorded before they were kept', async () => {
    show(estimate({ choices: [] }));
    expect(await screen.findByText(/Download the PDF/)).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Your choices' })).toBeNull();
  });
});
