import { toMm } from '../units';
import { benchLayout, type AssemblyBenchSpec, type BenchCase } from './assembly-bench';

/**
 * Editing a bench's arrangement as a client changes it: the top's size, a case added or taken away. Pure: each
 * function returns a new spec and leaves its argument alone. The schema still judges the result; these only keep
 * the arrangement sensible (the overhangs as set, the cases under the top, back to back where they were).
 */

/** The least case width or depth the schema takes (9 in). */
const MIN_CASE_MM = 229;
/** A new rear or side case's depth: 12 in, shallow enough to reach into (common practice). */
const SHALLOW_CASE_MM = toMm(12);
/** Lengths that differ by less than this are the same (cases are measured to half a millimetre). */
const SAME_MM = 1;

type Extent = Pick<BenchCase, 'facing' | 'widthMm' | 'depthMm'>;
const sideways = (c: Pick<BenchCase, 'facing'>) => c.facing === 'left' || c.facing === 'right';
const along = (c: Extent) => (sideways(c) ? c.depthMm : c.widthMm);
const across = (c: Extent) => (sideways(c) ? c.widthMm : c.depthMm);
const withAlong = (c: BenchCase, mm: number): BenchCase =>
  sideways(c) ? { ...c, depthMm: round(mm) } : { ...c, widthMm: round(mm) };
const withAcross = (c: BenchCase, mm: number): BenchCase =>
  sideways(c) ? { ...c, widthMm: round(mm) } : { ...c, depthMm: round(mm) };
const round = (mm: number) => Math.round(mm * 10) / 10;

/** The main case: the longest case of the front row (the first of equals), or the first case. */
export function mainCaseIndex(spec: Pick<AssemblyBenchSpec, 'cases'>): number {
  let best = -1;
  spec.cases.forEach((c, i) => {
    if (c.row === 'front' && (best < 0 || along(c) > along(spec.cases[best]!) + SAME_MM)) best = i;
  });
  return Math.max(best, 0);
}

const rowIndexes = (spec: AssemblyBenchSpec, row: BenchCase['row']) =>
  spec.cases.flatMap((c, i) => (c.row === row ? [i] : []));
const rowAlong = (spec: AssemblyBenchSpec, row: BenchCase['row']) =>
  rowIndexes(spec, row).reduce((s, i) => s + along(spec.cases[i]!), 0);
const rowAcross = (spec: AssemblyBenchSpec, row: BenchCase['row']) =>
  Math.max(0, ...rowIndexes(spec, row).map((i) => across(spec.cases[i]!)));

/**
 * The bench at a new overall width and/or depth, its cases following so the overhangs stay as set: the main case
 * grows or shrinks along the bench by the change in width, and the rear cases that were back to back with it
 * across its length share its new length; rear cases that no longer fit between the overhangs are shortened in
 * proportion. A change in depth goes to the front-row cases as deep as the deepest of them; the rear cases keep
 * their depth unless the room left behind the front row is less, when they give way. No case goes below the
 * schema's least size (the schema then says what to change).
 */
export function resizeBench(spec: AssemblyBenchSpec, size: { widthMm?: number; depthMm?: number }): AssemblyBenchSpec {
  const widthMm = size.widthMm ?? spec.widthMm;
  const depthMm = size.depthMm ?? spec.depthMm;
  let cases = spec.cases.map((c) => structuredClone(c));
  const main = mainCaseIndex(spec);
  const back = rowIndexes(spec, 'back');

  const dW = widthMm - spec.widthMm;
  if (dW !== 0 && cases[main]) {
    const before = along(spec.cases[main]!);
    const after = Math.max(MIN_CASE_MM, before + dW);
    cases[main] = withAlong(cases[main]!, after);
    // cases placed at a fixed distance to the right of the main case move with its right end
    const mainX = benchLayout(spec)[main]!.xMm - spec.overhangLeftMm;
    cases = cases.map((c, i) =>
      c.xMm !== null && i !== main && c.xMm >= mainX + before - SAME_MM
        ? { ...c, xMm: round(Math.max(0, c.xMm + after - before)) }
        : c,
    );
    // rear cases that spanned the main case keep spanning it
    const backSpan = rowAlong(spec, 'back');
    if (back.length && spec.cases[main]!.row === 'front' && Math.abs(backSpan - before) <= SAME_MM)
      for (const i of back) cases[i] = withAlong(cases[i]!, (along(cases[i]!) * after) / before);
  }
  const room = widthMm - spec.overhangLeftMm - spec.overhangRightMm;
  const next = { ...spec, widthMm, depthMm, cases };
  const backSpan = rowAlong(next, 'back');
  if (back.length && backSpan > room + SAME_MM)
    for (const i of back) cases[i] = withAlong(cases[i]!, Math.max(MIN_CASE_MM, (along(cases[i]!) * room) / backSpan));

  const dD = depthMm - spec.depthMm;
  if (dD !== 0) {
    const deepest = rowAcross(spec, 'front');
    for (const i of rowIndexes(spec, 'front'))
      if (Math.abs(across(spec.cases[i]!) - deepest) <= SAME_MM)
        cases[i] = withAcross(cases[i]!, Math.max(MIN_CASE_MM, across(cases[i]!) + dD));
    const roomD = depthMm - spec.overhangFrontMm - spec.overhangBackMm;
    const behind = roomD - rowAcross(next, 'front');
    for (const i of back)
      if (across(cases[i]!) > behind + SAME_MM) cases[i] = withAcross(cases[i]!, Math.max(MIN_CASE_MM, behind));
  }
  return { ...next, cases };
}

