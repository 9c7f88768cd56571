import { describe, expect, it } from 'vitest';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs } from './designs';
import { validateSpec } from './validate';

const cabinet = designs['base-cabinet'].defaults;
const bench = designs['assembly-bench'].defaults;

/** The issues of a spec, as path -> message. */
function issuesOf(spec: unknown, book = demoPriceBook): Record<string, string> {
  const v = validateSpec(spec, book, demoSettings);
  return v.ok ? {} : Object.fromEntries(v.issues.map((i) => [i.path, i.message]));
}

/** A spec with one field set at a dotted path. */
function withField(spec: object, path: string, value: unknown): unknown {
  const copy = structuredClone(spec) as Record<string, unknown>;
  const keys = path.split('.');
  let at = copy;
  for (const k of keys.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[keys.at(-1)!] = value;
  return copy;
}

describe('every material and hardware id of a spec is checked against the price book, by kind', () => {
  // [field, spec, an id of the wrong kind, what the message names as needed, the wrong item's kind in words]
  const fields: [string, object, string, RegExp, RegExp][] = [
    [
      'carcassMaterialId',
      cabinet,
      'hinge-concealed',
      /must be a sheet material \(plywood, MDF or particleboard\)/,
      /hinge/,
    ],
    ['backMaterialId', cabinet, 'walnut-4-4', /must be a sheet material \(.*hardboard\)/, /solid wood/],
    ['frontMaterialId', cabinet, 'waterborne-poly', /must be a sheet material/, /a finish/],
    ['drawerMaterialId', cabinet, 'birch-banding-22', /must be a sheet material/, /edge banding/],
    ['drawerBottomMaterialId', cabinet, 'pull-bar-128', /must be a sheet material/, /a pull/],
    ['bandingId', cabinet, 'waterborne-poly', /must be one of the shop's edge bandings/, /a finish/],
    ['pullId', cabinet, 'birch-ply-18', /must be a pull from the shop's hardware/, /sheet material \(plywood\)/],
    ['finishId', cabinet, 'birch-banding-22', /must be one of the shop's finishes/, /edge banding/],
    ['trim.lumberId', bench, 'birch-ply-18', /must be solid wood/, /sheet material/],
    ['casterId', bench, 'leveling-foot', /must be a caster/, /a leveling foot/],
    ['footId', bench, 'caster-locking-5in', /must be a leveling foot/, /a caster/],
    ['top.skinMaterialId', bench, 'hard-maple-4-4', /must be a sheet material/, /solid wood/],
    ['top.coreMaterialId', bench, 'hinge-inset', /must be a sheet material/, /a hinge/],
  ];

  it.each(fields)('%s: an unknown id is refused at its path, saying what to choose', (path, spec) => {
    const issues = issuesOf(withField(spec, path, 'no-such-item'));
    expect(Object.keys(issues)).toContain(path);
    expect(issues[path]).toMatch(/"no-such-item" is not in the shop's price book/);
    expect(issues[path]).toMatch(/: choose .+\.$/);
  });

  it.each(fields)(
    '%s: an item of the wrong kind is refused at its path, naming the kind needed',
    (path, spec, id, needed, is) => {
      const issues = issuesOf(withField(spec, path, id));
      expect(Object.keys(issues)).toContain(path);
      expect(issues[path]).toMatch(needed);
      expect(issues[path]).toMatch(is);
    },
  );

  it('refuses a sheet good of a kind its part does not take, and names the kinds that do', () => {
    const issues = issuesOf({ ...cabinet, carcassMaterialId: 'hardboard-6' });
    expect(issues.carcassMaterialId).toMatch(
      /hardboard is hardboard, which is not used for the case material: choose plywood, MDF or particleboard\./,
    );
  });

  it('refuses an item the shop retired (left out of the book new requests are checked against)', () => {
    const active = { ...demoPriceBook, lumber: demoPriceBook.lumber.filter((l) => l.id !== 'walnut-4-4') };
    const spec = withField(bench, 'trim.lumberId', 'walnut-4-4');
    expect(issuesOf(spec)).toEqual({});
    expect(issuesOf(spec, active)['trim.lumberId']).toMatch(/no longer offered/);
  });

  it('does not look at items the piece does not use: a bench on feet with a retired caster passes', () => {
    const book = { ...demoPriceBook, hardware: demoPriceBook.hardware.filter((h) => h.kind !== 'caster') };
    expect(issuesOf({ ...bench, mobility: 'leveling-feet' }, book)).toEqual({});
    expect(Object.keys(issuesOf(bench, book))).toEqual(['casterId']);
  });
});
