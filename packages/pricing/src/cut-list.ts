import type { Bay, BuildSpec, CaseJoin, CasePlace, Compartment } from './designs';
import { benchLayout, caseJoins, dividerCount } from './designs';
import { byId, type PriceBook, type SheetGood, type ShopSettings } from './price-book';
import { at } from './_lib/at';
import { hingesPerDoor } from './hardware';
import {
  band as bandOps,
  cut,
  hingeCups,
  PIN_SETBACK_MM,
  pinRows,
  pocketHoleCount,
  pocketHoles,
  TOE_KICK_SETBACK_MM,
  type DadoOp,
  type Machining,
  type PartEdge,
  type PartFace,
} from './machining';
import { len, where } from './messages';
import { toMm } from './units';

export type Grain = 'fixed' | 'free';

/** One line of the cut list: `quantity` identical parts. Length runs along the grain. */
export interface CutPart {
  id: string;
  name: string;
  /** a sheet good's id, or a lumber id for solid-wood parts */
  materialId: string;
  stock: 'sheet' | 'lumber';
  quantity: number;
  lengthMm: number;
  widthMm: number;
  thicknessMm: number;
  grain: Grain;
  /** edges banded: how many of the two long edges, how many of the two short edges */
  bandedEdges: { long: 0 | 1 | 2; short: 0 | 1 | 2 };
  bandingId: string | null;
  pocketHoles: number;
  dados: number;
  /** faces that take finish: 0, 1 or 2 */
  finishFaces: 0 | 1 | 2;
  /** what is done to the part after cutting, with positions to mark from */
  machining: Machining[];
}

/** A front as drawn on the elevation, in mm from the piece's left edge and the floor. */
export interface FrontRect {
  kind: 'door' | 'drawer';
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  /** doors: which side the hinges are on */
  hinge?: 'left' | 'right';
  /** the side of the piece the front faces (benches: an arrangement's cases face different sides); default front */
  face?: 'front' | 'back' | 'left' | 'right';
}

export interface DrawerFeature {
  frontWidthMm: number;
  slideLengthIn: number;
  box: DrawerBox;
}

export interface CaseOutline {
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  toeKickMm: number;
  partitionsXMm: number[];
  /** dividers and fixed shelves seen in open compartments, as [x, y, width] */
  shelvesMm: [number, number, number][];
  /** benches: the case's key, the side it faces, and its place in plan (from the top's left end and front edge) */
  key?: string;
  facing?: 'front' | 'back' | 'left' | 'right';
  plan?: { xMm: number; yMm: number; alongMm: number; acrossMm: number };
}

export interface PieceGeometry {
  widthMm: number;
  heightMm: number;
  depthMm: number;
  cases: CaseOutline[];
  fronts: FrontRect[];
  top: { xMm: number; yMm: number; widthMm: number; heightMm: number; kind: string } | null;
  /** casters and feet: x along the front, height from the floor to what they carry; benches add y in plan and a foot's mounting block */
  mobility: { kind: 'caster' | 'foot'; xMm: number; heightMm: number; yMm?: number; blockMm?: number }[];
  drawers: DrawerFeature[];
  /** each door with its weight and the overlay of its hinge edge (an end panel, a shared partition, or inset) */
  doors: { widthMm: number; heightMm: number; massKg: number; overlay: HingeOverlay }[];
  adjustableShelves: number;
  shelfSpans: { spanMm: number; depthMm: number; materialId: string; thicknessMm: number }[];
  caseCount: number;
  torsionTops: number;
  trimPieces: number;
  casters: number;
  feet: number;
  casterId: string | null;
  footId: string | null;
  hangingRailWidthMm: number | null;
  wallHung: boolean;
  freeStanding: boolean;
  mobile: boolean;
  workingLoadKg: number;
  pullId: string;
  /** benches: the top's edge trim thickness (inside the stated width and depth), cases fastened together, and feet */
  topTrimMm?: number;
  caseJoins?: CaseJoin[];
  /** connector bolts fastening joined cases to each other */
  caseConnectors?: number;
  /** cases with no back of their own: closed by the back of the case they sit back to back with */
  sharedBacks?: string[];
  /** casters and feet together: how far a lowered foot lifts the casters, and how far a raised one clears the floor */
  feetLiftMm?: number;
  feetClearanceMm?: number;
  /** the feet's mounting blocks: how many (glued up `layers` high under each foot), each `sideMm` square */
  footBlocks?: { count: number; layers: number; sideMm: number } | null;
  /** the fronts lap the case edges, or sit inside their openings (the shop's default or the spec's) */
  frontStyle?: 'overlay' | 'inset';
}

export interface CutList {
  parts: CutPart[];
  geometry: PieceGeometry;
}

// ---------------------------------------------------------------------------
// Drawer boxes (all common practice): side-mount slides take 1/2 in a side;
// slides come in 10 to 28 in, 2 in apart; the slide needs the inside depth
// less 1/2 in; the box is 1 in lower than its opening; the bottom sits in a
// 1/4 in dado.

export const SLIDE_SIDE_CLEARANCE_MM = toMm(0.5);
export const SLIDE_LENGTHS_IN = [10, 12, 14, 16, 18, 20, 22, 24, 26, 28] as const;
const SLIDE_REAR_CLEARANCE_MM = toMm(0.5);
export const DRAWER_BOTTOM_DADO_MM = toMm(0.25);
/** the drawer bottom's groove starts 1/2 in up from the box's lower edge (common practice) */
const DRAWER_BOTTOM_UP_MM = toMm(0.5);
/** a drawer bottom is cut this much under its dado-to-dado size each way, to slide in freely (1/32 to 1/16 in, common practice) */
export const DRAWER_BOTTOM_CLEARANCE_MM = toMm(1 / 16);
/** carcass dados: 1/4 in deep (common practice: about a third of 3/4 in stock) */
const DADO_MM = toMm(0.25);
/** grooved backs sit this far in from the back edge, to leave room to scribe (common practice) */
const BACK_SETBACK_MM = toMm(0.5);
const SHELF_SIDE_CLEARANCE_MM = toMm(1 / 16);
const SHELF_FRONT_SETBACK_MM = toMm(1 / 4);
const STRETCHER_WIDTH_MM = toMm(4);
/** graduated drawer fronts: the top (shallowest) front is kept at least 4 in tall (common practice) */
export const MIN_GRADUATED_FRONT_MM = toMm(4);
/** bench casters: at most 48 in apart along a row (common practice, from memory) */
const CASTER_SPACING_MM = toMm(48);
/** leveling feet adjust about 1 in (from memory); a foot's mounting block is 4 in square */
export const FOOT_TRAVEL_MM = toMm(1);
const FOOT_BLOCK_MM = toMm(4);
/** a raised foot must clear the floor by at least 1/8 in (common practice) */
export const FOOT_MIN_CLEARANCE_MM = toMm(1 / 8);
/** joined cases: a connector bolt every 12 in along the joint, in two rows (top and bottom), at least two a row (common practice) */
const CONNECTOR_SPACING_MM = toMm(12);
const RAIL_WIDTH_MM = toMm(3);

/** A 3 in rail of carcass stock pocket-screwed between the sides at both ends (a hanging rail, a back rail). */
function railPart(
  id: string,
  name: string,
  materialId: string,
  thicknessMm: number,
  lengthMm: number,
  quantity: number,
): Parameters<PartList['add']>[0] {
  const holes = pocketHoles({ face: 'inside', at: ['left', 'right'], fromEdge: 'bottom', jointMm: RAIL_WIDTH_MM });
  return {
    id,
    name,
    materialId,
    quantity,
    lengthMm,
    widthMm: RAIL_WIDTH_MM,
    thicknessMm,
    grain: 'free',
    bandedEdges: { long: 0, short: 0 },
    pocketHoles: holes.count,
    dados: 0,
    finishFaces: 0,
    machining: [holes],
  };
}

export interface DrawerBox {
  boxWidthMm: number;
  boxHeightMm: number;
  boxDepthMm: number;
  slideLengthMm: number;
  slideLengthIn: number;
}

export interface DrawerRules {
  /** opening height less box height; default 1 in */
  heightClearanceMm?: number;
  /** per side; default 1/2 in (side-mount slides) */
  sideClearanceMm?: number;
}

/**
 * The drawer box for an opening (its depth being the case's inside depth):
 * the longest standard slide that fits the depth less 1/2 in, the box as
 * deep as the slide, narrower by the slide clearance each side, lower than
 * the opening by the height clearance.
 *
 * @example
 * drawerBox({ widthMm: 500, heightMm: 150, depthMm: 560 })
 * // { boxWidthMm: 474.6, boxHeightMm: 124.6, boxDepthMm: 508, slideLengthMm: 508, slideLengthIn: 20 }
 * @throws RangeError when no slide fits, naming the least depth
 */
