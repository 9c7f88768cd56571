import { choicesOf } from './choices';
import type { Estimate } from './costing';
import type { Cut } from './nesting';
import type { PriceBook, ShopSettings, StageKey } from './price-book';
import { designs } from './designs';
import { sheetLayoutDrawing, type Drawing } from './drawings';
import { bandingMetres } from './labour';
import type { Machining } from './machining';
import { joineryOf, type TravellerPiece } from './piece-summary';

/**
 * The shop's usual safety cautions for the traveller (DESIGN.md section 7).
 * Our own wording of common practice; the machine makers' manuals, the
 * finish makers' safety data sheets and local workplace rules come first.
 */
export const SHOP_CAUTIONS: readonly string[] = [
  'Eye and ear protection at every machine; a dust mask or respirator when cutting MDF or sanding, with the dust collector running.',
  'Full 4 x 8 sheets: carry them with two people or on a sheet cart, and set up infeed and outfeed support before breaking one down at the saw.',
  'Table saw: blade guard and riving knife on, a push stick for narrow rips, and stand out of line with the blade.',
  'Never rip a piece narrower than the blade guard and riving knife allow (the saw’s manual says how narrow): cut it from a wider board, or hold it in a jig.',
  'Pocket holes: clamp the work in the jig, keep fingers clear of the bit, and let the drill stop before lifting it out.',
  'Edge bander: the glue pot and the fresh glue line are hot enough to burn; keep hands clear of the feed and let it cool before cleaning.',
  'Unplug the machine before changing a blade or bit. Feed the router against the bit’s rotation and clamp small work.',
  'Nailers: keep hands clear of the nose and disconnect the air before clearing a jam.',
  'Finishing: ventilate, wear the respirator the finish’s safety data sheet names, and keep sparks and flames away from solvents.',
  'Oily rags can catch fire by themselves: lay them flat to dry outside or keep them in a closed metal can of water.',
  'Follow each machine’s manual and your local workplace safety rules; they come before this sheet.',
];

export interface TravellerPart {
  name: string;
  materialName: string;
  stock: 'sheet' | 'lumber';
  /** units to cut for the whole job (the part's count times the piece's quantity) */
  quantity: number;
  lengthMm: number;
  widthMm: number;
  thicknessMm: number;
  grain: string;
  /** edges to band, as "2 long, 1 short", or "" */
  banding: string;
  /** what is done to the part after cutting, with positions to mark from (data; the job paper draws it) */
  machining: Machining[];
  /** in a piece of several cases (a bench), which case the part is for, from 1; absent in a piece of one case */
  case?: number;
}

export interface TravellerSheet {
  /** 1-based within its material */
  number: number;
  yieldRatio: number;
  drawing: Drawing;
  cuts: Cut[];
}

export interface Traveller {
  pieces: TravellerPiece[];
  materials: {
    materialName: string;
    sheetCount: number;
    lowerBound: number;
    yieldRatio: number;
    sheets: TravellerSheet[];
  }[];
  pickList: { name: string; kind: string; pieces: number }[];
  bandingMetres: { name: string; metres: number }[];
  hoursByStage: Record<StageKey, number>;
  totalHours: number;
  massKg: number;
  /** the pieces' own cautions (anchoring, casters...) then the shop's */
  cautions: string[];
}

/** The case a part is for (its id starts `c<n>-`), where the piece has several. */
function caseOf(id: string, parts: readonly { id: string }[]): { case?: number } {
  const n = /^c(\d+)-/.exec(id)?.[1];
  return n && parts.some((p) => p.id.startsWith('c2-')) ? { case: Number(n) } : {};
}

/**
 * The job's shop paper from a priced estimate: the cut list by piece, every
 * sheet's layout drawing with its cut order, the hardware pick list, the
 * banding to have on hand, the hour budget and the cautions. No prices: the
 * builder's view carries none.
 *
 * @example
 * const t = traveller(estimate(items, book, settings, { effort: 'thorough' }), book, settings);
 * t.materials[0].sheets[0].drawing // one sheet to scale, for toSvg or the PDF
 */