/**
 * Door cabinets with an adjustable shelf each: what a new case holds until the client changes it. A bay to each
 * 30 in of width (at most 3), and a pair of doors in a bay wider than 20 in (common practice).
 */
function doorCabinet(c: Omit<BenchCase, 'bays'>): BenchCase {
  const n = Math.min(3, Math.max(1, Math.ceil(along(c) / toMm(30))));
  const doors = along(c) / n > toMm(20) ? 2 : 1;
  return {
    ...c,
    bays: Array.from({ length: n }, () => ({
      widthMm: null,
      compartments: [
        { kind: 'door' as const, heightMm: null, doors: doors as 1 | 2, adjustableShelves: 1, fixedShelves: 0 },
      ],
    })),
  };
}

/**
 * Adds a case behind the main case, back to back with it and facing the back. The rear row spans the main case:
 * with room left there, the new case takes it; otherwise the rear cases share the span equally. Its depth is what
 * the front row leaves, at most 12 in; when less than the least case is left, the front row gives way.
 */
export function addRearCase(spec: AssemblyBenchSpec): AssemblyBenchSpec {
  const cases = spec.cases.map((c) => structuredClone(c));
  const main = spec.cases[mainCaseIndex(spec)]!;
  const back = rowIndexes(spec, 'back');
  const roomW = spec.widthMm - spec.overhangLeftMm - spec.overhangRightMm;
  const span = Math.min(roomW, Math.max(along(main), rowAlong(spec, 'back')));
  let widthMm = span - rowAlong(spec, 'back');
  if (widthMm < MIN_CASE_MM) {
    widthMm = Math.max(MIN_CASE_MM, span / (back.length + 1));
    for (const i of back) cases[i] = withAlong(cases[i]!, widthMm);
  }
  const roomD = spec.depthMm - spec.overhangFrontMm - spec.overhangBackMm;
  let depthMm = Math.min(SHALLOW_CASE_MM, roomD - rowAcross(spec, 'front'));
  if (depthMm < MIN_CASE_MM) {
    depthMm = MIN_CASE_MM;
    for (const i of rowIndexes(spec, 'front'))
      if (across(cases[i]!) > roomD - depthMm) cases[i] = withAcross(cases[i]!, Math.max(MIN_CASE_MM, roomD - depthMm));
  }
  cases.push(doorCabinet({ widthMm: round(widthMm), depthMm: round(depthMm), xMm: null, row: 'back', facing: 'back' }));
  return { ...spec, cases };
}

/**
 * Adds a case at the right end of the front row, facing that end (reached from the bench's end), as deep from
 * front to back as the main case and 12 in along the bench; when the front row leaves too little room, the main
 * case gives way.
 */
export function addSideCase(spec: AssemblyBenchSpec): AssemblyBenchSpec {
  const cases = spec.cases.map((c) => structuredClone(c));
  const m = mainCaseIndex(spec);
  const roomW = spec.widthMm - spec.overhangLeftMm - spec.overhangRightMm;
  const free = roomW - rowAlong(spec, 'front');
  const length = SHALLOW_CASE_MM;
  if (free < length) cases[m] = withAlong(cases[m]!, Math.max(MIN_CASE_MM, along(cases[m]!) - (length - free)));
  cases.push(
    doorCabinet({
      widthMm: round(across(spec.cases[m]!)),
      depthMm: round(length),
      xMm: null,
      row: 'front',
      facing: 'right',
    }),
  );
  return { ...spec, cases };
}