export function drawerBox(
  opening: { widthMm: number; heightMm: number; depthMm: number },
  rules: DrawerRules = {},
): DrawerBox {
  const hc = rules.heightClearanceMm ?? toMm(1);
  const sc = rules.sideClearanceMm ?? SLIDE_SIDE_CLEARANCE_MM;
  const room = opening.depthMm - SLIDE_REAR_CLEARANCE_MM;
  // the longest slide that fits
  const slideIn = SLIDE_LENGTHS_IN.filter((l) => toMm(l) <= room + 1e-9).at(-1);
  if (slideIn === undefined) {
    throw new RangeError(
      `no drawer slide fits ${round(opening.depthMm)} mm of inside depth; the shortest (10 in) needs at least ${round(toMm(10) + SLIDE_REAR_CLEARANCE_MM)} mm`,
    );
  }
  const boxWidthMm = opening.widthMm - 2 * sc;
  const boxHeightMm = opening.heightMm - hc;
  if (boxWidthMm < toMm(4))
    throw new RangeError(`a ${round(opening.widthMm)} mm opening is too narrow for a drawer box`);
  if (boxHeightMm < toMm(1.5))
    throw new RangeError(`a ${round(opening.heightMm)} mm opening is too low for a drawer box`);
  return { boxWidthMm, boxHeightMm, boxDepthMm: toMm(slideIn), slideLengthMm: toMm(slideIn), slideLengthIn: slideIn };
}

export type HingeOverlay = 'full' | 'half' | 'inset';

/**
 * The hinge a door's overlap on its hinge edge calls for: none or less is
 * inset; more than half the panel's thickness is full overlay (a door on an
 * end panel); half or less is half overlay (a door sharing a partition with
 * its neighbour, each lapping about half of it): common practice.
 *
 * @example hingeOverlay(16.8, 18.26) // 'full'
 */
export function hingeOverlay(overlapMm: number, panelThicknessMm: number): HingeOverlay {
  if (overlapMm <= 0) return 'inset';
  return overlapMm > panelThicknessMm / 2 ? 'full' : 'half';
}

function round(v: number): number {
  return Math.round(v * 10) / 10;
}

/** A spec that cannot be built as given, with the field to change (a RangeError, as the cut list's other refusals). */
export class BuildError extends RangeError {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(message);
    this.name = 'BuildError';
  }
}

// ---------------------------------------------------------------------------

interface CaseInput {
  key: string;
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  depthMm: number;
  toeKickMm: number;
  topKind: 'stretchers' | 'panel';
  hangingRail: boolean;
  trimmed: boolean;
  bays: Bay[];
}

class PartList {
  readonly parts: CutPart[] = [];
  add(
    p: Omit<CutPart, 'stock' | 'bandingId' | 'machining'> & {
      stock?: 'sheet' | 'lumber';
      bandingId?: string | null;
      machining?: Machining[];
    },
  ): void {
    if (p.quantity <= 0) return;
    // under 1 mm is no part a saw can cut (and sizes near zero upset the layout's arithmetic)
    if (!(p.lengthMm >= 1 && p.widthMm >= 1))
      throw new BuildError(
        `The ${p.name} would come out ${len(p.lengthMm)} x ${len(p.widthMm)}: the piece is too small for its layout. Make it larger or choose fewer bays or sections.`,
        '',
      );
    const banded = p.bandedEdges.long + p.bandedEdges.short > 0;
    const part: CutPart = {
      stock: 'sheet',
      ...p,
      bandingId: banded ? (p.bandingId ?? null) : null,
      machining: p.machining ?? [],
    };
    const same = this.parts.find((q) => q.id === part.id);
    if (same) same.quantity += part.quantity;
    else this.parts.push(part);
  }
}

/**
 * Whether a part fits one sheet of its material inside the edge trim: along the grain, or either way
 * round when its grain is free (or the material has none).
 */
export function sheetFits(m: SheetGood, trimMm: number, lengthMm: number, widthMm: number, grain?: Grain): boolean {
  const L = m.sheetLengthMm - 2 * trimMm + 1e-6;
  const W = m.sheetWidthMm - 2 * trimMm + 1e-6;
  const free = (grain ?? grainOf(m, true)) === 'free';
  return (lengthMm <= L && widthMm <= W) || (free && widthMm <= L && lengthMm <= W);
}

function grainOf(m: SheetGood, visible: boolean): 'fixed' | 'free' {
  return visible && m.grain === 'lengthwise' ? 'fixed' : 'free';
}

/** Splits `total` among entries with null sizes after the set ones. */
function share(sizes: (number | null)[], total: number): number[] {
  const set = sizes.reduce<number>((s, v) => s + (v ?? 0), 0);
  const open = sizes.filter((v) => v === null).length;
  const each = open ? (total - set) / open : 0;
  const out = sizes.map((v) => v ?? each);
  const top = out.length - 1;
  if (!open && top >= 0) out[top] = at(out, top) + total - set; // the top compartment takes what is left
  return out;
}

/**
 * The cut list of a build spec: every part with its size from the actual
 * material thickness, grain rule, banded edges and joinery; frameless full
 * overlay fronts with the shop's reveal and overlay; drawer boxes from their
 * openings; a torsion-box top of skins, frame and grid; mitred solid trim.
 * Also returns the geometry the drawing, hardware and checks are made from.
 *
 * @example
 * cutList(designs['base-cabinet'].defaults, demoPriceBook, demoSettings).parts.find((p) => p.name === 'side')
 */
export function cutList(spec: BuildSpec, book: PriceBook, settings: ShopSettings): CutList {
  const carcass = byId(book.sheetGoods, spec.carcassMaterialId, 'carcass material');
  const back = byId(book.sheetGoods, spec.backMaterialId, 'back material');
  const front = byId(book.sheetGoods, spec.frontMaterialId, 'front material');
  const drawerMat = byId(book.sheetGoods, spec.drawerMaterialId, 'drawer material');
  const drawerBottom = byId(book.sheetGoods, spec.drawerBottomMaterialId, 'drawer bottom material');
  byId(book.edgeBanding, spec.bandingId, 'edge banding');
  byId(book.hardware, spec.pullId, 'pull');
  if (spec.finishId) byId(book.finishes, spec.finishId, 'finish');
  if (spec.trim) byId(book.lumber, spec.trim.lumberId, 'trim lumber');

  const list = new PartList();
  const geo: PieceGeometry = {
    frontStyle: spec.frontStyle ?? settings.frontStyle,
    widthMm: spec.widthMm,
    heightMm: spec.heightMm,
    depthMm: spec.depthMm,
    cases: [],
    fronts: [],
    top: null,
    mobility: [],
    drawers: [],
    doors: [],
    adjustableShelves: 0,
    shelfSpans: [],
    caseCount: 0,
    torsionTops: 0,
    trimPieces: 0,
    casters: 0,
    feet: 0,
    casterId: null,
    footId: null,
    hangingRailWidthMm: null,
    wallHung: spec.design === 'wall-cabinet',
    freeStanding:
      spec.design === 'assembly-bench' ||
      ((spec.design === 'bookcase' || spec.design === 'base-cabinet') && spec.installation === 'free-standing'),
    mobile: false,
    workingLoadKg: 0,
    pullId: spec.pullId,
  };
  const band = spec.bandingId;
  const trimmed = spec.trim !== null && spec.design !== 'assembly-bench';

  const cases: CaseInput[] = [];
  if (spec.design === 'assembly-bench') {
    benchCases(spec, book, settings, carcass, list, geo, cases);
  } else {
    const toe = spec.design === 'wall-cabinet' ? 0 : spec.toeKickMm;
    cases.push({
      key: 'c1',
      xMm: 0,
      yMm: 0,
      widthMm: spec.widthMm,
      heightMm: spec.heightMm,
      depthMm: spec.depthMm,
      toeKickMm: toe,
      topKind: spec.design === 'base-cabinet' ? 'stretchers' : 'panel',
      hangingRail: spec.design === 'wall-cabinet' && spec.hangingRail,
      trimmed,
      bays: spec.bays,
    });
    if (spec.design === 'base-cabinet' && spec.mobility === 'leveling-feet') {
      const foot = book.hardware.find((h) => h.kind === 'leveling_foot');
      if (foot) {
        geo.feet = 4;
        geo.footId = foot.id;
      }
    }
  }

  const places = spec.design === 'assembly-bench' ? benchLayout(spec) : [];
  cases.forEach((cs, i) => {
    const fronts = geo.fronts.length;
    try {
      buildCase(
        cs,
        spec,
        { carcass, back, front, drawerMat, drawerBottom },
        settings,
        list,
        geo,
        band,
        settings.sheetTrimMm,
      );
    } catch (err) {
      // a bench's case: the issue is at that case, and says which
      if (!(err instanceof BuildError) || spec.design !== 'assembly-bench') throw err;
      throw new BuildError(
        err.message.replace(/\bBay (\d+)/, `Case ${i + 1}, Bay $1`),
        err.path ? `cases[${i}].${err.path}` : `cases[${i}]`,
      );
    }
    const place = places[i];
    if (spec.design === 'assembly-bench' && place) {
      const facing = at(spec.cases, i).facing;
      for (const f of geo.fronts.slice(fronts)) f.face = facing;
      Object.assign(at(geo.cases, geo.cases.length - 1), { key: cs.key, facing, plan: place });
    }
  });
  if (spec.design === 'assembly-bench') shareBacks(places, geo, list);
  geo.caseCount = cases.length;

  if (spec.trim) {
    const lumber = byId(book.lumber, spec.trim.lumberId, 'trim lumber');
    const tt = spec.trim.thicknessMm;
    const tw = spec.trim.widthMm;
    const common = {
      materialId: lumber.id,
      stock: 'lumber' as const,
      thicknessMm: tt,
      widthMm: tw,
      grain: 'fixed' as const,
      bandedEdges: { long: 0, short: 0 } as const,
      pocketHoles: 0,
      dados: 0,
      finishFaces: 2 as const,
    };
    if (spec.design === 'assembly-bench') {
      // solid edging round the top, mitred at the corners: its outside (long-point) lengths are the stated width and depth
      if (spec.top.edge === 'trim') {
        list.add({
          ...common,
          id: 'trim-top-long',
          name: 'trim, top edge (long)',
          quantity: 2,
          lengthMm: spec.widthMm,
        });
        list.add({
          ...common,
          id: 'trim-top-short',
          name: 'trim, top edge (end)',
          quantity: 2,
          lengthMm: spec.depthMm,
        });
      }
    } else {
      const cs = at(cases, 0);
      // a mitred face frame of solid trim over the case's front edges
      list.add({ ...common, id: 'trim-stile', name: 'trim, stile', quantity: 2, lengthMm: cs.heightMm - cs.toeKickMm });
      list.add({ ...common, id: 'trim-rail', name: 'trim, rail', quantity: 2, lengthMm: cs.widthMm });
    }
    geo.trimPieces = spec.design === 'assembly-bench' && spec.top.edge !== 'trim' ? 0 : 4;
  }
  return { parts: list.parts, geometry: geo };
}

