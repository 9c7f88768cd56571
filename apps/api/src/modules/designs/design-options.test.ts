import { demoPriceBook, demoSettings, designs, DESIGN_SLUGS, validateSpec } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { designOptions } from './design-options';

/**
 * A copy of the spec with the value at a dotted path (`top.skinMaterialId`) replaced; null where the design's
 * standard piece has no such part (a cabinet has no trim until the client adds it).
 */
function withValue(spec: unknown, path: string, value: string): unknown {
  const copy = structuredClone(spec) as Record<string, unknown>;
  const keys = path.split('.');
  let o: Record<string, unknown> | null = copy;
  for (const k of keys.slice(0, -1)) o = (o?.[k] ?? null) as Record<string, unknown> | null;
  if (!o) return null;
  o[keys.at(-1)!] = value;
  return copy;
}

describe('the configurator’s options and the engine’s checks agree', () => {
  // the options say which items suit a field; validateSpec decides what prices. An option the engine then refuses
  // would let a client pick something the shop cannot estimate.
  for (const slug of DESIGN_SLUGS)
    it(`every option offered for ${slug} passes the engine's check of that field`, () => {
      const options = designOptions(slug, demoPriceBook, demoSettings.units);
      const refused: string[] = [];
      for (const [path, choices] of Object.entries(options))
        for (const c of choices) {
          const spec = withValue(designs[slug].defaults, path, c.id);
          if (!spec) continue;
          const v = validateSpec(spec, demoPriceBook, demoSettings);
          const own = v.ok ? [] : v.issues.filter((i) => i.path === path || i.path.startsWith(`${path}.`));
          if (own.length) refused.push(`${path}=${c.id}: ${own.map((i) => i.message).join('; ')}`);
        }
      expect(refused).toEqual([]);
    });
});

describe('the options’ notes', () => {
  it('state a caster’s load in the shop’s units', () => {
    const lb = designOptions('assembly-bench', demoPriceBook, 'in').casterId!.map((o) => o.note);
    const kg = designOptions('assembly-bench', demoPriceBook, 'mm').casterId!.map((o) => o.note);
    expect(lb.every((n) => / lb each$/.test(n ?? ''))).toBe(true);
    expect(kg.every((n) => / kg each$/.test(n ?? ''))).toBe(true);
  });
});
