import { render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { App } from './app';
import { createTestRouter } from './router';

afterEach(() => vi.unstubAllGlobals());

describe('the configurator’s lead time', () => {
  it('says when the piece could start, from the preview’s shop hours', async () => {
    const asked: string[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) => {
        const path = String(url);
        let body: unknown;
        if (path.endsWith('/auth/me'))
          return new Response(JSON.stringify({ error: { code: 'unauthenticated', message: 'Sign in.' } }), {
            status: 401,
          });
        if (path.endsWith('/quotes/preview'))
          body = {
            quote: {
              budget: { lowCents: 90_000, highCents: 110_000 },
              checks: [],
              items: [{ drawingSvg: '<svg></svg>', massKg: 40 }],
              hours: 35,
            },
          };
        else if (path.includes('/lead-time?')) {
          asked.push(path);
          body = { leadTime: { startWeek: 4, finishWeek: 5, startDate: '2026-12-21', finishDate: '2027-01-01' } };
        } else return new Response(JSON.stringify({ error: { code: 'not_found', message: 'x' } }), { status: 404 });
        return new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } });
      }),
    );
    render(<App router={createTestRouter('/designs/bookcase')} />);
    const note = await screen.findByLabelText('Lead time');
    expect(note.textContent).toMatch(/^Could start in about 3 weeks \(from Dec 21\), ready around Jan 1/);
    expect(asked).toEqual(['/api/lead-time?hours=35']);
  });
});
