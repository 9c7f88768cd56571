import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { StageFeedback } from '@benchwright/contracts';
import { HoursFeedback } from './hours-feedback';

const stage = (over: Partial<StageFeedback>): StageFeedback => ({
  stage: 'material',
  label: 'Material',
  jobs: 0,
  ratios: [],
  medianRatio: null,
  suggestedFactor: null,
  standards: [],
  lastAction: null,
  ...over,
});
const casework = stage({
  stage: 'casework',
  label: 'Casework',
  jobs: 3,
  ratios: [1.2, 1.4, 1.2],
  medianRatio: 1.2,
  suggestedFactor: 1.2,
  standards: [
    { key: 'case-assembly', name: 'Glue up and square cases', driver: 'case', minutes: 60, newMinutes: 72 },
    { key: 'pocket-holes', name: 'Pocket holes', driver: 'pocket_hole', minutes: 0.5, newMinutes: 0.6 },
    { key: 'edge-band', name: 'Edge banding', driver: 'banding_metre', minutes: 10, newMinutes: 12 },
  ],
});
const feedback = { stages: [stage({}), casework], priceBookVersion: 7, units: 'in' };
const afterApply = {
  stages: [stage({}), { ...casework, jobs: 0, ratios: [], medianRatio: null, suggestedFactor: null, standards: [] }],
  priceBookVersion: 8,
  units: 'in',
  applied: { stage: 'casework', factor: 1.2, version: 8, changes: casework.standards },
};

function mount() {
  const calls: { url: string; method: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const method = init?.method ?? 'GET';
      calls.push({ url: String(url), method, body: init?.body ? JSON.parse(String(init.body)) : undefined });
      const body = method === 'POST' ? afterApply : feedback;
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <HoursFeedback />
    </QueryClientProvider>,
  );
  return calls;
}
afterEach(() => vi.unstubAllGlobals());

describe('applying an hours suggestion', () => {
  it('first shows each standard old → new and applies only once confirmed, with the version seen', async () => {
    const calls = mount();
    fireEvent.click(await screen.findByRole('button', { name: 'Apply the Casework suggestion' }));
    const dialog = screen.getByRole('dialog', { name: 'Apply the Casework suggestion' });
    const row = within(dialog).getByText('Glue up and square cases').closest('tr')!;
    expect(row.textContent).toContain('60 min per case');
    expect(row.textContent).toContain('→ 72 min per case');
    expect(within(dialog).getByText('Pocket holes').closest('tr')!.textContent).toContain('→ 0.6 min per pocket hole');
    // an imperial shop reads a per-metre standard per foot: 10 min a metre is 3.05 min a foot
    expect(within(dialog).getByText('Edge banding').closest('tr')!.textContent).toContain('3.05 min per foot banded');
    // nothing is sent until the owner confirms
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);

    fireEvent.click(within(dialog).getByRole('button', { name: 'Apply to the price book' }));
    await screen.findByText(/changed in price-book version 8/);
    expect(calls.filter((c) => c.method === 'POST')).toEqual([
      { url: '/api/hours-feedback/casework/apply', method: 'POST', body: { version: 7 } },
    ]);
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Apply the Casework suggestion' })).toBeNull();
  });

  it('sends nothing when the owner cancels', async () => {
    const calls = mount();
    fireEvent.click(await screen.findByRole('button', { name: 'Apply the Casework suggestion' }));
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
  });
});
