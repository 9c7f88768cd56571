import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { UploadSummary } from '@benchwright/contracts';
import { App } from './app';
import { createTestRouter } from './router';

afterEach(() => vi.unstubAllGlobals());

const upload = (over: Partial<UploadSummary>): UploadSummary => ({
  id: 'u1',
  name: 'garage wall.jpg',
  kind: 'image',
  mimeType: 'image/jpeg',
  sizeBytes: 200_000,
  by: { id: 'me', name: 'Priya' },
  stageKey: null,
  at: '2026-11-21T10:00:00Z',
  ...over,
});

describe('the files on the project page', () => {
  it('shows thumbnails linking to the full picture, the shop’s progress photos by stage, and attaches a file', async () => {
    let uploads = [
      upload({}),
      upload({ id: 'u2', name: 'plan.pdf', kind: 'pdf', mimeType: 'application/pdf' }),
      upload({ id: 'u3', name: 'carcass.jpg', by: { id: 'idris', name: 'Idris' }, stageKey: 'casework' }),
    ];
    const sent: FormData[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        const path = String(url);
        let body: unknown;
        if (path.endsWith('/auth/me'))
          body = { user: { id: 'me', email: 'p@example.com', name: 'Priya', role: 'client', emailVerified: true } };
        else if (path.endsWith('/projects/p1/uploads') && init?.method === 'POST') {
          sent.push(init.body as FormData);
          const u = upload({ id: 'u4', name: 'sketch.png', mimeType: 'image/png' });
          uploads = [...uploads, u];
          return new Response(JSON.stringify({ upload: u }), { status: 201 });
        } else if (path.endsWith('/projects/p1'))
          body = {
            project: {
              id: 'p1',
              status: 'requested',
              notes: '',
              client: { id: 'me', name: 'Priya' },
              items: [{ id: 'i', spec: { design: 'assembly-bench' }, quantity: 1 }],
              estimates: [],
              timeline: [],
              uploads,
              createdAt: '2026-11-20T10:00:00Z',
            },
          };
        else return new Response(JSON.stringify({ error: { code: 'not_found', message: 'x' } }), { status: 404 });
        return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
      }),
    );
    render(<App router={createTestRouter('/projects/p1')} />);
    const files = within(await screen.findByRole('region', { name: 'Photos and drawings' }));
    const thumb = files.getByRole('img', { name: 'garage wall.jpg' });
    expect(thumb.getAttribute('src')).toBe('/api/uploads/u1/thumbnail');
    expect(thumb.closest('a')?.getAttribute('href')).toBe('/api/uploads/u1');
    expect(files.getByRole('link', { name: /PDF/ }).getAttribute('href')).toBe('/api/uploads/u2');
    expect(files.getByRole('button', { name: 'Remove garage wall.jpg' })).toBeTruthy();
    const progress = within(screen.getByRole('region', { name: 'Progress photos' }));
    expect(progress.getByRole('img', { name: 'carcass.jpg' })).toBeTruthy();
    expect(progress.getByText(/Casework · Idris/)).toBeTruthy();
    expect(progress.queryByRole('button', { name: /Remove/ })).toBeNull();

    const file = new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47])], 'sketch.png', { type: 'image/png' });
    await userEvent.upload(files.getByLabelText('Attach a photo, sketch or PDF'), file);
    await waitFor(() => expect(sent).toHaveLength(1));
    expect((sent[0]!.get('file') as File).name).toBe('sketch.png');
    expect(await files.findByRole('img', { name: 'sketch.png' })).toBeTruthy();
  });
});