interface Mats {
  carcass: SheetGood;
  back: SheetGood;
  front: SheetGood;
  drawerMat: SheetGood;
  drawerBottom: SheetGood;
}

/** A fixed member across a bay: its key within the bay, and its lower face from the floor. */
interface Member {
  key: string;
  lowerMm: number;
}

/** The lower face of the i-th of n fixed shelves spaced evenly up a section h high, from the section's floor. */
function fixedShelfAt(h: number, n: number, i: number, t: number): number {
  return (i * (h - n * t)) / (n + 1) + (i - 1) * t;
}

/** A level a back may be split at: a member's centre line, where its pieces end below and start above, and the bays holding it (bay -> member key). */
interface BackLevel {
  centreMm: number;
  lowMm: number;
  highMm: number;
  held: Map<number, string>;
}

/**
 * Where a back too large for its sheet is split across, into the fewest pieces that fit (`pieces`, found by the
 * caller): at members' levels wherever one lies in the range the split must fall in, so that a bay held by a member
 * needs no rail, and elsewhere on rails, spaced evenly between the ends and the members used. Of the ways with the
 * fewest rails (one for each bay a split crosses without a member), the one whose pieces are nearest equal.
 * Deterministic: levels in height order, the first best kept.
 */
function splitBack(o: {
  footMm: number;
  heightMm: number;
  pieces: number;
  /** bays the back's run covers */
  bays: number;
  levels: readonly BackLevel[];
  /** whether a piece this high fits a sheet */
  fits: (heightMm: number) => boolean;
}): { splits: { centreMm: number; level: BackLevel | null }[]; pieces: number[] } {
  const end = o.footMm + o.heightMm;
  const even = o.heightMm / o.pieces;
  const k = o.pieces - 1;
  type Split = { centreMm: number; lowMm: number; highMm: number; level: BackLevel | null };
  let best: { splits: Split[]; pieces: number[]; cost: number; spread: number } | null = null;
  // at most 16 levels, those nearest an even split (a case has seldom more than a few)
  const near = (l: BackLevel) =>
    Math.min(...Array.from({ length: k }, (_, r) => Math.abs(l.centreMm - o.footMm - (r + 1) * even)));
  const levels = [...o.levels]
    .sort((a, b) => near(a) - near(b) || a.centreMm - b.centreMm)
    .slice(0, 16)
    .sort((a, b) => a.centreMm - b.centreMm);
  const consider = (chosen: BackLevel[], free: number[]) => {
    // free[g] rails spaced evenly in the g-th gap between the ends and the chosen levels
    const splits: Split[] = [];
    for (let g = 0; g <= chosen.length; g++) {
      const from = g === 0 ? o.footMm : at(chosen, g - 1).highMm;
      const to = g === chosen.length ? end : at(chosen, g).lowMm;
      const n = at(free, g);
      for (let r = 1; r <= n; r++) {
        const c = from + ((to - from) * r) / (n + 1);
        splits.push({ centreMm: c, lowMm: c, highMm: c, level: null });
      }
      const l = chosen[g];
      if (l) splits.push({ centreMm: l.centreMm, lowMm: l.lowMm, highMm: l.highMm, level: l });
    }
    const pieces: number[] = [];
    let from = o.footMm;
    for (const s of splits) {
      pieces.push(s.lowMm - from);
      from = s.highMm;
    }
    pieces.push(end - from);
    if (!pieces.every((h) => h > 0 && o.fits(h))) return;
    const cost = splits.reduce((sum, s) => sum + (s.level ? o.bays - s.level.held.size : o.bays), 0);
    const spread = pieces.reduce((sum, h) => sum + (h - even) ** 2, 0);
    if (!best || cost < best.cost || (cost === best.cost && spread < best.spread - 1e-6))
      best = { splits, pieces, cost, spread };
  };
  const choose = (start: number, chosen: BackLevel[]) => {
    // every way to share the rails left among the gaps
    const share = (g: number, left: number, free: number[]) => {
      if (g === chosen.length) consider(chosen, [...free, left]);
      else for (let n = 0; n <= left; n++) share(g + 1, left - n, [...free, n]);
    };
    share(0, k - chosen.length, []);
    if (chosen.length < k) for (let i = start; i < levels.length; i++) choose(i + 1, [...chosen, at(levels, i)]);
  };
  choose(0, []);
  // the caller found `pieces` even pieces that fit, so the rails alone always do
  const found = best as { splits: Split[]; pieces: number[] } | null;
  if (!found) throw new RangeError('no split of the back fits its sheet');
  return { splits: found.splits.map(({ centreMm, level }) => ({ centreMm, level })), pieces: found.pieces };
}

