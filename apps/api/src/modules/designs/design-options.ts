import { designs, formatWeight, type DesignSlug, type LengthUnit, type PriceBook } from '@benchwright/pricing';

/** One thing a client may pick for a field of the piece: a price-book item by its plain name, never its cost. */
export interface DesignOption {
  id: string;
  name: string;
  note?: string;
  thicknessMm?: number;
}

type SheetGood = PriceBook['sheetGoods'][number];

/** What a sheet is good for, in a client's words (common practice). */
const SHEET_NOTES: Record<SheetGood['kind'], string> = {
  plywood: 'veneered faces, takes a clear finish',
  mdf: 'paint-grade, no grain',
  particleboard: 'paint-grade or laminated',
  hardboard: 'no grain, hard smooth face',
};

/**
 * Which sheets suit which part, by kind and actual thickness (common practice): cases, fronts and a top's core
 * from 5/8 to 1 in stock, drawer boxes from 7/16 to 3/4 in, backs and a top's skins thin or medium, drawer bottoms
 * 3/8 in or thinner (thinner than any drawer box offered, as the engine requires). The engine's own checks still decide what prices; these are the choices offered.
 */
const SHEET_RULES = {
  carcassMaterialId: (s: SheetGood) => s.kind !== 'hardboard' && s.thicknessMm >= 15 && s.thicknessMm <= 26,
  frontMaterialId: (s: SheetGood) => s.kind !== 'hardboard' && s.thicknessMm >= 15 && s.thicknessMm <= 26,
  backMaterialId: (s: SheetGood) => s.thicknessMm <= 13,
  drawerMaterialId: (s: SheetGood) => s.kind !== 'hardboard' && s.thicknessMm >= 11 && s.thicknessMm <= 19.5,
  drawerBottomMaterialId: (s: SheetGood) => s.thicknessMm <= 10,
  'top.skinMaterialId': (s: SheetGood) => s.thicknessMm <= 19.5,
  'top.coreMaterialId': (s: SheetGood) => s.kind !== 'hardboard' && s.thicknessMm >= 11 && s.thicknessMm <= 26,
} as const;

const sheetOption = (s: SheetGood): DesignOption => ({
  id: s.id,
  name: s.name,
  note: SHEET_NOTES[s.kind],
  thicknessMm: s.thicknessMm,
});

/**
 * The choices a client may make for each field of a design, keyed by the spec field's dotted path (only the
 * fields the design has), from the shop's active price book: retired items are left out, and no cost or price is
 * ever copied; a load reads in the shop's units. Every default of the design is offered even if the rule above would not (the shop chose it).
 */
export function designOptions(slug: DesignSlug, book: PriceBook, units: LengthUnit): Record<string, DesignOption[]> {
  const defaults = designs[slug].defaults as unknown as Record<string, unknown>;
  const sheets = (field: keyof typeof SHEET_RULES, current: unknown) =>
    book.sheetGoods.filter((s) => SHEET_RULES[field](s) || s.id === current).map(sheetOption);
  const hardware = (kind: PriceBook['hardware'][number]['kind']) =>
    book.hardware
      .filter((h) => h.kind === kind)
      .map((h) => ({
        id: h.id,
        name: h.name,
        ...(h.ratedLoadKg ? { note: `carries ${formatWeight(h.ratedLoadKg, units)} each` } : {}),
      }));
  const out: Record<string, DesignOption[]> = {
    carcassMaterialId: sheets('carcassMaterialId', defaults.carcassMaterialId),
    backMaterialId: sheets('backMaterialId', defaults.backMaterialId),
    frontMaterialId: sheets('frontMaterialId', defaults.frontMaterialId),
    drawerMaterialId: sheets('drawerMaterialId', defaults.drawerMaterialId),
    drawerBottomMaterialId: sheets('drawerBottomMaterialId', defaults.drawerBottomMaterialId),
    bandingId: book.edgeBanding.map((b) => ({ id: b.id, name: b.name })),
    pullId: hardware('pull'),
    finishId: book.finishes.map((f) => ({
      id: f.id,
      name: f.name,
      note: `${f.defaultCoats} coat${f.defaultCoats === 1 ? '' : 's'} as standard`,
    })),
    'trim.lumberId': book.lumber.map((l) => ({ id: l.id, name: l.name, note: `solid ${l.species}` })),
  };
  if (slug === 'assembly-bench') {
    const top = (defaults.top ?? {}) as Record<string, unknown>;
    out['top.skinMaterialId'] = sheets('top.skinMaterialId', top.skinMaterialId);
    out['top.coreMaterialId'] = sheets('top.coreMaterialId', top.coreMaterialId);
    out.casterId = hardware('caster');
    out.footId = hardware('leveling_foot');
  }
  return out;
}
