import {
  benchLayout,
  caseJoins,
  specBays,
  type BenchCase,
  type Bay,
  type BuildSpec,
  type Compartment,
} from './designs';
import type { PriceBook } from './price-book';
import { formatLength, formatThickness, type LengthUnit } from './units';

/** One choice of a piece as the client and the shop read it: `Trim` — `Hard maple, 3 1/2 in wide, 3/4 in thick`. */
export interface Choice {
  label: string;
  value: string;
}

/**
 * The client's choices for one piece, in the trade's and the client's words,
 * lengths in `unit`: materials, banding, pulls, finish, the sections of each
 * bay, and for the bench its top, overhangs, trim, mobility and arrangement of
 * cases. Items are named as the price book names them; an id the book does not
 * hold is shown as it is. Computed once, when a revision is priced, and kept
 * with it, so a later price book never changes what the client chose.
 *
 * @example choicesOf(designs['assembly-bench'].defaults, demoPriceBook, 'in').find((c) => c.label === 'Trim')
 * // { label: 'Trim', value: 'Hard maple, 3 1/2 in wide, 3/4 in thick' }
 */
export function choicesOf(spec: BuildSpec, book: PriceBook, unit: LengthUnit): Choice[] {
  const len = (mm: number) => inWords(formatLength(mm, { unit }));
  const thick = (mm: number) => inWords(formatThickness(mm, unit));
  const sheet = (id: string) => book.sheetGoods.find((x) => x.id === id)?.name ?? id;
  const hardware = (id: string) => book.hardware.find((x) => x.id === id)?.name ?? id;
  const out: Choice[] = [];
  const add = (label: string, value: string) => out.push({ label, value });

  add('Size', `${len(spec.widthMm)} wide, ${len(spec.heightMm)} high, ${len(spec.depthMm)} deep`);
  const bays = specBays(spec);
  const sections = bays.flatMap((b) => b.compartments);
  const hasDrawers = sections.some((c) => c.kind === 'drawer');
  const hasFronts = sections.some((c) => c.kind !== 'open');

  add('Case', sheet(spec.carcassMaterialId));
  add(
    'Back',
    `${sheet(spec.backMaterialId)}, ${spec.backConstruction === 'grooved' ? 'set in grooves' : 'fastened to the back edges'}`,
  );
  const hasDoors = sections.some((c) => c.kind === 'door');
  if (hasFronts)
    add(
      hasDoors && hasDrawers ? 'Doors and drawer fronts' : hasDoors ? 'Doors' : 'Drawer fronts',
      sheet(spec.frontMaterialId),
    );
  if (hasDrawers) {
    add('Drawer boxes', sheet(spec.drawerMaterialId));
    add('Drawer bottoms', sheet(spec.drawerBottomMaterialId));
  }
  add('Edge banding', book.edgeBanding.find((x) => x.id === spec.bandingId)?.name ?? spec.bandingId);
  if (hasFronts && spec.frontStyle)
    add('Fronts', spec.frontStyle === 'inset' ? 'Inset, inside the openings' : 'Overlay, over the case edges');
  if (hasFronts) add('Pulls', hardware(spec.pullId));
  const finish = spec.finishId ? book.finishes.find((f) => f.id === spec.finishId) : undefined;
  if (!spec.finishId) add('Finish', 'No finish');
  else {
    const coats = spec.coats ?? finish?.defaultCoats;
    add('Finish', `${finish?.name ?? spec.finishId}${coats ? `, ${coats} coat${coats > 1 ? 's' : ''}` : ''}`);
  }
  if (spec.trim) {
    const wood = book.lumber.find((l) => l.id === spec.trim?.lumberId);
    const species = wood ? capital(wood.species) : spec.trim.lumberId;
    add('Trim', `${species}, ${len(spec.trim.widthMm)} wide, ${thick(spec.trim.thicknessMm)} thick`);
  }

  if (spec.design === 'assembly-bench') {
    const top = spec.top;
    const edge = top.edge === 'trim' ? 'solid-wood edge' : 'banded edge';
    if (top.kind === 'torsion-box')
      add(
        'Top',
        `Torsion box ${len(top.thicknessMm)} thick: ${sheet(top.skinMaterialId)} skins over a ${sheet(top.coreMaterialId)} grid at ${len(top.gridSpacingMm)}, ${edge}`,
      );
    else add('Top', `Laminated from ${sheet(spec.carcassMaterialId)}, about ${len(top.thicknessMm)} thick, ${edge}`);
    add('Overhangs', overhangs(spec, len));
    add('Mobility', mobility(spec, hardware));
    add('Arrangement', arrangement(spec, len));
    for (const [label, cases] of caseGroups(spec)) add(label, casesInside(cases[0]!, len));
  } else {
    if ('toeKickMm' in spec)
      add(
        spec.design === 'bookcase' ? 'Plinth' : 'Toe kick',
        spec.toeKickMm > 0 ? `${len(spec.toeKickMm)} high` : 'None',
      );
    if (spec.design === 'base-cabinet' && spec.mobility === 'leveling-feet') add('Feet', 'Leveling feet');
    if ('installation' in spec)
      add('Installation', spec.installation === 'built-in' ? 'Built in, fixed to the wall' : 'Free-standing');
    if (spec.design === 'wall-cabinet') add('Hanging', spec.hangingRail ? 'On a hanging rail' : 'Screwed to the wall');
    spec.bays.forEach((bay, b) =>
      add(spec.bays.length > 1 ? `Bay ${b + 1}` : 'Sections', bayWords(bay, spec.bays.length > 1, len)),
    );
  }
  return out;
}

