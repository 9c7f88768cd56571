import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { OwnerEstimate } from '../api/estimates';
import { EstimateEditor } from './estimate-editor';

const estimate: OwnerEstimate = {
  id: 'e1',
  projectId: 'p1',
  number: 'E-P1',
  revision: 1,
  status: 'draft',
  units: 'in',
  replacedBy: null,
  version: 1,
  validUntil: null,
  sentAt: null,
  acceptedAt: null,
  acceptedName: null,
  lines: [],
  totals: { subtotalCents: 0, discountCents: 0, taxCents: 0, totalCents: 0, depositCents: 0, balanceCents: 0 },
  drawings: [],
  choices: [
    [
      { label: 'Trim', value: 'Black walnut, 3 1/2 in wide, 3/4 in thick' },
      { label: 'Arrangement', value: 'Main case 62 in wide with 2 bays' },
    ],
  ],
  checks: [],
  hoursByStage: {},
  layouts: [],
  costCents: 0,
};

describe('the estimate editor', () => {
  it('shows the owner the client’s choices the revision was priced with', () => {
    render(
      <QueryClientProvider client={new QueryClient()}>
        <EstimateEditor estimate={estimate} />
      </QueryClientProvider>,
    );
    const list = within(screen.getByRole('region', { name: "The client's choices" }));
    expect(list.getByText('Trim').nextElementSibling?.textContent).toBe('Black walnut, 3 1/2 in wide, 3/4 in thick');
    expect(list.getByText('Arrangement')).toBeTruthy();
  });
});
