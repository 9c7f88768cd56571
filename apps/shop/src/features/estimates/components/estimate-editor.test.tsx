import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OwnerEstimate } from '../api/estimates';
import { EstimateEditor } from './estimate-editor';

const line = (id: string, description: string, quantity: number, unit: string, unitPriceCents: number) => ({
  id,
  group: 'other' as const,
  description,
  quantity,
  unit,
  unitPriceCents,
  amountCents: Math.round(quantity * unitPriceCents),
  source: 'computed' as const,
  costCents: 0,
  overrideReason: null,
});
const estimate = (units: 'in' | 'mm', status: 'draft' | 'sent' = 'draft') =>
  ({
    id: 'e1',
    projectId: 'p1',
    number: 'E-1',
    revision: 1,
    status,
    units,
    replacedBy: null,
    version: 3,
    validUntil: null,
    sentAt: null,
    acceptedAt: null,
    acceptedName: null,
    lines: [
      line('l1', 'Edge banding, white oak', 37.08, 'm', 150),
      line('l2', 'Finish, clear satin', 0.8, 'gal', 6000),
      line('l3', '3/4 in birch plywood', 2, 'sheet', 9500),
    ],
    totals: {
      subtotalCents: 0,
      discountCents: 0,
      taxCents: 0,
      totalCents: 0,
      depositCents: 0,
      balanceCents: 0,
    },
    drawings: [],
    choices: [],
    checks: [],
    hoursByStage: {},
    layouts: [],
    costCents: 0,
  }) as OwnerEstimate;

function mount(e: OwnerEstimate) {
  const bodies: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (_url: string, init?: RequestInit) => {
      bodies.push(init?.body ? JSON.parse(String(init.body)) : null);
      return new Response(JSON.stringify({ estimate: e }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <EstimateEditor estimate={e} />
    </QueryClientProvider>,
  );
  return bodies;
}
const row = (text: string) => screen.getByText(text).closest('tr')!;
afterEach(() => vi.unstubAllGlobals());

describe('the estimate editor’s quantities', () => {
  it('shows an imperial shop banding in feet and its price per foot, finish in gallons, sheets as counted', () => {
    mount(estimate('in'));
    const banding = row('Edge banding, white oak');
    expect((within(banding).getByLabelText('Line 1 quantity') as HTMLInputElement).value).toBe('121.65');
    expect(banding.textContent).toContain('ft');
    // $1.50 a metre is $0.46 a foot
    expect((within(banding).getByLabelText('Line 1 unit price') as HTMLInputElement).value).toBe('0.46');
    expect(banding.textContent).toContain('/ft');
    expect((screen.getByLabelText('Line 2 quantity') as HTMLInputElement).value).toBe('0.8');
    expect(row('Finish, clear satin').textContent).toContain('gal');
    expect((screen.getByLabelText('Line 3 quantity') as HTMLInputElement).value).toBe('2');
  });

  it('shows a metric shop finish in litres', () => {
    mount(estimate('mm'));
    expect((screen.getByLabelText('Line 2 quantity') as HTMLInputElement).value).toBe('3.03');
    expect(row('Finish, clear satin').textContent).toContain('L');
    expect((screen.getByLabelText('Line 1 quantity') as HTMLInputElement).value).toBe('37.08');
  });

  it('reads a sent revision’s quantities as a person writes them', () => {
    mount(estimate('in', 'sent'));
    expect(screen.getByLabelText('Line 1 quantity').textContent).toBe('121.7 ft');
    expect(screen.getByLabelText('Line 2 quantity').textContent).toBe('0.8 gal');
    expect(screen.getByLabelText('Line 3 quantity').textContent).toBe('2 sheets');
  });

  it('shows a sent revision’s prices and reasons as text, with no fields to type in', () => {
    mount(estimate('in', 'sent'));
    expect(within(screen.getByRole('table', { name: 'Line items' })).queryAllByRole('textbox')).toEqual([]);
    expect(screen.getByLabelText('Line 1 unit price').textContent).toBe('$0.46/ft'); // $1.50 a metre
    expect(screen.getByLabelText('Line 3 unit price').textContent).toBe('$95.00');
    expect(screen.getByLabelText('Line 3 reason').textContent).toBe('—');
  });

  it('saves a quantity left alone exactly as stored, and one typed in feet back in metres', async () => {
    const bodies = mount(estimate('in'));
    fireEvent.change(screen.getByLabelText('Line 1 quantity'), { target: { value: '100' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await vi.waitFor(() => expect(bodies).toHaveLength(1));
    const sent = bodies[0] as { lines: { quantity: number; unitPriceCents: number; unit: string }[] };
    expect(sent.lines[0]!.quantity).toBeCloseTo(30.48, 6);
    expect(sent.lines[0]).toMatchObject({ unit: 'm', unitPriceCents: 150 });
    expect(sent.lines[1]).toMatchObject({ quantity: 0.8, unit: 'gal', unitPriceCents: 6000 });
    expect(sent.lines[2]).toMatchObject({ quantity: 2, unit: 'sheet', unitPriceCents: 9500 });
  });
});

describe('the estimate editor’s choices', () => {
  it('shows the owner the client’s choices the revision was priced with', () => {
    mount({
      ...estimate('in'),
      choices: [
        [
          { label: 'Trim', value: 'Black walnut, 3 1/2 in wide, 3/4 in thick' },
          { label: 'Arrangement', value: 'Main case 62 in wide with 2 bays' },
        ],
      ],
    });
    const list = within(screen.getByRole('region', { name: "The client's choices" }));
    expect(list.getByText('Trim').nextElementSibling?.textContent).toBe('Black walnut, 3 1/2 in wide, 3/4 in thick');
    expect(list.getByText('Arrangement')).toBeTruthy();
  });
});
