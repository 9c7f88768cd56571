/**
 * What is done to a part after it is cut, with positions a builder can mark
 * from. Distances are in mm: along a part's length from one of its ends, or
 * across its width from one of its long edges. The edges are named as the
 * part sits in the piece: a side's `front` and `back` edges and its `top` and
 * `bottom` ends; a door's `hinge` edge; a horizontal part's `left` and
 * `right` ends.
 */
export type PartEdge = 'front' | 'back' | 'top' | 'bottom' | 'left' | 'right' | 'hinge' | 'opening';

/**
 * The face worked: `inside` faces the inside of the case (or of the drawer
 * box); a partition's `left` and `right` faces are as seen from the front;
 * `top` and `underside` for a part lying flat.
 */
export type PartFace = 'inside' | 'outside' | 'left' | 'right' | 'top' | 'underside';

/**
 * A dado (across the part), a rabbet (a dado at the very end or edge) or a
 * groove (along the part), cut into a face. A cut shorter than the part is
 * stopped, running from the front edge (or the bottom end).
 */
export interface DadoOp {
  kind: 'dado' | 'rabbet' | 'groove';
  /** what sits in it */
  for: string;
  face: PartFace;
  /** the edge or end the near side of the cut is measured from */
  fromEdge: PartEdge;
  /** from that edge to the near side of the cut */
  distanceMm: number;
  widthMm: number;
  depthMm: number;
  /** length of the cut (the run across or along the part) */
  lengthMm: number;
  /** where the parts of one line differ, which of them ("left", "right", "partition 2"); all when absent */
  only?: string;
}

/** A row of shelf-pin holes, set back from the front or back edge, run up from a first hole. */
export interface ShelfPinRowOp {
  kind: 'shelf_pin_row';
  face: PartFace;
  /** the row's centre line from this edge */
  fromEdge: 'front' | 'back';
  setbackMm: number;
  /** the first hole's centre from this end */
  fromEnd: 'bottom';
  firstHoleMm: number;
  spacingMm: number;
  holes: number;
  diameterMm: number;
  only?: string;
}

/** Concealed-hinge cup bores on a door: centres from the hinge edge and from the door's bottom end. */
export interface HingeCupOp {
  kind: 'hinge_cup';
  face: 'inside';
  diameterMm: number;
  depthMm: number;
  fromEdge: 'hinge';
  /** cup centre from the hinge edge */
  edgeDistanceMm: number;
  fromEnd: 'bottom';
  /** each cup's centre from the bottom end */
  centresMm: number[];
}

/**
 * Pocket holes drilled at one or more ends of a part, to fasten it into the neighbouring part: at each end a row of
 * holes along the joint, each centred `centresMm` from `fromEdge` (the same at every end).
 */
export interface PocketHoleOp {
  kind: 'pocket_holes';
  face: PartFace;
  /** every hole of the op: the holes at an end times the ends */
  count: number;
  /** the ends the holes are drilled at */
  at: PartEdge[];
  /** the edge the centres are measured from (absent, with `centresMm`, in travellers recorded before they were given) */
  fromEdge?: PartEdge;
  /** each hole's centre from `fromEdge`, along the joint */
  centresMm?: number[];
}

/** A notch cut out of the front bottom corner of a side for the toe kick. */
export interface ToeKickNotchOp {
  kind: 'toe_kick_notch';
  corner: 'front-bottom';
  /** up from the bottom end */
  heightMm: number;
  /** in from the front edge */
  depthMm: number;
}

export interface BandOp {
  kind: 'band';
  edges: PartEdge[];
}

export type Machining = DadoOp | ShelfPinRowOp | HingeCupOp | PocketHoleOp | ToeKickNotchOp | BandOp;

// Positions of the trade (all common practice): shelf pins 5 mm on a 32 mm
// pitch, rows 37 mm in from the front and from the inside of the back, the
// first and last holes at least 64 mm from the compartment's floor and roof;
// 35 mm hinge cups 13 mm deep, centred 22.5 mm from the door's edge (a 5 mm
// boring distance), the end cups 100 mm from the door's ends; a toe kick set
// back 3 in.
export const PIN_DIAMETER_MM = 5;
export const PIN_PITCH_MM = 32;
export const PIN_SETBACK_MM = 37;
export const PIN_END_CLEARANCE_MM = 64;
export const CUP_DIAMETER_MM = 35;
export const CUP_DEPTH_MM = 13;
export const CUP_EDGE_DISTANCE_MM = 22.5;
export const CUP_END_DISTANCE_MM = 100;
export const TOE_KICK_SETBACK_MM = 76.2;

const r1 = (v: number) => Math.round(v * 10) / 10;

/**
 * The two shelf-pin rows (front and back) for a compartment on one face:
 * holes on the 32 mm pitch from 64 mm above the floor to 64 mm under the roof.
 *
 * @example pinRows({ face: 'inside', floorMm: 120, heightMm: 600, backSetbackMm: 55.3 })
 */