function buildCase(
  cs: CaseInput,
  spec: BuildSpec,
  m: Mats,
  settings: ShopSettings,
  list: PartList,
  geo: PieceGeometry,
  band: string,
  sheetTrimMm: number,
): void {
  const t = m.carcass.thicknessMm;
  const bt = m.back.thicknessMm;
  const k = cs.key;
  const grooved = spec.backConstruction === 'grooved';
  // butt joints: panels run between the sides, screwed (pocket screws); dado joints: let into 1/4 in dados
  const butt = (spec.joinery ?? settings.caseJoinery) === 'butt';
  const dado = butt ? 0 : DADO_MM;
  // a hanging rail sits behind the back, so a grooved back is set in by the rail's thickness
  const setback = cs.hangingRail && grooved ? Math.max(BACK_SETBACK_MM, t) : BACK_SETBACK_MM;
  const panelDepth = grooved ? cs.depthMm : cs.depthMm - bt; // sides, bottom, top
  const insideDepth = grooved ? cs.depthMm - setback - bt : cs.depthMm - bt;
  // a butt-jointed panel's pocket holes at the ends `at` along a joint as deep as the panel, marked from its front edge
  const buttHoles = (face: PartFace, jointMm: number, at: PartEdge[] = ['left', 'right']): Machining[] =>
    butt ? [pocketHoles({ face, at, fromEdge: 'front', jointMm })] : [];
  const insideWidth = cs.widthMm - 2 * t;
  const insideHeight = cs.heightMm - cs.toeKickMm - 2 * t;
  if (insideWidth <= 0 || insideHeight <= 0 || insideDepth <= 0)
    throw new BuildError(
      `A case of ${len(cs.widthMm)} x ${len(cs.heightMm)} x ${len(cs.depthMm)} has no room inside: make it larger.`,
      'widthMm',
    );
  const faceBand = cs.trimmed ? 0 : 1;
  const carcassGrain = (visible: boolean) => grainOf(m.carcass, visible);
  /** the groove a grooved back sits in, on one face of a part, `lengthMm` long */
  const backGroove = (face: PartFace, lengthMm: number) =>
    cut({
      kind: 'groove',
      for: 'back',
      face,
      fromEdge: 'back',
      distanceMm: BACK_SETBACK_MM,
      widthMm: bt,
      depthMm: DADO_MM,
      lengthMm,
    });
  const horizontals = cs.topKind === 'panel' ? 2 : 1; // bottom and a top panel dadoed into the sides

  const bays = cs.bays;
  const dividersPerBay = bays.map(
    (b) =>
      dividerCount(b.compartments) + b.compartments.reduce((s, c) => s + (c.kind === 'drawer' ? 0 : c.fixedShelves), 0),
  );
  const bayWidths = share(
    bays.map((b) => b.widthMm),
    insideWidth - (bays.length - 1) * t,
  );
  if (bayWidths.some((w) => w < 100))
    throw new BuildError('The bays do not fit the case: make them narrower or the case wider.', 'bays');
  const insideFloor = cs.yMm + cs.toeKickMm + t; // from the floor
  // each bay's fixed members (dividers between its sections, fixed shelves within them), by their lower faces from
  // the floor, keyed as the sections' loop below names them: where a back too large for its sheet may be split
  const members: Member[][] = bays.map((bay, b) => {
    const heights = share(
      bay.compartments.map((c) => c.heightMm),
      insideHeight - dividerCount(bay.compartments) * t,
    );
    if (heights.some((h) => h < 50))
      throw new BuildError(
        `The sections of ${where(b)} do not fit the case: make them shorter or the case taller.`,
        `bays[${b}].compartments`,
      );
    const out: Member[] = [];
    let y = insideFloor;
    bay.compartments.forEach((c, j) => {
      const h = at(heights, j);
      const next = bay.compartments[j + 1];
      const divider = !!next && !(next.kind === 'drawer' && c.kind === 'drawer');
      if (c.kind !== 'drawer')
        for (let i = 1; i <= c.fixedShelves; i++)
          out.push({ key: `k${j + 1}-shelf-${i}`, lowerMm: y + fixedShelfAt(h, c.fixedShelves, i, t) });
      if (divider) out.push({ key: `k${j + 1}-divider`, lowerMm: y + h });
      y += h + (divider ? t : 0);
    });
    return out;
  });

  // the bottom's and top panel's partition dados (from the left end, which sits in the left side's dado) and back groove
  const horizontalCuts = (face: 'inside'): DadoOp[] => {
    const out: DadoOp[] = [];
    let inner = 0;
    // butt joints: the partitions are screwed, not let into dados
    for (let b = 0; b < (butt ? 0 : bays.length - 1); b++) {
      inner += at(bayWidths, b);
      out.push(
        cut({
          for: 'partition',
          face,
          fromEdge: 'left',
          distanceMm: DADO_MM + inner + b * t,
          widthMm: t,
          depthMm: DADO_MM,
          lengthMm: insideDepth,
        }),
      );
    }
    if (grooved) out.push(backGroove(face, insideWidth + 2 * dado));
    return out;
  };
  // sides: full height (notched for the toe kick), dadoes for bottom, top panel and the outer bays' dividers, and the back groove
  const sideDados = [0, bays.length - 1].map(
    (b) => (butt ? 0 : horizontals + at(dividersPerBay, b)) + (grooved ? 1 : 0),
  );
  list.add({
    id: `${k}-side`,
    name: 'side',
    materialId: m.carcass.id,
    quantity: 2,
    lengthMm: cs.heightMm,
    widthMm: panelDepth,
    thicknessMm: t,
    grain: carcassGrain(true),
    bandedEdges: { long: faceBand as 0 | 1, short: 0 },
    bandingId: band,
    pocketHoles: 0,
    dados: Math.max(...sideDados),
    finishFaces: 2,
    machining: [
      ...bandOps(...(faceBand ? (['front'] as const) : [])),
      ...(cs.toeKickMm > 0
        ? [
            {
              kind: 'toe_kick_notch' as const,
              corner: 'front-bottom' as const,
              heightMm: round(cs.toeKickMm),
              depthMm: TOE_KICK_SETBACK_MM,
            },
          ]
        : []),
      ...(butt
        ? []
        : [
            cut({
              for: 'bottom',
              face: 'inside',
              fromEdge: 'bottom',
              distanceMm: cs.toeKickMm,
              widthMm: t,
              depthMm: DADO_MM,
              lengthMm: panelDepth,
            }),
          ]),
      ...(cs.topKind === 'panel' && !butt
        ? [
            cut({
              for: 'top',
              face: 'inside',
              fromEdge: 'top',
              distanceMm: 0,
              widthMm: t,
              depthMm: DADO_MM,
              lengthMm: panelDepth,
            }),
          ]
        : []),
      ...(grooved ? [backGroove('inside', cs.heightMm)] : []),
    ],
  });
  list.add({
    id: `${k}-bottom`,
    name: 'bottom',
    materialId: m.carcass.id,
    quantity: 1,
    lengthMm: insideWidth + 2 * dado,
    widthMm: panelDepth,
    thicknessMm: t,
    grain: carcassGrain(true),
    bandedEdges: { long: faceBand as 0 | 1, short: 0 },
    bandingId: band,
    pocketHoles: pocketHoleCount(buttHoles('underside', panelDepth)),
    dados: (butt ? 0 : bays.length - 1) + (grooved ? 1 : 0),
    finishFaces: 1,
    machining: [
      ...bandOps(...(faceBand ? (['front'] as const) : [])),
      ...horizontalCuts('inside'),
      ...buttHoles('underside', panelDepth),
    ],
  });
  if (cs.topKind === 'panel') {
    list.add({
      id: `${k}-top`,
      name: 'top',
      materialId: m.carcass.id,
      quantity: 1,
      lengthMm: insideWidth + 2 * dado,
      widthMm: panelDepth,
      thicknessMm: t,
      grain: carcassGrain(true),
      bandedEdges: { long: faceBand as 0 | 1, short: 0 },
      bandingId: band,
      pocketHoles: pocketHoleCount(buttHoles('top', panelDepth)),
      dados: (butt ? 0 : bays.length - 1) + (grooved ? 1 : 0),
      finishFaces: 2,
      machining: [
        ...bandOps(...(faceBand ? (['front'] as const) : [])),
        ...horizontalCuts('inside'),
        ...buttHoles('top', panelDepth),
      ],
    });
  } else {
    const holes = pocketHoles({ face: 'top', at: ['left', 'right'], fromEdge: 'front', jointMm: STRETCHER_WIDTH_MM });
    list.add({
      id: `${k}-stretcher`,
      name: 'stretcher',
      materialId: m.carcass.id,
      quantity: 2,
      lengthMm: insideWidth,
      widthMm: STRETCHER_WIDTH_MM,
      thicknessMm: t,
      grain: 'free',
      bandedEdges: { long: 0, short: 0 },
      pocketHoles: holes.count,
      dados: 0,
      finishFaces: 0,
      machining: [holes],
    });
  }
  if (cs.toeKickMm > 0) {
    list.add({
      id: `${k}-toe-kick`,
      name: 'toe kick',
      materialId: m.carcass.id,
      quantity: 1,
      lengthMm: insideWidth,
      widthMm: cs.toeKickMm,
      thicknessMm: t,
      grain: 'free',
      bandedEdges: { long: 0, short: 0 },
      pocketHoles: 0,
      dados: 0,
      finishFaces: 1,
    });
  }
  if (cs.hangingRail) {
    list.add(railPart(`${k}-hanging-rail`, 'hanging rail', m.carcass.id, t, insideWidth, 1));
    geo.hangingRailWidthMm = cs.widthMm;
  }
  // The back, as a shop handles one larger than its sheet (common practice): a back with grain runs it up the case
  // as the sides do, so it is split over partitions into pieces that each fit with their grain up; a piece that
  // still does not fit is turned with its grain across, and one too large either way is split across. A shop splits
  // it where there is already something to fasten both edges to: a fixed shelf or a divider lying where the split
  // may fall (see splitBack). An applied back's pieces meet on its centre line, nailed to its back edge; a grooved
  // back's pieces stand in grooves in its top face and underside, the shelf then running the case's full depth as
  // the bottom does. Where no such member lies across a bay, the split rests on a back rail across that bay, the
  // pieces meeting on the rail's centre line.
  const backHeight = grooved ? insideHeight + 2 * DADO_MM : cs.heightMm - cs.toeKickMm;
  const backFoot = grooved ? insideFloor - DADO_MM : cs.yMm + cs.toeKickMm;
  const backGrain = grainOf(m.back, true);
  const fitsUp = (w: number, h = backHeight) => sheetFits(m.back, sheetTrimMm, h, w, backGrain);
  const fitsAny = (w: number, h = backHeight) => sheetFits(m.back, sheetTrimMm, h, w, 'free');
  // a run of bays a, ..., z under one piece: grooved, from the groove in one side or partition to the next; applied,
  // from the case's outer edge or a partition's centre line to the next
  const spanOf = (a: number, z: number) =>
    bayWidths.slice(a, z + 1).reduce((sum, w) => sum + w, 0) +
    (z - a) * t +
    (grooved ? 2 * DADO_MM : (a === 0 ? t : t / 2) + (z === bays.length - 1 ? t : t / 2));
  const runs: [number, number][] = [];
  if (!fitsUp(spanOf(0, bays.length - 1)) && bays.length > 1) {
    let from = 0;
    while (from < bays.length) {
      let to = from;
      while (to + 1 < bays.length && fitsUp(spanOf(from, to + 1))) to++;
      runs.push([from, to]);
      from = to + 1;
    }
  } else runs.push([0, bays.length - 1]);
  const backOverPartitions = grooved && runs.length > 1;
  const railsInBay: number[][] = bays.map(() => []);
  /** members a grooved back is split at, as `bay:key` (see `members`) */
  const backMembers = new Set<string>();
  const backParts: { w: number; heights: number[]; rails: number[]; bays: number[] }[] = runs.map(([a, z]) => {
    const w = spanOf(a, z);
    let rows = 1;
    while (!fitsAny(w, backHeight / rows) && rows < 4) rows++;
    if (!fitsAny(w, backHeight / rows)) rows = 1; // too wide for any sheet: validation names it
    const covered = bays.map((_, b) => b).slice(a, z + 1);
    const rails = covered.map(() => 0);
    if (rows === 1) return { w, heights: [backHeight], rails, bays: bayWidths.slice(a, z + 1) };
    // the members' levels across the run: where one lies in every bay at the same height, or (an applied back, whose
    // pieces meet on a centre line as they do on a rail) in some of them, the others taking a rail there
    const levels = new Map<number, BackLevel>();
    for (const b of covered)
      for (const mb of at(members, b)) {
        const key = Math.round(mb.lowerMm * 10);
        const level = levels.get(key) ?? {
          centreMm: mb.lowerMm + t / 2,
          lowMm: grooved ? mb.lowerMm + DADO_MM : mb.lowerMm + t / 2,
          highMm: grooved ? mb.lowerMm + t - DADO_MM : mb.lowerMm + t / 2,
          held: new Map<number, string>(),
        };
        level.held.set(b, mb.key);
        levels.set(key, level);
      }
    const usable = [...levels.values()].filter((l) => !grooved || l.held.size === covered.length);
    const plan = splitBack({
      footMm: backFoot,
      heightMm: backHeight,
      pieces: rows,
      bays: covered.length,
      levels: usable,
      fits: (h) => fitsAny(w, h),
    });
    for (const s of plan.splits)
      covered.forEach((b, i) => {
        const held = s.level?.held.get(b);
        if (held !== undefined) {
          if (grooved) backMembers.add(`${b}:${held}`);
        } else {
          at(railsInBay, b).push(s.centreMm);
          rails[i] = at(rails, i) + 1;
        }
      });
    return { w, heights: plan.pieces, rails, bays: bayWidths.slice(a, z + 1) };
  });
  const backCount = backParts.reduce((sum, p) => sum + p.heights.length, 0);
  let piece = 0;
  backParts.forEach(({ w, heights, rails, bays: covered }) => {
    for (const h of heights) {
      piece++;
      // grain up the case where the sheet allows (a grainless back too, as it has always been laid out)
      const upright = sheetFits(m.back, sheetTrimMm, h, w, 'fixed');
      list.add({
        id: backCount > 1 ? `${k}-back-${piece}` : `${k}-back`,
        name: backCount > 1 ? `back, piece ${piece}` : 'back',
        materialId: m.back.id,
        quantity: 1,
        lengthMm: upright ? h : w,
        widthMm: upright ? w : h,
        thicknessMm: bt,
        grain: backGrain,
        bandedEdges: { long: 0, short: 0 },
        pocketHoles: 0,
        dados: 0,
        finishFaces: 1,
      });
    }
    covered.forEach((bw, i) =>
      list.add(railPart(`${k}-back-rail-${piece}-${i + 1}`, 'back rail', m.carcass.id, t, bw, at(rails, i))),
    );
  });
  if (bays.length > 1) {
    list.add({
      id: `${k}-partition`,
      name: 'partition',
      materialId: m.carcass.id,
      quantity: bays.length - 1,
      lengthMm: insideHeight + 2 * dado,
      widthMm: insideDepth,
      thicknessMm: t,
      grain: carcassGrain(true),
      bandedEdges: { long: faceBand as 0 | 1, short: 0 },
      bandingId: band,
      pocketHoles: pocketHoleCount(buttHoles('left', insideDepth, ['bottom', 'top'])),
      dados: (butt ? 0 : Math.max(...dividersPerBay)) + (backOverPartitions ? 1 : 0),
      finishFaces: 2,
      machining: buttHoles('left', insideDepth, ['bottom', 'top']),
    });
  }

  const outline: CaseOutline = {
    xMm: cs.xMm,
    yMm: cs.yMm,
    widthMm: cs.widthMm,
    heightMm: cs.heightMm,
    toeKickMm: cs.toeKickMm,
    partitionsXMm: [],
    shelvesMm: [],
  };
  geo.cases.push(outline);
  const outerInset = Math.max(0, t - settings.overlayMm) + settings.revealMm / 2;
  const half = settings.revealMm / 2;
  // inset fronts sit inside their openings, the reveal on every side, and take the front's thickness of depth
  const inset = (spec.frontStyle ?? settings.frontStyle) === 'inset';
  const reveal = settings.revealMm;
  const frontDepth = inset ? m.front.thicknessMm : 0;
  const insideBottom = cs.yMm + cs.toeKickMm + t; // from the floor

  let x = cs.xMm + t;
  // marks on the panels either side of a bay: each side's and partition's ops, positions from its own bottom end
  const sideOps: { left: Machining[]; right: Machining[] } = { left: [], right: [] };
  const partitionOps: Machining[][] = Array.from({ length: bays.length - 1 }, () => []);
  const partitionFoot = insideBottom - dado;
  const mark = (b: number, make: (bottomEndMm: number, face: 'inside' | 'left' | 'right') => Machining[]) => {
    if (b === 0) sideOps.left.push(...make(cs.yMm, 'inside'));
    if (b === bays.length - 1) sideOps.right.push(...make(cs.yMm, 'inside'));
    if (b > 0) at(partitionOps, b - 1).push(...make(partitionFoot, 'right'));
    if (b < bays.length - 1) at(partitionOps, b).push(...make(partitionFoot, 'left'));
  };
  const backRowSetback = (panelDepthMm: number) => panelDepthMm - insideDepth + PIN_SETBACK_MM;
  // a member a grooved back is split at runs the case's full depth: its dado in a side runs through
  const dividerDado = (b: number, lowerFaceMm: number, what: string, through = false) =>
    mark(b, (foot, face) =>
      butt
        ? []
        : [
            cut({
              for: what,
              face,
              fromEdge: 'bottom',
              distanceMm: lowerFaceMm - foot,
              widthMm: t,
              depthMm: DADO_MM,
              lengthMm: through && face === 'inside' ? panelDepth : insideDepth,
            }),
          ],
    );
  /** a fixed shelf or divider whose faces a grooved back's pieces stand in: full depth, grooved top and underside */
  const backShelf = (id: string, quantity: number, lengthMm: number, widthMm: number) =>
    list.add({
      id,
      name: 'fixed shelf, grooved for the back',
      materialId: m.carcass.id,
      quantity,
      lengthMm,
      widthMm,
      thicknessMm: t,
      grain: carcassGrain(true),
      bandedEdges: { long: faceBand as 0 | 1, short: 0 },
      bandingId: band,
      pocketHoles: pocketHoleCount(buttHoles('underside', widthMm)),
      dados: 2,
      finishFaces: 2,
      machining: [
        ...bandOps(...(faceBand ? (['front'] as const) : [])),
        ...(['top', 'underside'] as const).map((face) => backGroove(face, lengthMm)),
        ...buttHoles('underside', widthMm),
      ],
    });
  bays.forEach((bay, b) => {
    const bw = at(bayWidths, b);
    const bk = `${k}-b${b + 1}`;
    const dividers = dividerCount(bay.compartments);
    const heights = share(
      bay.compartments.map((c) => c.heightMm),
      insideHeight - dividers * t,
    );
    // a stack of drawers sharing the height: fronts of equal height, or graduated (each a step taller than the one above)
    const edgeExt = (j: number, side: -1 | 1): number => {
      const c = at(bay.compartments, j);
      const n = bay.compartments[j + side];
      const joint = !!n && n.kind === 'drawer' && c.kind === 'drawer';
      if (inset) return joint ? -half : -reveal;
      if (!n) return t - outerInset;
      return joint ? -half : t / 2 - half;
    };
    const step = (spec.drawerFronts ?? settings.drawerFronts) === 'graduated' ? settings.drawerFrontStepMm : 0;
    for (let j = 0; j < bay.compartments.length; ) {
      let e = j;
      while (at(bay.compartments, j).kind === 'drawer' && bay.compartments[e + 1]?.kind === 'drawer') e++;
      const run = bay.compartments.slice(j, e + 1);
      if (run.length > 1 && run.every((c) => c.heightMm === null)) {
        const n = run.length;
        const ext = run.map((_, i) => edgeExt(j + i, -1) + edgeExt(j + i, 1));
        const total = run.reduce((sum, _, i) => sum + at(heights, j + i), 0) + ext.reduce((sum, v) => sum + v, 0);
        // the step eases where a full one would leave the top front under MIN_GRADUATED_FRONT_MM (never below equal)
        const eased = Math.min(step, Math.max(0, ((total / n - MIN_GRADUATED_FRONT_MM) * 2) / (n - 1)));
        const topFront = (total - (eased * n * (n - 1)) / 2) / n;
        run.forEach((_, i) => (heights[j + i] = topFront + (n - 1 - i) * eased - at(ext, i)));
      }
      j = e + 1;
    }
    const isBackMember = (key: string) => backMembers.has(`${b}:${key}`);
    const backDividers = bay.compartments.filter((_, j) => isBackMember(`k${j + 1}-divider`)).length;
    if (backDividers > 0) backShelf(`${bk}-divider-grooved`, backDividers, bw + 2 * dado, panelDepth);
    if (dividers > 0) {
      list.add({
        id: `${bk}-divider`,
        name: 'fixed shelf',
        materialId: m.carcass.id,
        quantity: dividers - backDividers,
        lengthMm: bw + 2 * dado,
        widthMm: insideDepth,
        thicknessMm: t,
        grain: carcassGrain(true),
        bandedEdges: { long: faceBand as 0 | 1, short: 0 },
        bandingId: band,
        pocketHoles: pocketHoleCount(buttHoles('underside', insideDepth)),
        dados: 0,
        finishFaces: 2,
        machining: [...bandOps(...(faceBand ? (['front'] as const) : [])), ...buttHoles('underside', insideDepth)],
      });
    }
    // the face boundaries of this bay (overlay: centre of partitions, case edge less the overlay; inset: the
    // opening less the reveal)
    const left = inset ? x + reveal : b === 0 ? cs.xMm + outerInset : x - t / 2 + half;
    const right = inset
      ? x + bw - reveal
      : b === bays.length - 1
        ? cs.xMm + cs.widthMm - outerInset
        : x + bw + t / 2 - half;
    let y = insideBottom;
    bay.compartments.forEach((c: Compartment, j) => {
      const h = at(heights, j);
      const ck = `${bk}-k${j + 1}`;
      const prev = bay.compartments[j - 1];
      const next = bay.compartments[j + 1];
      const below = !prev ? 'edge' : prev.kind === 'drawer' && c.kind === 'drawer' ? 'joint' : 'divider';
      const above = !next ? 'edge' : next.kind === 'drawer' && c.kind === 'drawer' ? 'joint' : 'divider';
      const bottom =
        below === 'joint'
          ? y + half
          : inset
            ? y + reveal
            : below === 'edge'
              ? cs.yMm + cs.toeKickMm + outerInset
              : y - t / 2 + half;
      const top =
        above === 'joint'
          ? y + h - half
          : inset
            ? y + h - reveal
            : above === 'edge'
              ? cs.yMm + cs.heightMm - outerInset
              : y + h + t / 2 - half;
      // behind an inset door, shelves and their front pin rows stand back by the door's thickness
      const doorDepth = c.kind === 'door' ? frontDepth : 0;
      if (above === 'divider') {
        outline.shelvesMm.push([x, y + h, bw]);
        dividerDado(b, y + h, 'fixed shelf', isBackMember(`k${j + 1}-divider`));
      }
      if (c.kind !== 'drawer' && c.adjustableShelves > 0) {
        const floor = y;
        mark(b, (foot, face) =>
          pinRows({
            face,
            floorMm: floor - foot,
            heightMm: h,
            backSetbackMm: backRowSetback(face === 'inside' ? panelDepth : insideDepth),
            frontSetbackMm: PIN_SETBACK_MM + doorDepth,
          }),
        );
      }
      const shelfDepth = insideDepth - SHELF_FRONT_SETBACK_MM - doorDepth;
      if (c.kind !== 'drawer') {
        if (c.adjustableShelves > 0) {
          list.add({
            id: `${ck}-shelf`,
            name: 'shelf',
            materialId: m.carcass.id,
            quantity: c.adjustableShelves,
            lengthMm: bw - 2 * SHELF_SIDE_CLEARANCE_MM,
            widthMm: shelfDepth,
            thicknessMm: t,
            grain: carcassGrain(true),
            bandedEdges: { long: 1, short: 0 },
            bandingId: band,
            pocketHoles: 0,
            dados: 0,
            finishFaces: 2,
            machining: bandOps('front'),
          });
          geo.adjustableShelves += c.adjustableShelves;
          geo.shelfSpans.push({ spanMm: bw, depthMm: shelfDepth, materialId: m.carcass.id, thicknessMm: t });
        }
        if (c.fixedShelves > 0) {
          const backShelves = [...Array(c.fixedShelves).keys()].filter((i) =>
            isBackMember(`k${j + 1}-shelf-${i + 1}`),
          ).length;
          if (backShelves > 0)
            backShelf(`${ck}-fixed-shelf-grooved`, backShelves, bw + 2 * dado, panelDepth - doorDepth);
          list.add({
            id: `${ck}-fixed-shelf`,
            name: 'fixed shelf',
            materialId: m.carcass.id,
            quantity: c.fixedShelves - backShelves,
            lengthMm: bw + 2 * dado,
            widthMm: insideDepth - doorDepth,
            thicknessMm: t,
            grain: carcassGrain(true),
            bandedEdges: { long: faceBand as 0 | 1, short: 0 },
            bandingId: band,
            pocketHoles: pocketHoleCount(buttHoles('underside', insideDepth - doorDepth)),
            dados: 0,
            finishFaces: 2,
            machining: [
              ...bandOps(...(faceBand ? (['front'] as const) : [])),
              ...buttHoles('underside', insideDepth - doorDepth),
            ],
          });
          for (let i = 1; i <= c.fixedShelves; i++) {
            const lower = y + fixedShelfAt(h, c.fixedShelves, i, t);
            outline.shelvesMm.push([x, lower, bw]);
            dividerDado(b, lower, 'fixed shelf', isBackMember(`k${j + 1}-shelf-${i}`));
          }
        }
        if (c.adjustableShelves > 0 || c.fixedShelves > 0 || dividers > 0)
          geo.shelfSpans.push({
            spanMm: bw,
            depthMm: insideDepth - doorDepth,
            materialId: m.carcass.id,
            thicknessMm: t,
          });
      }
      if (c.kind === 'door') {
        // a door wider than the shop hangs becomes a pair (validation refuses a pair still too wide)
        const single = right - left;
        const doors = c.doors === 1 && single > settings.maxDoorWidthMm + 1e-6 ? 2 : c.doors;
        const fw = (right - left - (doors - 1) * settings.revealMm) / doors;
        const doorMassKg = ((fw * (top - bottom) * m.front.thicknessMm) / 1e9) * m.front.densityKgM3;
        const doorHinges = hingesPerDoor(top - bottom, doorMassKg);
        for (let d = 0; d < doors; d++) {
          const fx = left + d * (fw + settings.revealMm);
          geo.fronts.push({
            kind: 'door',
            xMm: fx,
            yMm: bottom,
            widthMm: fw,
            heightMm: top - bottom,
            hinge: doors === 2 ? (d === 0 ? 'left' : 'right') : (c.hingeSide ?? 'left'),
          });
          const hingeSide = geo.fronts[geo.fronts.length - 1]?.hinge ?? 'left';
          const onEnd = hingeSide === 'left' ? b === 0 : b === bays.length - 1;
          geo.doors.push({
            widthMm: fw,
            heightMm: top - bottom,
            massKg: doorMassKg,
            overlay: inset ? 'inset' : hingeOverlay(onEnd ? t - outerInset : t / 2 - half, t),
          });
        }
        list.add({
          id: `${ck}-door`,
          name: 'door',
          materialId: m.front.id,
          quantity: doors,
          lengthMm: top - bottom,
          widthMm: fw,
          thicknessMm: m.front.thicknessMm,
          grain: grainOf(m.front, true),
          bandedEdges: { long: 2, short: 2 },
          bandingId: band,
          pocketHoles: 0,
          dados: 0,
          finishFaces: 2,
          machining: [...bandOps('top', 'bottom', 'hinge', 'opening'), hingeCups(top - bottom, doorHinges)],
        });
      } else if (c.kind === 'drawer') {
        let box: DrawerBox;
        try {
          // a back rail across the drawer's opening takes its thickness off the depth the box may have
          const rail = at(railsInBay, b).some((r) => r + RAIL_WIDTH_MM / 2 > y && r - RAIL_WIDTH_MM / 2 < y + h);
          box = drawerBox({ widthMm: bw, heightMm: h, depthMm: insideDepth - frontDepth - (rail ? t : 0) });
        } catch {
          throw new BuildError(
            `${where(b, j)}: a ${len(bw)} wide, ${len(h)} high opening with ${len(insideDepth)} of depth takes no drawer box. Make the drawer taller or wider, or the case deeper.`,
            `bays[${b}].compartments[${j}]`,
          );
        }
        const fw = right - left;
        geo.fronts.push({ kind: 'drawer', xMm: left, yMm: bottom, widthMm: fw, heightMm: top - bottom });
        geo.drawers.push({ frontWidthMm: fw, slideLengthIn: box.slideLengthIn, box });
        list.add({
          id: `${ck}-drawer-front`,
          name: 'drawer front',
          materialId: m.front.id,
          quantity: 1,
          lengthMm: fw,
          widthMm: top - bottom,
          thicknessMm: m.front.thicknessMm,
          grain: grainOf(m.front, true),
          bandedEdges: { long: 2, short: 2 },
          bandingId: band,
          pocketHoles: 0,
          dados: 0,
          finishFaces: 2,
          machining: bandOps('top', 'bottom', 'left', 'right'),
        });
        const st = m.drawerMat.thicknessMm;
        list.add({
          id: `${ck}-drawer-side`,
          name: 'drawer side',
          materialId: m.drawerMat.id,
          quantity: 2,
          lengthMm: box.boxDepthMm,
          widthMm: box.boxHeightMm,
          thicknessMm: st,
          grain: 'free',
          bandedEdges: { long: 1, short: 0 },
          bandingId: band,
          pocketHoles: 0,
          dados: 1,
          finishFaces: 0,
          machining: [
            ...bandOps('top'),
            cut({
              kind: 'groove',
              for: 'drawer bottom',
              face: 'inside',
              fromEdge: 'bottom',
              distanceMm: DRAWER_BOTTOM_UP_MM,
              widthMm: m.drawerBottom.thicknessMm,
              depthMm: DRAWER_BOTTOM_DADO_MM,
              lengthMm: box.boxDepthMm,
            }),
          ],
        });
        // the box front and back screwed into the sides through pocket holes on their outside faces, along the box's
        // height above the bottom's groove (kept clear of it: common practice)
        const overGroove = DRAWER_BOTTOM_UP_MM + m.drawerBottom.thicknessMm;
        const endHoles = pocketHoles({
          face: 'outside',
          at: ['left', 'right'],
          fromEdge: 'bottom',
          jointMm: box.boxHeightMm - overGroove,
          startMm: overGroove,
        });
        list.add({
          id: `${ck}-drawer-end`,
          name: 'drawer box front and back',
          materialId: m.drawerMat.id,
          quantity: 2,
          lengthMm: box.boxWidthMm - 2 * st,
          widthMm: box.boxHeightMm,
          thicknessMm: st,
          grain: 'free',
          bandedEdges: { long: 1, short: 0 },
          bandingId: band,
          pocketHoles: endHoles.count,
          dados: 1,
          finishFaces: 0,
          machining: [
            ...bandOps('top'),
            cut({
              kind: 'groove',
              for: 'drawer bottom',
              face: 'inside',
              fromEdge: 'bottom',
              distanceMm: DRAWER_BOTTOM_UP_MM,
              widthMm: m.drawerBottom.thicknessMm,
              depthMm: DRAWER_BOTTOM_DADO_MM,
              lengthMm: box.boxWidthMm - 2 * st,
            }),
            endHoles,
          ],
        });
        list.add({
          id: `${ck}-drawer-bottom`,
          name: 'drawer bottom',
          materialId: m.drawerBottom.id,
          quantity: 1,
          lengthMm: box.boxWidthMm - 2 * st + 2 * DRAWER_BOTTOM_DADO_MM - DRAWER_BOTTOM_CLEARANCE_MM,
          widthMm: box.boxDepthMm - 2 * st + 2 * DRAWER_BOTTOM_DADO_MM - DRAWER_BOTTOM_CLEARANCE_MM,
          thicknessMm: m.drawerBottom.thicknessMm,
          grain: 'free',
          bandedEdges: { long: 0, short: 0 },
          pocketHoles: 0,
          dados: 0,
          finishFaces: 0,
        });
      }
      y += h + (above === 'divider' ? t : 0);
    });
    x += bw + t;
    if (b < bays.length - 1) outline.partitionsXMm.push(x - t);
  });
  const side = list.parts.find((p) => p.id === `${k}-side`);
  if (side) {
    if (bays.length === 1) side.machining.push(...sideOps.left);
    else
      for (const which of ['left', 'right'] as const)
        side.machining.push(...sideOps[which].map((op) => ({ ...op, only: which })));
  }
  const partition = list.parts.find((p) => p.id === `${k}-partition`);
  if (partition) {
    partition.machining.push(...bandOps(...(faceBand ? (['front'] as const) : [])));
    partitionOps.forEach((ops, i) =>
      partition.machining.push(
        ...(partitionOps.length === 1 ? ops : ops.map((op) => ({ ...op, only: `partition ${i + 1}` }))),
      ),
    );
  }
}

