import type { PriceColumn } from '@benchwright/contracts';

/** A field's value as the table shows and edits it: prices in dollars, as the CSV writes them; numbers without float noise. */
export function showValue(c: PriceColumn, v: unknown): string {
  if (v === undefined || v === null) return '';
  if (c.type === 'money') return (Number(v) / 100).toFixed(2);
  if (c.type === 'json') return JSON.stringify(v);
  // a number as a person wrote it: 0.67, not the float 0.6699999999999999 that arithmetic left behind
  if (c.type === 'number' && typeof v === 'number') return String(Number(v.toPrecision(12)));
  return String(v);
}

/** What was typed into a field, as the API takes it; an empty field is left out. */
export function readValue(c: PriceColumn, text: string): unknown {
  const t = text.trim();
  if (t === '') return undefined;
  switch (c.type) {
    case 'money':
      return Number.isFinite(Number(t)) ? Math.round(Number(t) * 100) : t;
    case 'number':
      return Number.isFinite(Number(t)) ? Number(t) : t;
    case 'boolean':
      return t === 'true' || t === 'yes';
    case 'json':
      try {
        return JSON.parse(t) as unknown;
      } catch {
        return t;
      }
    default:
      return t;
  }
}

/** A column's heading: its CSV name in words. */
export const heading = (c: PriceColumn) =>
  c.column
    .replace(/_usd$/, ' ($)')
    .replace(/_/g, ' ')
    .replace(/^./, (s) => s.toUpperCase());

/** The API's `item.<field>` issues, by field. */
export function fieldErrors(issues: { path: string; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) {
    const field = i.path.startsWith('item.') ? i.path.slice(5).split('.')[0]! : '';
    if (!(field in out)) out[field] = i.message;
  }
  return out;
}
