import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { designs } from '@benchwright/pricing/geometry';
import { StartProjectForm } from './start-project-form';

const json = (body: unknown, status = 200) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('StartProjectForm', () => {
  it('sets a piece for a client who called with the portal’s own form, and sends every choice', async () => {
    const sent: unknown[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        const path = String(url);
        if (path.endsWith('/designs/bookcase'))
          return json({
            design: {
              ...designs.bookcase,
              options: {
                carcassMaterialId: [
                  { id: 'birch-ply-18', name: '3/4 in birch plywood' },
                  { id: 'mdf-18', name: '3/4 in MDF', note: 'paint-grade, no grain' },
                ],
              },
            },
          });
        if (path.endsWith('/quotes/preview'))
          return json({
            quote: {
              budget: { lowCents: 1, highCents: 2 },
              checks: [],
              items: [{ drawingSvg: '', massKg: 1 }],
              hours: 1,
            },
          });
        if (path.endsWith('/projects')) {
          sent.push(JSON.parse(String(init?.body)));
          return json({ project: { id: 'p1' } }, 201);
        }
        return json({ error: { code: 'not_found', message: 'x' } }, 404);
      }),
    );
    const onStarted = vi.fn();
    render(
      <QueryClientProvider client={new QueryClient()}>
        <StartProjectForm clientId="c1" onStarted={onStarted} />
      </QueryClientProvider>,
    );
    fireEvent.change(screen.getByLabelText('Design'), { target: { value: 'bookcase' } });
    const carcass = screen.getByLabelText('Case') as HTMLSelectElement;
    await waitFor(() => expect(carcass.options).toHaveLength(2));
    fireEvent.change(carcass, { target: { value: 'mdf-18' } });
    fireEvent.click(screen.getByRole('button', { name: 'Start the project' }));
    await waitFor(() => expect(onStarted).toHaveBeenCalledWith('p1'));
    expect(sent[0]).toMatchObject({
      clientId: 'c1',
      items: [{ spec: { design: 'bookcase', carcassMaterialId: 'mdf-18' }, quantity: 1 }],
    });
  });
});