/**
 * Cases back to back are not doubled up: a case whose back is covered
 * whole by the back of the case it is bolted to leaves its own out (of two
 * the same width, the later one), and is closed by its neighbour's.
 */
function shareBacks(places: readonly CasePlace[], geo: PieceGeometry, list: PartList): void {
  const open = new Set<number>();
  for (const j of geo.caseJoins ?? []) {
    if (j.kind !== 'back') continue;
    const covers = (i: number) => j.lengthMm >= at(places, i).alongMm - 1;
    const drop = covers(j.b) && !open.has(j.a) ? j.b : covers(j.a) && !open.has(j.b) ? j.a : null;
    if (drop !== null) open.add(drop);
  }
  for (const i of open) {
    // the back, every piece of a split one, and its back rails
    const own = new RegExp(`^c${i + 1}-back(-\\d+|-rail-\\d+-\\d+)?$`);
    for (let k = list.parts.length - 1; k >= 0; k--) if (own.test(at(list.parts, k).id)) list.parts.splice(k, 1);
  }
  geo.sharedBacks = [...open].map((i) => `c${i + 1}`);
}

/** Layers of the carcass material in a laminated top: the whole number nearest the stated thickness, at least two. */
export function laminatedLayers(thicknessMm: number, layerMm: number): number {
  return Math.max(2, Math.round(thicknessMm / layerMm));
}