/** A formatted length as a sentence reads it: `3 1/2 in` rather than `3 1/2"`. */
const inWords = (s: string) => s.replace(/"$/, ' in');
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function overhangs(s: Extract<BuildSpec, { design: 'assembly-bench' }>, len: (mm: number) => string): string {
  const fb =
    s.overhangFrontMm === s.overhangBackMm
      ? `${len(s.overhangFrontMm)} front and back`
      : `${len(s.overhangFrontMm)} at the front, ${len(s.overhangBackMm)} at the back`;
  const ends =
    s.overhangLeftMm === s.overhangRightMm
      ? `${len(s.overhangLeftMm)} at each end`
      : `${len(s.overhangLeftMm)} at the left end, ${len(s.overhangRightMm)} at the right`;
  return `${fb}; ${ends}`;
}

function mobility(s: Extract<BuildSpec, { design: 'assembly-bench' }>, hardware: (id: string) => string): string {
  if (s.mobility === 'locking-casters') return `On casters: ${hardware(s.casterId)}`;
  if (s.mobility === 'leveling-feet') return `On feet: ${hardware(s.footId)}`;
  return `On casters (${hardware(s.casterId)}) with leveling feet (${hardware(s.footId)})`;
}

/** What a case of the bench is called: the first case facing the front is the main case. */
function caseRole(s: Extract<BuildSpec, { design: 'assembly-bench' }>, i: number): string {
  const c = s.cases[i]!;
  if (c.facing === 'left' || c.facing === 'right') return `side case opening to the ${c.facing}`;
  if (c.row === 'back') return c.facing === 'back' ? 'rear case' : 'rear case opening to the front';
  if (i === 0) return c.facing === 'front' ? 'main case' : 'main case opening to the back';
  return c.facing === 'front' ? 'front case' : 'front case opening to the back';
}

/**
 * The arrangement in one sentence: `Main case 62 in wide with 2 bays; 2 rear
 * cases 31 in wide, back to back with the main case, opening to the back`.
 * Cases of the same role, width and bays are told together.
 */
function arrangement(s: Extract<BuildSpec, { design: 'assembly-bench' }>, len: (mm: number) => string): string {
  const joins = caseJoins(s, benchLayout(s));
  const groups = new Map<string, { role: string; count: number; width: number; bays: number; backToBack: boolean }>();
  s.cases.forEach((c, i) => {
    const role = caseRole(s, i);
    // told of the cases turned to face away from the main one, not of the main case itself
    const backToBack = i > 0 && joins.some((j) => j.kind === 'back' && (j.a === i || j.b === i));
    const key = `${role}|${c.widthMm}|${c.bays.length}|${backToBack}`;
    const g = groups.get(key);
    if (g) g.count++;
    else groups.set(key, { role, count: 1, width: c.widthMm, bays: c.bays.length, backToBack });
  });
  const parts = [...groups.values()].map((g) => {
    const [noun, ...rest] = g.role.split(' ');
    const name =
      g.count > 1 ? `${g.count} ${noun} cases${rest.length > 1 ? ' ' + rest.slice(1).join(' ') : ''}` : g.role;
    const bays = g.bays > 1 ? ` with ${g.bays} bays` : '';
    const back = g.backToBack ? `, back to back, fronts facing out` : '';
    return `${name} ${len(g.width)} wide${bays}${back}`;
  });
  const text = parts.join('; ');
  return capital(text);
}

/** The bench's cases grouped by what is inside them, each with its label: `Main case`, `Rear cases (2)`. */
function caseGroups(s: Extract<BuildSpec, { design: 'assembly-bench' }>): [string, BenchCase[]][] {
  const groups = new Map<string, { role: string; cases: BenchCase[] }>();
  s.cases.forEach((c, i) => {
    const role = caseRole(s, i).split(' ').slice(0, 2).join(' ');
    const key = `${role}|${c.widthMm}|${JSON.stringify(c.bays.map((b) => b.compartments.map(sectionKey)))}`;
    const g = groups.get(key);
    if (g) g.cases.push(c);
    else groups.set(key, { role, cases: [c] });
  });
  const labels = new Map<string, number>();
  for (const g of groups.values()) labels.set(g.role, (labels.get(g.role) ?? 0) + 1);
  const seen = new Map<string, number>();
  return [...groups.values()].map((g) => {
    const n = (seen.get(g.role) ?? 0) + 1;
    seen.set(g.role, n);
    const base = g.cases.length > 1 ? `${capital(g.role)}s (${g.cases.length})` : capital(g.role);
    return [(labels.get(g.role) ?? 0) > 1 ? `${base}, ${n}` : base, g.cases];
  });
}

function casesInside(c: BenchCase, len: (mm: number) => string): string {
  if (c.bays.length === 1) return bayWords(c.bays[0]!, false, len);
  return c.bays.map((b, i) => `bay ${i + 1}: ${bayWords(b, false, len)}`).join('; ');
}

const sectionKey = (c: Compartment) =>
  `${c.kind}|${c.heightMm}|${c.doors}|${c.adjustableShelves}|${c.fixedShelves}|${c.hingeSide ?? ''}`;

/** A bay's sections from the bottom up, alike ones counted together: `pair of doors, 1 adjustable shelf; 2 drawers 4 in high`. */
function bayWords(bay: Bay, withWidth: boolean, len: (mm: number) => string): string {
  const runs: { c: Compartment; n: number }[] = [];
  for (const c of bay.compartments) {
    const last = runs.at(-1);
    if (last && sectionKey(last.c) === sectionKey(c)) last.n++;
    else runs.push({ c, n: 1 });
  }
  const words = runs.map(({ c, n }) => sectionWords(c, n, len)).join('; ');
  const width = withWidth && bay.widthMm !== null ? `${len(bay.widthMm)} wide: ` : '';
  return `${width}${runs.length > 1 ? 'from the bottom, ' : ''}${words}`;
}

function sectionWords(c: Compartment, n: number, len: (mm: number) => string): string {
  const high = c.heightMm !== null ? ` ${len(c.heightMm)} high` : '';
  const shelves = [
    c.adjustableShelves ? plural(c.adjustableShelves, 'adjustable shelf', 'adjustable shelves') : '',
    c.fixedShelves ? plural(c.fixedShelves, 'fixed shelf', 'fixed shelves') : '',
  ]
    .filter(Boolean)
    .join(' and ');
  if (c.kind === 'drawer') return `${n > 1 ? `${n} drawers` : 'drawer'}${high}`;
  const times = n > 1 ? `${n} x ` : '';
  if (c.kind === 'door') {
    const doors = c.doors === 2 ? 'pair of doors' : c.hingeSide ? `door hinged on the ${c.hingeSide}` : 'door';
    return `${times}${doors}${high}${shelves ? `, ${shelves}` : ''}`;
  }
  return `${times}open${high}${shelves ? `, ${shelves}` : ', no shelves'}`;
}
