import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { travellerQueryOptions, useTraveller, type JobTraveller } from '../api/jobs';
import { StageChecklist } from './stage-checklist';

const steps = [
  { key: 'cutting.breakdown', stage: 'cutting', text: 'Break down the 3 sheets to their layouts', done: null },
  {
    key: 'cutting.parts',
    stage: 'cutting',
    text: 'Every part cut, counted and labelled: 21 parts',
    done: { by: 'Idris', at: '2026-03-02T10:00:00Z' },
  },
  { key: 'material.sheets', stage: 'material', text: 'Sheet goods in', done: null },
];
const t = { job: { id: 'j1', stage: 'cutting' }, checklist: steps } as unknown as JobTraveller;

afterEach(() => vi.unstubAllGlobals());

describe('the stage checklist', () => {
  it("shows each stage's steps in the board's order with who ticked what, and ticks a step through the API", async () => {
    const puts: { url: string; body: unknown }[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        puts.push({ url: String(url), body: JSON.parse(String(init?.body)) });
        const checklist = steps.map((s) =>
          s.key === 'cutting.breakdown' ? { ...s, done: { by: 'Idris', at: '2026-03-03T10:00:00Z' } } : s,
        );
        return new Response(JSON.stringify({ checklist }), {
          status: 200,
          headers: { 'Content-Type': 'application/json' },
        });
      }),
    );
    const qc = new QueryClient();
    qc.setQueryData(travellerQueryOptions('j1').queryKey, t);
    // as on the job page: the checklist reads the traveller from the query the tick updates
    function Page() {
      const q = useTraveller('j1');
      return q.data ? (
        <StageChecklist t={q.data} stageLabel={(k) => k.toUpperCase()} order={['material', 'cutting']} />
      ) : null;
    }
    render(
      <QueryClientProvider client={qc}>
        <Page />
      </QueryClientProvider>,
    );
    const summaries = screen.getAllByText(/of \d+ done/).map((s) => s.parentElement!.textContent);
    expect(summaries).toEqual(['MATERIAL 0 of 1 done', 'CUTTING 1 of 2 done']);
    expect(screen.getByText(/Done by Idris, Mar 2, 2026/)).toBeTruthy();
    const box = within(screen.getByText(/Break down the 3 sheets/).closest('label')!).getByRole('checkbox');
    fireEvent.click(box);
    await screen.findByText(/Done by Idris, Mar 3, 2026/);
    expect(puts).toEqual([
      { url: expect.stringMatching(/\/jobs\/j1\/checks\/cutting\.breakdown$/), body: { done: true } },
    ]);
  });
});