/**
 * A bench's cases from its arrangement (each at its place, its elevation x
 * measured on the side it faces), its top, and what it stands on: casters
 * in two rows under each group of joined cases (one set under the joined
 * base, at most 48 in apart), leveling feet at the group's corners, on
 * mounting blocks of stacked carcass stock where the feet alone would not
 * reach the floor past the casters; and the connector bolts of the joints.
 */
function benchCases(
  spec: Extract<BuildSpec, { design: 'assembly-bench' }>,
  book: PriceBook,
  settings: ShopSettings,
  carcass: SheetGood,
  list: PartList,
  geo: PieceGeometry,
  cases: CaseInput[],
): void {
  const t = carcass.thicknessMm;
  const caster = spec.mobility !== 'leveling-feet' ? byId(book.hardware, spec.casterId, 'caster') : null;
  const foot = spec.mobility !== 'locking-casters' ? byId(book.hardware, spec.footId, 'leveling foot') : null;
  const casterH = caster?.heightMm ?? 0;
  const footH = foot?.heightMm ?? 0;
  const under = caster ? casterH : footH;
  const topT = spec.top.kind === 'laminated' ? laminatedLayers(spec.top.thicknessMm, t) * t : spec.top.thicknessMm;
  const caseHeight = spec.heightMm - topT - under;
  geo.topTrimMm = spec.top.edge === 'trim' && spec.trim ? spec.trim.thicknessMm : 0;
  const places = benchLayout(spec);
  places.forEach((p, i) => {
    const c = at(spec.cases, i);
    // x on the elevation of the side the case faces, from that elevation's left
    const x = {
      front: p.xMm,
      back: spec.widthMm - p.xMm - p.alongMm,
      left: spec.depthMm - p.yMm - p.acrossMm,
      right: p.yMm,
    }[c.facing];
    cases.push({
      key: `c${i + 1}`,
      xMm: x,
      yMm: under,
      widthMm: c.widthMm,
      heightMm: caseHeight,
      depthMm: c.depthMm,
      toeKickMm: 0,
      topKind: 'stretchers',
      hangingRail: false,
      trimmed: false,
      bays: c.bays,
    });
  });
  geo.top = { xMm: 0, yMm: spec.heightMm - topT, widthMm: spec.widthMm, heightMm: topT, kind: spec.top.kind };
  benchTop(spec, book, list, geo, topT);

  const joins = caseJoins(spec, places);
  geo.caseJoins = joins;
  geo.caseConnectors = joins.reduce((s, j) => s + 2 * Math.max(2, Math.ceil(j.lengthMm / CONNECTOR_SPACING_MM)), 0);

  // groups of joined cases, each on one set of casters and feet
  const group = places.map((_, i) => i);
  const root = (i: number): number => (group[i] === i ? i : (group[i] = root(at(group, i))));
  for (const j of joins) group[root(j.b)] = root(j.a);
  const groups = new Map<number, number[]>();
  places.forEach((_, i) => groups.set(root(i), [...(groups.get(root(i)) ?? []), i]));
  // a point under one of the group's cases, the nearest to (x, y)
  const under1 = (members: number[], x: number, y: number, inset: number): [number, number] => {
    let best: [number, number] = [x, y];
    let dist = Infinity;
    for (const m of members) {
      const p = at(places, m);
      const px = Math.min(Math.max(x, p.xMm + inset), p.xMm + p.alongMm - inset);
      const py = Math.min(Math.max(y, p.yMm + inset), p.yMm + p.acrossMm - inset);
      const d = (px - x) ** 2 + (py - y) ** 2;
      if (d < dist) [best, dist] = [[px, py], d];
    }
    return best;
  };
  let blockLayers = 0;
  if (caster && foot) {
    // the block that lets a lowered foot lift the casters by about half its travel, in whole layers of carcass stock
    blockLayers = Math.max(0, Math.round((casterH - footH - FOOT_TRAVEL_MM / 2) / t));
    geo.feetLiftMm = footH + blockLayers * t + FOOT_TRAVEL_MM - casterH;
    geo.feetClearanceMm = casterH - footH - blockLayers * t;
  }
  for (const members of groups.values()) {
    const x0 = Math.min(...members.map((m) => at(places, m).xMm));
    const x1 = Math.max(...members.map((m) => at(places, m).xMm + at(places, m).alongMm));
    const y0 = Math.min(...members.map((m) => at(places, m).yMm));
    const y1 = Math.max(...members.map((m) => at(places, m).yMm + at(places, m).acrossMm));
    if (caster) {
      const inset = 70;
      const perRow = Math.max(2, Math.ceil((x1 - x0 - 2 * inset) / CASTER_SPACING_MM) + 1);
      for (const y of [y0 + inset, y1 - inset])
        for (let k = 0; k < perRow; k++) {
          const [px, py] = under1(members, x0 + inset + ((x1 - x0 - 2 * inset) * k) / (perRow - 1), y, inset);
          geo.mobility.push({ kind: 'caster', xMm: px, yMm: py, heightMm: casterH });
        }
      geo.casters += 2 * perRow;
    }
    if (foot) {
      const inset = caster ? 180 : 70;
      for (const y of [y0 + inset, y1 - inset])
        for (const x of [x0 + inset, x1 - inset]) {
          const [px, py] = under1(members, x, y, inset);
          geo.mobility.push({ kind: 'foot', xMm: px, yMm: py, heightMm: under, blockMm: blockLayers * t });
        }
      geo.feet += 4;
    }
  }
  if (blockLayers > 0) {
    // the blocks are crosscut from 4 in strips (one part per strip, not a part per block): at most 20 blocks a strip
    const blocks = geo.feet * blockLayers;
    const strips = Math.ceil(blocks / 20);
    const perStrip = Math.ceil(blocks / strips);
    list.add({
      id: 'foot-block-strip',
      name: `foot mounting blocks, ${perStrip} to a strip`,
      materialId: carcass.id,
      quantity: strips,
      lengthMm: perStrip * (FOOT_BLOCK_MM + settings.kerfMm),
      widthMm: FOOT_BLOCK_MM,
      thicknessMm: t,
      grain: 'free',
      bandedEdges: { long: 0, short: 0 },
      pocketHoles: 0,
      dados: 0,
      finishFaces: 0,
    });
  }
  geo.footBlocks =
    blockLayers > 0 ? { count: geo.feet * blockLayers, layers: blockLayers, sideMm: FOOT_BLOCK_MM } : null;
  geo.casterId = caster?.id ?? null;
  geo.footId = foot?.id ?? null;
  geo.mobile = caster !== null;
  geo.workingLoadKg = spec.workingLoadKg;
}

