import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ShopSettings } from '@benchwright/contracts';
import { SettingsForm } from './settings-form';
import { SETTING_SECTIONS } from './sections';

const settings = {
  version: 3,
  profile: { shopName: 'Fernhill Joinery', address: '14 Mill Lane', phone: '555-0142', email: 'shop@fernhill.example' },
  values: {
    revealMm: 3,
    overlayMm: 18,
    sheetCharging: 'whole',
    minSheetFraction: 0.25,
    materialMarkup: 0.35,
    consumablesRate: 0.05,
    taxRate: 0.0825,
    taxApplies: 'materials',
    depositRate: 0.5,
    estimateValidityDays: 30,
    budgetSpread: 0.15,
    shelfSagRatio: 600,
    shelfLoadKPa: 1.915,
    shelfCreepFactor: 1.5,
    bandingWaste: 0.15,
    lumberWaste: 0.3,
    units: 'in',
    weeklyCapacityHours: 40,
  },
  stages: [
    { key: 'material', label: 'Material', position: 0 },
    { key: 'casework', label: 'Casework', position: 1 },
  ],
  logo: false,
  updatedAt: '2026-12-02T05:00:00.000Z',
};

function withApi(patch: (body: unknown) => { status: number; body: unknown }) {
  const sent: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (_url: string, init?: RequestInit) => {
      if (init?.method === 'PATCH') {
        const body = JSON.parse(String(init.body));
        sent.push(body);
        const r = patch(body);
        return new Response(JSON.stringify(r.body), {
          status: r.status,
          headers: { 'Content-Type': 'application/json' },
        });
      }
      return new Response(JSON.stringify({ settings }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  render(
    <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
      <SettingsForm />
    </QueryClientProvider>,
  );
  return sent;
}
afterEach(() => vi.unstubAllGlobals());

describe('the settings page', () => {
  it('gives every engine setting a home in one section', () => {
    const placed = SETTING_SECTIONS.flatMap((s) => s.fields.map((f) => f.key)).sort();
    expect(placed).toEqual(Object.keys(ShopSettings.shape).sort());
  });

  it('sends percentages as the fractions the engine keeps, with the version read', async () => {
    const sent = withApi(() => ({ status: 200, body: { settings: { ...settings, version: 4 } } }));
    fireEvent.change(await screen.findByLabelText('Sales tax rate (%)'), { target: { value: '9.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save the settings' }));
    await screen.findByText(/Settings saved/);
    expect(sent[0]).toMatchObject({ version: 3, values: { taxRate: 0.095, depositRate: 0.5, units: 'in' } });
  });

  it('puts the API’s field errors beside their fields', async () => {
    withApi(() => ({
      status: 400,
      body: {
        error: {
          code: 'invalid_input',
          message: 'Some settings need attention.',
          issues: [{ path: 'values.taxRate', message: 'Too big: expected number to be <=0.5' }],
        },
      },
    }));
    const field = await screen.findByLabelText('Sales tax rate (%)');
    fireEvent.change(field, { target: { value: '90' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save the settings' }));
    expect(await screen.findByText('Too big: expected number to be <=0.5')).toBeTruthy();
    expect(field.getAttribute('aria-invalid')).toBe('true');
  });

  it('says when someone else saved first, and offers to reload', async () => {
    withApi(() => ({
      status: 409,
      body: { error: { code: 'conflict', message: 'Someone else changed the settings.' } },
    }));
    fireEvent.click(await screen.findByRole('button', { name: 'Save the settings' }));
    expect(await screen.findByText(/Someone else changed the settings since you opened this page/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Reload the settings' })).toBeTruthy();
  });
});
