import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Board } from './board';

const stages = ['Material', 'Cutting', 'Casework', 'Drawers & doors', 'Finish', 'Ready', 'Delivered'].map(
  (label, position) => ({
    key: ['material', 'cutting', 'casework', 'drawers_doors', 'finish', 'ready', 'delivered'][position],
    label,
    position,
  }),
);
const job = {
  id: 'j1',
  project: { id: 'p1', status: 'in_production', notes: 'Walnut bookcase' },
  clientName: 'Tomasz',
  stage: 'finish',
  position: 0,
  builder: null,
  dueDate: null,
  hoursBudgeted: { total: 8 },
  hoursLogged: { total: 2 },
};

function board() {
  const patches: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const u = String(url);
      if (init?.method === 'PATCH') patches.push(JSON.parse(String(init.body)));
      const body = u.endsWith('/jobs/stages') ? { stages } : u.endsWith('/jobs') ? { jobs: [job] } : { job };
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <MemoryRouter>
        <Board />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return patches;
}
afterEach(() => vi.unstubAllGlobals());

describe('moving a job on the board', () => {
  it('asks before a move to Ready, and cancelling leaves the job where it was', async () => {
    const patches = board();
    const finish = await screen.findByRole('region', { name: 'Finish' });
    fireEvent.change(within(finish).getByLabelText('Move Tomasz to'), { target: { value: 'ready' } });
    const dialog = await screen.findByRole('dialog', { name: 'Move Tomasz to Ready?' });
    expect(dialog.textContent).toContain('ask for the balance');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(within(finish).getByRole('article', { name: 'Job for Tomasz' })).toBeTruthy();
    expect((within(finish).getByLabelText('Move Tomasz to') as HTMLSelectElement).value).toBe('finish');
    expect(patches).toEqual([]);
  });
  it('moves to Delivered once confirmed', async () => {
    const patches = board();
    const finish = await screen.findByRole('region', { name: 'Finish' });
    fireEvent.change(within(finish).getByLabelText('Move Tomasz to'), { target: { value: 'delivered' } });
    const dialog = await screen.findByRole('dialog', { name: 'Move Tomasz to Delivered?' });
    expect(patches).toEqual([]);
    fireEvent.click(within(dialog).getByRole('button', { name: 'Move to Delivered' }));
    await vi.waitFor(() => expect(patches).toEqual([{ stageKey: 'delivered' }]));
  });
  it('moves to a working stage without asking', async () => {
    const patches = board();
    const finish = await screen.findByRole('region', { name: 'Finish' });
    fireEvent.change(within(finish).getByLabelText('Move Tomasz to'), { target: { value: 'casework' } });
    await vi.waitFor(() => expect(patches).toEqual([{ stageKey: 'casework' }]));
    expect(screen.queryByRole('dialog')).toBeNull();
  });
});

describe('a progress photo from the card', () => {
  it('opens the camera and sends the photo to the job’s project as a progress photo', async () => {
    board();
    const finish = await screen.findByRole('region', { name: 'Finish' });
    const input = within(finish).getByLabelText('Add a photo to Finish') as HTMLInputElement;
    expect(input.accept).toBe('image/*');
    expect(input.getAttribute('capture')).toBe('environment');
    const file = new File([new Uint8Array([0xff, 0xd8, 0xff])], 'carcass.jpg', { type: 'image/jpeg' });
    fireEvent.change(input, { target: { files: [file] } });
    const fetchMock = vi.mocked(fetch);
    await vi.waitFor(() => {
      const post = fetchMock.mock.calls.find(([u, init]) => String(u) === '/api/projects/p1/uploads' && init?.body);
      expect(post).toBeTruthy();
      const body = post![1]!.body as FormData;
      expect(body.get('purpose')).toBe('progress');
      expect((body.get('file') as File).name).toBe('carcass.jpg');
    });
  });
});