function benchTop(
  spec: Extract<BuildSpec, { design: 'assembly-bench' }>,
  book: PriceBook,
  list: PartList,
  geo: PieceGeometry,
  topT: number,
): void {
  // a trimmed edge sits inside the stated width and depth; a banded one is banded on every layer's edges
  const trimT = geo.topTrimMm ?? 0;
  const L = spec.widthMm - 2 * trimT;
  const D = spec.depthMm - 2 * trimT;
  const edges = spec.top.edge === 'banded' ? 2 : 0;
  if (spec.top.kind === 'laminated') {
    const m = byId(book.sheetGoods, spec.carcassMaterialId, 'top material');
    list.add({
      id: 'top-layer',
      name: 'top layer',
      materialId: m.id,
      quantity: Math.round(topT / m.thicknessMm),
      lengthMm: L,
      widthMm: D,
      thicknessMm: m.thicknessMm,
      grain: grainOf(m, true),
      bandedEdges: { long: edges, short: edges },
      bandingId: spec.bandingId,
      pocketHoles: 0,
      dados: 0,
      finishFaces: 1,
    });
    return;
  }
  const skin = byId(book.sheetGoods, spec.top.skinMaterialId, 'top skin material');
  const core = byId(book.sheetGoods, spec.top.coreMaterialId, 'top core material');
  const ct = core.thicknessMm;
  const coreH = topT - 2 * skin.thicknessMm;
  if (coreH < ct)
    throw new BuildError(
      `The top is too thin for two ${len(skin.thicknessMm)} skins and a core: make it thicker or choose thinner skins.`,
      'top.thicknessMm',
    );
  const spacing = spec.top.gridSpacingMm;
  list.add({
    id: 'top-skin',
    name: 'skin',
    materialId: skin.id,
    quantity: 2,
    lengthMm: L,
    widthMm: D,
    thicknessMm: skin.thicknessMm,
    grain: grainOf(skin, true),
    bandedEdges: { long: edges, short: edges },
    bandingId: spec.bandingId,
    pocketHoles: 0,
    dados: 0,
    finishFaces: 1,
  });
  list.add({
    id: 'top-frame-long',
    name: 'frame, long',
    materialId: core.id,
    quantity: 2,
    lengthMm: L,
    widthMm: coreH,
    thicknessMm: ct,
    grain: 'free',
    bandedEdges: { long: 0, short: 0 },
    pocketHoles: 0,
    dados: 0,
    finishFaces: 0,
  });
  list.add({
    id: 'top-frame-end',
    name: 'frame, end',
    materialId: core.id,
    quantity: 2,
    lengthMm: D - 2 * ct,
    widthMm: coreH,
    thicknessMm: ct,
    grain: 'free',
    bandedEdges: { long: 0, short: 0 },
    pocketHoles: 0,
    dados: 0,
    finishFaces: 0,
  });
  // cross ribs run front to back between the long frame members; long ribs are cut into segments between them
  const innerL = L - 2 * ct;
  const innerD = D - 2 * ct;
  const cross = Math.max(0, Math.ceil(innerL / spacing) - 1);
  const longRows = Math.max(0, Math.ceil(innerD / spacing) - 1);
  if (cross > 0)
    list.add({
      id: 'top-rib-cross',
      name: 'grid rib, cross',
      materialId: core.id,
      quantity: cross,
      lengthMm: innerD,
      widthMm: coreH,
      thicknessMm: ct,
      grain: 'free',
      bandedEdges: { long: 0, short: 0 },
      pocketHoles: 0,
      dados: 0,
      finishFaces: 0,
    });
  if (longRows > 0) {
    // each row of long ribs is ripped as one strip and crosscut to fit between the cross ribs at assembly
    // (the segments and their kerfs come to less than the strip, since a kerf is thinner than a rib)
    list.add({
      id: 'top-rib-long',
      name: `grid rib, long, a strip to crosscut into ${cross + 1}`,
      materialId: core.id,
      quantity: longRows,
      lengthMm: innerL,
      widthMm: coreH,
      thicknessMm: ct,
      grain: 'free',
      bandedEdges: { long: 0, short: 0 },
      pocketHoles: 0,
      dados: 0,
      finishFaces: 0,
    });
  }
  geo.torsionTops = 1;
}
