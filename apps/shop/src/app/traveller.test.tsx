import { fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

const job = {
  id: 'j1',
  project: { id: 'p1', status: 'deposit_paid', notes: 'Walnut bookcase' },
  clientName: 'Tomasz',
  stage: 'material',
  position: 0,
  builder: null,
  dueDate: null,
  hoursBudgeted: { material: 1, total: 1 },
  hoursLogged: { total: 0 },
};
const traveller = (layout: object) => ({
  job,
  units: 'in',
  pieces: [],
  materials: [],
  pickList: [],
  bandingMetres: [],
  hoursByStage: { material: 1 },
  totalHours: 1,
  massKg: 40,
  cautions: ['Eye and ear protection at every machine.'],
  layout,
});
const asPriced = { source: 'revision', revision: 1, at: '', note: 'Sheets as laid out for revision 1 on May 4, 2026.' };
const again = {
  source: 'relayout',
  revision: 1,
  at: '',
  note: 'Laid out again on May 9, 2026 with the stock of that day.',
};

function signedInAs(role: 'owner' | 'builder') {
  const calls: { url: string; method: string }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      const u = String(url);
      calls.push({ url: u, method: init?.method ?? 'GET' });
      const body = u.endsWith('/auth/me')
        ? { user: { id: 'u', email: 'x@example.com', name: `A ${role}`, role, emailVerified: true } }
        : u.endsWith('/users')
          ? { users: [] }
          : u.endsWith('/jobs/stages')
            ? { stages: [{ key: 'material', label: 'Material', position: 0 }] }
            : u.endsWith('/relayout')
              ? { traveller: traveller(again) }
              : u.endsWith('/traveller')
                ? { traveller: traveller(asPriced) }
                : {};
      return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return calls;
}
afterEach(() => vi.unstubAllGlobals());

describe('the traveller page', () => {
  it('says where the sheets come from, and lets the owner lay them out again with today’s stock', async () => {
    const calls = signedInAs('owner');
    vi.stubGlobal('confirm', () => true);
    render(<App router={createTestRouter('/jobs/j1')} />);
    expect(await screen.findByText(/Sheets as laid out for revision 1/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Lay out again with today’s stock' }));
    expect(await screen.findByText(/Laid out again on May 9, 2026/)).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST' && c.url.endsWith('/jobs/j1/relayout'))).toBe(true);
  });
  it('gives a builder the note but not the button', async () => {
    signedInAs('builder');
    render(<App router={createTestRouter('/jobs/j1')} />);
    expect(await screen.findByText(/Sheets as laid out for revision 1/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Lay out again with today’s stock' })).toBeNull();
  });
});

describe('the traveler in an imperial shop’s words', () => {
  it('reads pounds, feet, 1/32 in thicknesses, the due date, a Qty column and the piece section', async () => {
    const full = {
      ...traveller(asPriced),
      job: { ...job, dueDate: '2026-03-14' },
      massKg: 54.4311,
      pieces: [
        {
          title: 'Bookcase',
          quantity: 1,
          widthMm: 914.4,
          heightMm: 1828.8,
          depthMm: 304.8,
          finish: { name: 'Waterborne polyurethane, satin', coats: 3 },
          revealMm: 3,
          overlayMm: 18,
          joinery: ['Dadoes and grooves: 6, 1/4 in deep, glued'],
          choices: [{ label: 'Back', value: '1/4 in birch plywood, set in grooves' }],
          parts: [
            {
              name: 'Side',
              materialName: 'Birch plywood',
              stock: 'sheet',
              quantity: 2,
              lengthMm: 1828.8,
              widthMm: 292,
              thicknessMm: 18.26,
              grain: 'length',
              banding: '1 long',
            },
          ],
        },
      ],
      pickList: [{ name: 'Shelf pin, 5 mm', kind: 'shelf_pin', pieces: 16 }],
      bandingMetres: [{ name: 'Birch banding', metres: 37.08 }],
    };
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        const u = String(url);
        const body = u.endsWith('/auth/me')
          ? { user: { id: 'u', email: 'x@example.com', name: 'Idris', role: 'builder', emailVerified: true } }
          : u.endsWith('/jobs/stages')
            ? { stages: [{ key: 'material', label: 'Material', position: 0 }] }
            : u.endsWith('/traveller')
              ? { traveller: full }
              : {};
        return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
      }),
    );
    render(<App router={createTestRouter('/jobs/j1')} />);
    expect(await screen.findByRole('heading', { name: 'Traveler: Tomasz' })).toBeTruthy();
    expect(screen.getByText(/due Mar 14, 2026 · about 120 lb finished/)).toBeTruthy();
    expect(screen.getByText('Birch banding: 121.7 ft of edges to band (before waste)')).toBeTruthy();
    expect(screen.getByRole('cell', { name: '23/32"' })).toBeTruthy();
    const pick = screen.getByRole('table', { name: 'Pick list' });
    expect(within(pick).getByRole('columnheader', { name: 'Qty' })).toBeTruthy();
    expect(screen.queryByRole('columnheader', { name: 'Pieces' })).toBeNull();
    const piece = screen.getByRole('region', { name: 'Piece: Bookcase' });
    expect(piece.textContent).toContain('36" W x 72" H x 12" D');
    expect(piece.textContent).toContain('Waterborne polyurethane, satin, 3 coats');
    expect(piece.textContent).toContain('1/8" reveal, 23/32" overlay');
    expect(piece.textContent).toContain('Dadoes and grooves');
    expect(within(piece).getByText('Back').nextElementSibling?.textContent).toBe(
      '1/4 in birch plywood, set in grooves',
    );
  });
});