export function traveller(e: Estimate, book: PriceBook, settings: ShopSettings): Traveller {
  const finishOf = (spec: { finishId?: string | null; coats?: number | null }) => {
    const f = spec.finishId ? book.finishes.find((x) => x.id === spec.finishId) : undefined;
    return f ? { name: f.name, coats: spec.coats ?? f.defaultCoats } : null;
  };
  const materialName = (id: string) =>
    book.sheetGoods.find((s) => s.id === id)?.name ?? book.lumber.find((l) => l.id === id)?.name ?? id;
  const pieces = e.pieces.map((p) => ({
    title: designs[p.spec.design].name,
    quantity: p.quantity,
    widthMm: p.spec.widthMm,
    heightMm: p.spec.heightMm,
    depthMm: p.spec.depthMm,
    finish: finishOf(p.spec),
    revealMm: settings.revealMm,
    overlayMm: settings.overlayMm,
    frontStyle: p.spec.frontStyle ?? settings.frontStyle ?? 'overlay',
    joinery: joineryOf(p.parts, settings.units),
    choices: choicesOf(p.spec, book, settings.units),
    parts: p.parts.map((part) => ({
      name: part.name,
      materialName: materialName(part.materialId),
      stock: part.stock,
      quantity: part.quantity * p.quantity,
      lengthMm: part.lengthMm,
      widthMm: part.widthMm,
      thicknessMm: part.thicknessMm,
      grain: part.grain,
      banding: [
        part.bandedEdges.long ? `${part.bandedEdges.long} long` : '',
        part.bandedEdges.short ? `${part.bandedEdges.short} short` : '',
      ]
        .filter(Boolean)
        .join(', '),
      machining: part.machining,
      ...caseOf(part.id, p.parts),
    })),
  }));
  const materials = e.layouts.map((l) => ({
    materialName: l.materialName,
    sheetCount: l.sheetCount,
    lowerBound: l.lowerBound,
    yieldRatio: l.yieldRatio,
    sheets: l.sheets.map((s, i) => ({
      number: i + 1,
      yieldRatio: s.yieldRatio,
      drawing: sheetLayoutDrawing(s, l.parts, {
        title: `${l.materialName}: sheet ${i + 1} of ${l.sheetCount}`,
        unit: settings.units,
      }),
      cuts: s.cuts,
    })),
  }));
  const picks = new Map<string, { name: string; kind: string; pieces: number }>();
  for (const p of e.pieces) {
    for (const h of p.hardware) {
      const cur = picks.get(h.itemId);
      picks.set(h.itemId, { name: h.name, kind: h.kind, pieces: (cur?.pieces ?? 0) + h.pieces * p.quantity });
    }
  }
  const banding = new Map<string, number>();
  for (const p of e.pieces) {
    for (const part of p.parts) {
      if (!part.bandingId) continue;
      const m = bandingMetres([{ ...part, quantity: part.quantity * p.quantity }]);
      banding.set(part.bandingId, (banding.get(part.bandingId) ?? 0) + m);
    }
  }
  const pieceCautions = [
    ...new Set(e.checks.filter((c) => c.level === 'caution' || c.level === 'warning').map((c) => c.message)),
  ];
  return {
    pieces,
    materials,
    pickList: [...picks.values()].sort((a, b) => a.kind.localeCompare(b.kind) || a.name.localeCompare(b.name)),
    bandingMetres: [...banding].map(([id, metres]) => ({
      name: book.edgeBanding.find((b) => b.id === id)?.name ?? id,
      metres: Math.round(metres * 100) / 100,
    })),
    hoursByStage: e.hoursByStage,
    totalHours: e.totalHours,
    massKg: e.massKg,
    cautions: [...pieceCautions, ...SHOP_CAUTIONS],
  };
}
