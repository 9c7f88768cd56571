import type { Choice } from './choices';
import type { TravellerPart } from './traveller';
import { formatLength, toMm, type LengthUnit } from './units';

/*
 * The traveller's "Piece" section, apart from traveller.ts so the browser's
 * geometry bundle can write it without the pricing code.
 */

/**
 * What the builder needs to know of the piece before its parts: overall size,
 * the finish (its name carries the sheen) and coats, the fronts' reveal and
 * overlay, and the joinery. Optional: revisions recorded before it have none.
 */
export interface TravellerPiece {
  title: string;
  quantity: number;
  parts: TravellerPart[];
  widthMm?: number;
  heightMm?: number;
  depthMm?: number;
  finish?: { name: string; coats: number } | null;
  revealMm?: number;
  overlayMm?: number;
  /** inset fronts sit in their openings (no overlay); absent on revisions recorded before it: overlay */
  frontStyle?: 'overlay' | 'inset';
  joinery?: string[];
  /** the client's choices in plain words (choices.ts); absent in revisions recorded before they were kept */
  choices?: Choice[];
}

/**
 * The piece's joinery in the shop's words, from its parts.
 * @example joineryOf(parts, 'in') // ['Dadoes and grooves: 6, 1/4 in deep, glued', 'Pocket screws: 16 holes']
 */
export function joineryOf(
  parts: readonly { quantity: number; dados: number; pocketHoles: number }[],
  unit: LengthUnit = 'in',
): string[] {
  const dados = parts.reduce((s, p) => s + p.quantity * p.dados, 0);
  const pockets = parts.reduce((s, p) => s + p.quantity * p.pocketHoles, 0);
  // the carcass dado depth of the cut list (cut-list.ts): 1/4 in
  const depth = unit === 'in' ? '1/4 in' : `${Math.round(toMm(0.25) * 10) / 10} mm`;
  return [
    ...(dados ? [`Dadoes and grooves: ${dados}, ${depth} deep, glued`] : []),
    ...(pockets ? [`Pocket screws: ${pockets} ${pockets === 1 ? 'hole' : 'holes'}`] : []),
  ];
}

/**
 * The "Piece" section's rows, in the shop's units, the same on screen and in
 * the PDF; empty for a piece recorded before the section existed.
 * @example pieceSummary(t.pieces[0], 'in') // [['Overall', '36" W x 72" H x 12" D'], ['Finish', 'Waterborne polyurethane, satin, 3 coats'], ...]
 */
export function pieceSummary(p: TravellerPiece, unit: LengthUnit): [string, string][] {
  const len = (mm: number) => formatLength(mm, { unit, denominator: 32 });
  const rows: [string, string][] = [];
  if (p.widthMm !== undefined && p.heightMm !== undefined && p.depthMm !== undefined)
    rows.push(['Overall', `${len(p.widthMm)} W x ${len(p.heightMm)} H x ${len(p.depthMm)} D`]);
  if (p.finish !== undefined)
    rows.push([
      'Finish',
      p.finish ? `${p.finish.name}, ${p.finish.coats} ${p.finish.coats === 1 ? 'coat' : 'coats'}` : 'None (unfinished)',
    ]);
  if (p.revealMm !== undefined && p.overlayMm !== undefined)
    rows.push([
      'Fronts',
      p.frontStyle === 'inset'
        ? `Inset, ${len(p.revealMm)} reveal all round`
        : `${len(p.revealMm)} reveal, ${len(p.overlayMm)} overlay`,
    ]);
  if (p.joinery)
    rows.push(['Joinery', p.joinery.length ? p.joinery.join('; ') : 'No dadoes or pocket holes in the cut list']);
  // the client's choices, but for the size and finish said above
  for (const c of p.choices ?? []) if (c.label !== 'Size' && c.label !== 'Finish') rows.push([c.label, c.value]);
  return rows;
}
