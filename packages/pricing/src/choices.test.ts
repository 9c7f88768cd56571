import { describe, expect, it } from 'vitest';
import { choicesOf } from './choices';
import { demoPriceBook } from './demo-data';
import { designs, type BuildSpec } from './designs';

const bench = designs['assembly-bench'].defaults;
const valueOf = (choices: { label: string; value: string }[], label: string) =>
  choices.find((c) => c.label === label)?.value;

describe('choicesOf: the client’s choices in plain words', () => {
  it('reads the bench’s defaults from the demo book, in inches', () => {
    const c = choicesOf(bench, demoPriceBook, 'in');
    expect(c).toEqual([
      { label: 'Size', value: '72 in wide, 35 in high, 36 in deep' },
      { label: 'Case', value: '3/4 in birch plywood' },
      { label: 'Back', value: '1/4 in tempered hardboard, set in grooves' },
      { label: 'Doors and drawer fronts', value: '3/4 in birch plywood' },
      { label: 'Drawer boxes', value: '1/2 in birch plywood' },
      { label: 'Drawer bottoms', value: '1/4 in birch plywood' },
      { label: 'Edge banding', value: 'Birch veneer banding, 7/8 in' },
      { label: 'Pulls', value: 'Bar pull, 128 mm centers' },
      { label: 'Finish', value: 'Waterborne polyurethane, satin, 3 coats' },
      { label: 'Trim', value: 'Hard maple, 3 1/2 in wide, 3/4 in thick' },
      {
        label: 'Top',
        value: 'Torsion box 3 1/2 in thick: 1/2 in MDF skins over a 3/4 in MDF grid at 8 in, solid-wood edge',
      },
      { label: 'Overhangs', value: '3 in front and back; 5 in at each end' },
      {
        label: 'Mobility',
        value: 'On casters (Locking swivel caster, 5 in) with leveling feet (Leveling foot, 2 in)',
      },
      {
        label: 'Arrangement',
        value: 'Main case 62 in wide with 2 bays; 2 rear cases 31 in wide with 2 bays, back to back, fronts facing out',
      },
      {
        label: 'Main case',
        value: 'bay 1: 5 drawers; bay 2: from the bottom, pair of doors, 1 adjustable shelf; 2 drawers 4 in high',
      },
      {
        label: 'Rear cases (2)',
        value:
          'bay 1: door hinged on the left, 1 adjustable shelf; bay 2: door hinged on the right, 1 adjustable shelf',
      },
    ]);
  });

  it('speaks millimetres for a metric shop', () => {
    const c = choicesOf(bench, demoPriceBook, 'mm');
    expect(valueOf(c, 'Trim')).toBe('Hard maple, 89 mm wide, 19 mm thick');
    expect(valueOf(c, 'Size')).toBe('1829 mm wide, 889 mm high, 914 mm deep');
    expect(valueOf(c, 'Overhangs')).toBe('76 mm front and back; 127 mm at each end');
    expect(valueOf(c, 'Arrangement')).toMatch(/^Main case 1575 mm wide with 2 bays; 2 rear cases 787 mm wide/);
  });

  it('follows what was chosen: walnut trim, no finish, feet only, a laminated top, one case', () => {
    const spec: BuildSpec = {
      ...bench,
      trim: { lumberId: 'walnut-4-4', widthMm: 50.8, thicknessMm: 19.05 },
      finishId: null,
      coats: null,
      mobility: 'leveling-feet',
      top: { ...bench.top, kind: 'laminated', thicknessMm: 38.1, edge: 'banded' },
      cases: [bench.cases[0]!],
    };
    const c = choicesOf(spec, demoPriceBook, 'in');
    expect(valueOf(c, 'Trim')).toBe('Black walnut, 2 in wide, 3/4 in thick');
    expect(valueOf(c, 'Finish')).toBe('No finish');
    expect(valueOf(c, 'Mobility')).toBe('On feet: Leveling foot, 2 in');
    expect(valueOf(c, 'Top')).toBe('Laminated from 3/4 in birch plywood, about 1 1/2 in thick, banded edge');
    expect(valueOf(c, 'Arrangement')).toBe('Main case 62 in wide with 2 bays');
  });

  it('leaves out what a piece does not have, and names doors per section', () => {
    const c = choicesOf(designs['wall-cabinet'].defaults, demoPriceBook, 'in');
    expect(c.map((x) => x.label)).not.toContain('Drawer boxes');
    expect(valueOf(c, 'Doors')).toBe('3/4 in birch plywood');
    expect(valueOf(c, 'Sections')).toBe('pair of doors, 2 adjustable shelves');
    const open = choicesOf(designs.bookcase.defaults, demoPriceBook, 'in');
    expect(open.map((x) => x.label)).not.toContain('Pulls');
    expect(valueOf(open, 'Plinth')).toBe('3 in high');
  });

  it('shows an id the book no longer holds as it is, rather than failing', () => {
    const c = choicesOf({ ...bench, pullId: 'gone-pull' }, { ...demoPriceBook, hardware: [] }, 'in');
    expect(valueOf(c, 'Pulls')).toBe('gone-pull');
  });
  it('names the fronts’ style only where the piece sets its own', () => {
    const cabinet = structuredClone(designs['base-cabinet'].defaults) as BuildSpec;
    const fronts = (s: BuildSpec) => choicesOf(s, demoPriceBook, 'in').find((c) => c.label === 'Fronts')?.value;
    expect(fronts(cabinet)).toBeUndefined();
    expect(fronts({ ...cabinet, frontStyle: 'inset' } as BuildSpec)).toBe('Inset, inside the openings');
  });
});