export function pinRows(o: {
  face: PartFace;
  /** the compartment's floor from the part's bottom end */
  floorMm: number;
  heightMm: number;
  /** the back row's centre from the part's back edge */
  backSetbackMm: number;
  /** the front row's centre from the part's front edge (37 mm; more behind an inset door) */
  frontSetbackMm?: number;
  only?: string;
}): ShelfPinRowOp[] {
  const holes = Math.floor((o.heightMm - 2 * PIN_END_CLEARANCE_MM) / PIN_PITCH_MM) + 1;
  if (holes < 1) return [];
  return (['front', 'back'] as const).map((edge) => ({
    kind: 'shelf_pin_row' as const,
    face: o.face,
    fromEdge: edge,
    setbackMm: r1(edge === 'front' ? (o.frontSetbackMm ?? PIN_SETBACK_MM) : o.backSetbackMm),
    fromEnd: 'bottom' as const,
    firstHoleMm: r1(o.floorMm + PIN_END_CLEARANCE_MM),
    spacingMm: PIN_PITCH_MM,
    holes,
    diameterMm: PIN_DIAMETER_MM,
    ...(o.only ? { only: o.only } : {}),
  }));
}

/**
 * Hinge cups for a door of a height with `hinges` hinges: the end cups 100 mm
 * from the ends, the rest evenly between.
 *
 * @example hingeCups(700, 2).centresMm // [100, 600]
 */
export function hingeCups(heightMm: number, hinges: number): HingeCupOp {
  const first = CUP_END_DISTANCE_MM;
  const last = heightMm - CUP_END_DISTANCE_MM;
  const centresMm = Array.from({ length: hinges }, (_, i) =>
    r1(hinges === 1 ? heightMm / 2 : first + ((last - first) * i) / (hinges - 1)),
  );
  return {
    kind: 'hinge_cup',
    face: 'inside',
    diameterMm: CUP_DIAMETER_MM,
    depthMm: CUP_DEPTH_MM,
    fromEdge: 'hinge',
    edgeDistanceMm: CUP_EDGE_DISTANCE_MM,
    fromEnd: 'bottom',
    centresMm,
  };
}

// Pocket holes along a joint (common practice): a hole 2 in (about 50 mm) in from each end of the joint, the rest
// evenly between at no more than 8 in (the trade's rule of thumb is 6 to 8 in, 150 to 200 mm). On a joint shorter
// than 8 in, where 2 in would crowd them, the two end holes sit a quarter of its length in from its ends (a 3 in rail
// takes two, 3/4 in from its edges); one under 1 1/2 in takes a single hole at its middle.
export const POCKET_END_INSET_MM = 50.8;
export const POCKET_MAX_SPACING_MM = 203.2;
const POCKET_SINGLE_UNDER_MM = 38.1;

/**
 * The centres of the pocket holes along a joint `jointMm` long, from one of its ends (or from a point `startMm` before
 * it): the count follows from the spacing.
 *
 * @example pocketHoleCentres(609.6) // [50.8, 220.1, 389.5, 558.8]
 * @example pocketHoleCentres(76.2) // [19.1, 57.2]
 */
export function pocketHoleCentres(jointMm: number, startMm = 0): number[] {
  if (jointMm < POCKET_SINGLE_UNDER_MM) return [r1(startMm + jointMm / 2)];
  const inset = Math.min(POCKET_END_INSET_MM, jointMm / 4);
  const span = jointMm - 2 * inset;
  const gaps = Math.max(1, Math.ceil(span / POCKET_MAX_SPACING_MM - 1e-9));
  return Array.from({ length: gaps + 1 }, (_, i) => r1(startMm + inset + (span * i) / gaps));
}

/**
 * Pocket holes at each of the ends `at`, along a joint `jointMm` long (the part's width there, or what of it lies
 * `startMm` and more from `fromEdge`), centres measured from `fromEdge`; `count` is every hole of the op, the same
 * count a part's `pocketHoles` and the labour take.
 *
 * @example pocketHoles({ face: 'top', at: ['left', 'right'], fromEdge: 'front', jointMm: 101.6 }).count // 4
 */
export function pocketHoles(o: {
  face: PartFace;
  at: PartEdge[];
  fromEdge: PartEdge;
  jointMm: number;
  startMm?: number;
}): PocketHoleOp {
  const centresMm = pocketHoleCentres(o.jointMm, o.startMm);
  return {
    kind: 'pocket_holes',
    face: o.face,
    count: centresMm.length * o.at.length,
    at: o.at,
    fromEdge: o.fromEdge,
    centresMm,
  };
}

/** Every pocket hole among a part's machining. */
export function pocketHoleCount(ops: readonly Machining[]): number {
  return ops.reduce((s, o) => s + (o.kind === 'pocket_holes' ? o.count : 0), 0);
}

/** A dado, rabbet or groove with its sizes rounded to 0.1 mm; a cut at distance 0 is a rabbet. */
export function cut(o: Omit<DadoOp, 'kind'> & { kind?: 'dado' | 'groove' }): DadoOp {
  const kind = o.kind === 'groove' ? 'groove' : o.distanceMm <= 1e-6 ? 'rabbet' : 'dado';
  return {
    ...o,
    kind,
    distanceMm: r1(o.distanceMm),
    widthMm: r1(o.widthMm),
    depthMm: r1(o.depthMm),
    lengthMm: r1(o.lengthMm),
  };
}

/** The banded edges, in the part's own words. */
export function band(...edges: PartEdge[]): BandOp[] {
  return edges.length ? [{ kind: 'band', edges }] : [];
}
