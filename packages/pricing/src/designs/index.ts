import * as z from 'zod';
import { withUnits } from '../messages';
import type { LengthUnit } from '../units';
import {
  assemblyBenchDefaults,
  assemblyBenchLimits,
  assemblyBenchObject,
  assemblyBenchSchema,
  upgradeSpec,
} from './assembly-bench';
import { baseCabinetDefaults, baseCabinetLimits, baseCabinetSchema } from './base-cabinet';
import { bookcaseDefaults, bookcaseLimits, bookcaseSchema } from './bookcase';
import type { Bay, CaseLimits } from './case-model';
import { wallCabinetDefaults, wallCabinetLimits, wallCabinetSchema } from './wall-cabinet';

export type { AssemblyBenchSpec, BenchCase, CaseJoin, CasePlace } from './assembly-bench';
export { benchLayout, caseJoins, upgradeSpec } from './assembly-bench';
export { addRearCase, addSideCase, mainCaseIndex, resizeBench } from './bench-arrange';
export type { BaseCabinetSpec } from './base-cabinet';
export type { BookcaseSpec } from './bookcase';
export type { WallCabinetSpec } from './wall-cabinet';
export type { Bay, Compartment, Trim } from './case-model';
export { dividerCount, MIN_DRAWER_DEPTH_MM, NOMINAL_CARCASS_MM } from './case-model';

export const DESIGN_SLUGS = ['assembly-bench', 'base-cabinet', 'wall-cabinet', 'bookcase'] as const;
export type DesignSlug = (typeof DESIGN_SLUGS)[number];

export interface Design<S extends z.ZodType = z.ZodType> {
  slug: DesignSlug;
  name: string;
  summary: string;
  schema: S;
  defaults: z.infer<S>;
  limits: CaseLimits;
}

/** The shop's designs, keyed by slug; each `defaults` is a complete valid build spec. */
export const designs = {
  'assembly-bench': {
    slug: 'assembly-bench',
    name: 'Rolling assembly bench',
    summary: 'A flat, stiff torsion-box top over cases of drawers and doors on both sides, on locking casters.',
    schema: assemblyBenchSchema,
    defaults: assemblyBenchDefaults,
    limits: assemblyBenchLimits,
  },
  'base-cabinet': {
    slug: 'base-cabinet',
    name: 'Base cabinet',
    summary: 'A frameless base cabinet on a toe kick, with drawers and doors.',
    schema: baseCabinetSchema,
    defaults: baseCabinetDefaults,
    limits: baseCabinetLimits,
  },
  'wall-cabinet': {
    slug: 'wall-cabinet',
    name: 'Wall cabinet',
    summary: 'A frameless wall cabinet with doors and adjustable shelves, hung on a rail.',
    schema: wallCabinetSchema,
    defaults: wallCabinetDefaults,
    limits: wallCabinetLimits,
  },
  bookcase: {
    slug: 'bookcase',
    name: 'Bookcase',
    summary: 'A bookcase on a plinth with fixed and adjustable shelves, solid-wood face trim optional.',
    schema: bookcaseSchema,
    defaults: bookcaseDefaults,
    limits: bookcaseLimits,
  },
} as const satisfies Record<DesignSlug, Design>;

/** Any build spec: it names its design (a bench stored in the shape before arrangements is converted). */
export const BuildSpec = z.preprocess(
  upgradeSpec,
  z.discriminatedUnion('design', [assemblyBenchObject, baseCabinetSchema, wallCabinetSchema, bookcaseSchema]),
);
export type BuildSpec = z.infer<typeof BuildSpec>;

/** Every bay of a spec: a bench's bays case by case, any other design's own. */
export function specBays(spec: BuildSpec): Bay[] {
  return spec.design === 'assembly-bench' ? spec.cases.flatMap((c) => c.bays) : spec.bays;
}

export interface SpecIssue {
  path: string;
  message: string;
}

/** Writes a zod path as people read it: `bays[1].compartments[2].heightMm`. */
export function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>(
    (s, k) => (typeof k === 'number' ? `${s}[${k}]` : s ? `${s}.${String(k)}` : String(k)),
    '',
  );
}

/** Zod's own messages (a field missing, of the wrong kind, not one of a list) as sentences a client reads. */
const clientWords: z.core.$ZodErrorMap = (iss) => {
  if (iss.code === 'invalid_type')
    return iss.input === undefined ? 'This is missing: fill it in.' : 'This is not a value this field takes.';
  if (iss.code === 'invalid_value') return `Choose one of: ${iss.values.map(String).join(', ')}.`;
  if (iss.code === 'unrecognized_keys') return 'This is not a field of the piece.';
  return undefined;
};

/**
 * Validates a build spec against its design's schema (shape, limits, and
 * the fit of bays and sections). Issues name the field and the limit, in
 * full sentences, lengths in `units` (millimetres unless told).
 *
 * @example
 * parseSpec({ ...designs.bookcase.defaults, widthMm: 100 }).issues
 * // [{ path: 'widthMm', message: '100 mm is below the 305 mm minimum.' }]
 */
export function parseSpec(
  input: unknown,
  units: LengthUnit = 'mm',
): { ok: true; spec: BuildSpec } | { ok: false; issues: SpecIssue[] } {
  const slug = (input as { design?: unknown } | null)?.design;
  if (typeof slug !== 'string' || !(slug in designs)) {
    return {
      ok: false,
      issues: [{ path: 'design', message: `Choose one of the designs: ${DESIGN_SLUGS.join(', ')}.` }],
    };
  }
  // zod builds an issue's message when it is read, so the issues are read with the units set
  return withUnits(units, () => {
    const r = designs[slug as DesignSlug].schema.safeParse(input, { error: clientWords });
    if (r.success) return { ok: true, spec: r.data as BuildSpec };
    return { ok: false, issues: r.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })) };
  });
}
