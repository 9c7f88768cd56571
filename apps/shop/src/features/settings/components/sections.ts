import type { ShopSettings } from '@benchwright/contracts';

/**
 * Where each of the engine's settings lives on the settings page, and how it is entered: one line a field, so a new
 * setting is one line here (a `number` in the engine's own unit, a `percent` of a stored fraction, `cents` entered as
 * dollars, or a `choice`). For example `{ key: 'shopRateCents', label: 'Shop rate, per hour', kind: 'cents' }` in
 * money, `{ key: 'kerfMm', label: 'Saw kerf', kind: 'number', step: 0.1, unit: 'mm' }` on the shop floor.
 * A test checks that every key of ShopSettings has a home.
 */
export type SettingKey = keyof ShopSettings;
export type FieldSpec =
  | { key: SettingKey; label: string; kind: 'number'; step?: number; unit?: string; hint?: string }
  | { key: SettingKey; label: string; kind: 'percent'; hint?: string }
  /** whole cents stored, dollars entered */
  | { key: SettingKey; label: string; kind: 'cents'; hint?: string }
  | { key: SettingKey; label: string; kind: 'choice'; options: readonly (readonly [string, string])[]; hint?: string };

export type SectionId = 'money' | 'floor' | 'capacity';

export const SETTING_SECTIONS: { id: SectionId; title: string; intro: string; fields: FieldSpec[] }[] = [
  {
    id: 'money',
    title: 'Money',
    intro: 'What estimates charge. A change prices the next preview and revision; a sent estimate keeps its figures.',
    fields: [
      {
        key: 'shopRateCents',
        label: 'Shop rate, per hour',
        kind: 'cents',
        hint: 'What a client pays for an hour of shop time.',
      },
      {
        key: 'labourCostPerHourCents',
        label: 'Labor cost, per hour',
        kind: 'cents',
        hint: 'What an hour costs the shop, for margins.',
      },
      { key: 'taxRate', label: 'Sales tax rate', kind: 'percent' },
      {
        key: 'taxApplies',
        label: 'Tax applies to',
        kind: 'choice',
        options: [
          ['materials', 'Materials, hardware and finish only'],
          ['all', 'The whole estimate, labour included'],
        ],
      },
      { key: 'depositRate', label: 'Deposit', kind: 'percent', hint: 'Of the total, paid to start the work.' },
      { key: 'estimateValidityDays', label: 'An estimate holds for', kind: 'number', step: 1, unit: 'days' },
      { key: 'materialMarkup', label: 'Material markup', kind: 'percent' },
      {
        key: 'consumablesRate',
        label: 'Consumables (glue, screws, abrasives)',
        kind: 'percent',
        hint: 'Of materials.',
      },
      {
        key: 'sheetCharging',
        label: 'Sheet goods are charged by',
        kind: 'choice',
        options: [
          ['whole', 'The whole sheet'],
          ['used_fraction', 'The part of the sheet used'],
        ],
      },
      {
        key: 'minSheetFraction',
        label: 'Least part of a sheet charged',
        kind: 'percent',
        hint: 'When charging by the part used.',
      },
      { key: 'bandingWaste', label: 'Edge banding waste', kind: 'percent' },
      { key: 'lumberWaste', label: 'Lumber waste', kind: 'percent' },
      {
        key: 'budgetSpread',
        label: 'Budget range shown to clients',
        kind: 'percent',
        hint: 'Plus or minus, around the priced total.',
      },
    ],
  },
  {
    id: 'floor',
    title: 'The shop floor',
    intro: 'How pieces are built and drawn.',
    fields: [
      {
        key: 'units',
        label: 'Units',
        kind: 'choice',
        options: [
          ['in', 'Imperial (inches)'],
          ['mm', 'Metric (millimetres)'],
        ],
      },
      { key: 'kerfMm', label: 'Saw kerf', kind: 'number', step: 0.1, unit: 'mm' },
      { key: 'sheetTrimMm', label: 'Trim off each sheet edge', kind: 'number', step: 0.5, unit: 'mm' },
      { key: 'revealMm', label: 'Reveal between fronts', kind: 'number', step: 0.5, unit: 'mm' },
      {
        key: 'maxDoorWidthMm',
        label: 'Widest single door',
        kind: 'number',
        step: 1,
        unit: 'mm',
        hint: 'A wider opening gets a pair.',
      },
      {
        key: 'caseJoinery',
        label: 'Case joinery',
        kind: 'choice',
        options: [
          ['dado', 'Dadoed into the sides'],
          ['butt', 'Butted and pocket-screwed'],
        ],
      },
      {
        key: 'drawerFronts',
        label: 'Drawer fronts in a stack',
        kind: 'choice',
        options: [
          ['equal', 'Equal heights'],
          ['graduated', 'Graduated, each taller than the one above'],
        ],
      },
      { key: 'drawerFrontStepMm', label: 'Graduated fronts: step', kind: 'number', step: 1, unit: 'mm' },
      {
        key: 'frontStyle',
        label: 'Doors and drawer fronts',
        kind: 'choice',
        options: [
          ['overlay', 'Overlay, lapping the case edges'],
          ['inset', 'Inset, inside their openings'],
        ],
        hint: 'Inset fronts keep the reveal on every side and hang on inset hinges.',
      },
      { key: 'overlayMm', label: 'Front overlay on the case edge', kind: 'number', step: 0.5, unit: 'mm' },
      {
        key: 'shelfLoadKPa',
        label: 'Design shelf load',
        kind: 'number',
        step: 0.001,
        unit: 'kPa',
        hint: '1.915 kPa is 40 lb/ft².',
      },
      { key: 'shelfSagRatio', label: 'Allowed shelf sag: span divided by', kind: 'number', step: 10 },
      { key: 'shelfCreepFactor', label: 'Long-term sag factor (creep)', kind: 'number', step: 0.05 },
    ],
  },
  {
    id: 'capacity',
    title: 'Capacity',
    intro: 'Used for the lead time clients are shown.',
    fields: [{ key: 'weeklyCapacityHours', label: 'Shop hours a week', kind: 'number', step: 1, unit: 'hours' }],
  },
];

/** The form's text for a stored value, and back. */
export function toInput(f: FieldSpec, v: unknown): string {
  if (f.kind === 'percent') return typeof v === 'number' ? String(Math.round(v * 100_000) / 1000) : '';
  if (f.kind === 'cents') return typeof v === 'number' ? (v / 100).toFixed(2) : '';
  return v === undefined || v === null ? '' : String(v);
}
export function fromInput(f: FieldSpec, s: string): unknown {
  if (f.kind === 'choice') return s;
  const n = s.trim() === '' ? Number.NaN : Number(s);
  if (!Number.isFinite(n)) return s;
  if (f.kind === 'cents') return Math.round(n * 100);
  return f.kind === 'percent' ? Math.round(n * 1000) / 100_000 : n;
}
