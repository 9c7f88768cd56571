import { describe, expect, it } from 'vitest';
import { demoPriceBook, demoSettings } from '../demo-data';
import { toMm } from '../units';
import { validateSpec } from '../validate';
import { addRearCase, addSideCase, mainCaseIndex, resizeBench } from './bench-arrange';
import { benchLayout, designs, parseSpec, type AssemblyBenchSpec } from './index';

const bench = (): AssemblyBenchSpec => structuredClone(designs['assembly-bench'].defaults);
const ok = (s: AssemblyBenchSpec) => {
  const r = parseSpec(s);
  expect(r.ok ? [] : r.issues).toEqual([]);
  expect(validateSpec(s, demoPriceBook, demoSettings).ok).toBe(true);
};
/** The room between the side overhangs a row's cases take, from its first case's left end to its last's right. */
const rowEnds = (s: AssemblyBenchSpec, row: 'front' | 'back') => {
  const places = benchLayout(s).filter((_, i) => s.cases[i]!.row === row);
  return [Math.min(...places.map((p) => p.xMm)), Math.max(...places.map((p) => p.xMm + p.alongMm))];
};

describe('resizeBench', () => {
  it('grows the main case with a wider top, the overhangs as they were, and the rear cases still back to back', () => {
    const s = bench();
    const r = resizeBench(s, { widthMm: toMm(80) });
    expect(r.widthMm).toBe(toMm(80));
    expect(r.overhangLeftMm).toBe(s.overhangLeftMm);
    expect(r.overhangRightMm).toBe(s.overhangRightMm);
    expect(mainCaseIndex(r)).toBe(0);
    expect(r.cases[0]!.widthMm).toBeCloseTo(toMm(70), 0);
    expect(r.cases[1]!.widthMm + r.cases[2]!.widthMm).toBeCloseTo(r.cases[0]!.widthMm, 0);
    // the front row still ends at the right overhang
    expect(rowEnds(r, 'front')[1]).toBeCloseTo(r.widthMm - r.overhangRightMm, 0);
    expect(rowEnds(r, 'back')).toEqual(rowEnds(r, 'front').map((x) => expect.closeTo(x, 0)));
    ok(r);
    expect(s.cases[0]!.widthMm).toBe(toMm(62)); // its argument untouched
  });

  it('shrinks the main case and the rear cases with a narrower top, and it still validates', () => {
    const r = resizeBench(bench(), { widthMm: toMm(66) });
    expect(r.cases[0]!.widthMm).toBeCloseTo(toMm(56), 0);
    expect(r.cases[1]!.widthMm).toBeCloseTo(toMm(28), 0);
    ok(r);
  });

  it('gives a change in depth to the front row and keeps the rear cases fitting behind it', () => {
    const deeper = resizeBench(bench(), { depthMm: toMm(40) });
    expect(deeper.cases[0]!.depthMm).toBeCloseTo(toMm(22), 0);
    expect(deeper.cases[1]!.depthMm).toBeCloseTo(toMm(12), 0);
    ok(deeper);
    const shallower = resizeBench(bench(), { depthMm: toMm(34) });
    expect(shallower.cases[0]!.depthMm).toBeCloseTo(toMm(16), 0);
    ok(shallower);
    // a front row already as shallow as it may be: the rear cases give way
    const s = bench();
    s.cases[0]!.depthMm = toMm(12);
    s.depthMm = toMm(30);
    const r = resizeBench(s, { depthMm: toMm(26) });
    expect(r.cases[0]!.depthMm).toBe(229); // the least a case may be
    expect(r.cases[1]!.depthMm).toBeCloseTo(toMm(26 - 6) - 229, 0);
  });

  it('shortens rear cases that no longer fit between the overhangs', () => {
    const s = bench();
    s.cases[1]!.widthMm = toMm(20); // the rear row no longer spans the main case: it is left as it is when the top grows
    expect(resizeBench(s, { widthMm: toMm(80) }).cases[1]!.widthMm).toBe(toMm(20));
    s.cases[1]!.widthMm = toMm(31);
    s.cases[2]!.widthMm = toMm(31);
    s.cases[0]!.widthMm = toMm(40);
    const r = resizeBench(s, { widthMm: toMm(52) });
    expect(r.cases[1]!.widthMm + r.cases[2]!.widthMm).toBeCloseTo(toMm(42), 0);
  });
});

describe('adding cases', () => {
  it('adds a rear case back to back with a single-sided bench', () => {
    const s = bench();
    s.cases = [s.cases[0]!];
    const r = addRearCase(s);
    expect(r.cases).toHaveLength(2);
    expect(r.cases[1]).toMatchObject({ row: 'back', facing: 'back', xMm: null, depthMm: expect.closeTo(toMm(12), 0) });
    expect(r.cases[1]!.widthMm).toBeCloseTo(toMm(62), 0);
    ok(r);
  });

  it('shares the span of the main case among the rear cases when the rear row is full', () => {
    const r = addRearCase(bench());
    expect(r.cases.slice(1).map((c) => c.widthMm)).toEqual([1, 2, 3].map(() => expect.closeTo(toMm(62) / 3, 0)));
    ok(r);
  });

  it('adds a side case at the end of the front row, the main case giving way', () => {
    const r = addSideCase(bench());
    expect(r.cases.at(-1)).toMatchObject({
      row: 'front',
      facing: 'right',
      depthMm: expect.closeTo(toMm(12), 0),
      widthMm: expect.closeTo(toMm(18), 0),
    });
    expect(r.cases[0]!.widthMm).toBeCloseTo(toMm(50), 0);
    expect(rowEnds(r, 'front')[1]).toBeCloseTo(r.widthMm - r.overhangRightMm, 0);
    expect(parseSpec(r).ok).toBe(true);
  });
});
