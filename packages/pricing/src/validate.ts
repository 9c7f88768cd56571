import { pieceChecks } from './checks';
import { BuildError, cutList, sheetFits, type CutList, type CutPart } from './cut-list';
import { parseSpec, type BuildSpec, type SpecIssue } from './designs';
import { len, messageUnits, sentence, where, withUnits } from './messages';
import type { HardwareKind, PriceBook, SheetGood, ShopSettings } from './price-book';
import { toMm, type LengthUnit } from './units';

/** A door at least 6 in wide: room for the hinge cups and a pull (common practice). */
export const MIN_DOOR_WIDTH_MM = toMm(6);
/** A door at least 6 in tall: room for two hinges (common practice). */
export const MIN_DOOR_HEIGHT_MM = toMm(6);
/** Drawer fronts from 3 in (a shallow pencil drawer) to 18 in tall (a deep file or pot drawer); taller is a door (common practice). */
export const DRAWER_FRONT_HEIGHT_MM: readonly [number, number] = [toMm(3), toMm(18)];
/** Drawers up to 36 in wide: wider boxes rack on a pair of side-mount slides (common practice). */
export const MAX_DRAWER_WIDTH_MM = toMm(36);
/** Case panels, fronts and drawer sides of at least 1/2 in stock, or 3/8 in for drawer sides (common practice). */
const MIN_PANEL_MM = 11.5;
const MIN_DRAWER_SIDE_MM = 9;

/**
 * Validates a build spec fully, so that `estimate` prices whatever it accepts:
 * its design's schema (shape, limits, fit), every referenced item in the
 * price book and of the right kind for its part, a cut list that builds,
 * every part on one stock sheet of its material with its grain rule, fronts
 * of sizes a shop builds, and shelves the material can carry. Messages are
 * full sentences with lengths in `units` (the shop's, by default).
 *
 * @example validateSpec(designs.bookcase.defaults, demoPriceBook, demoSettings).ok // true
 */
export function validateSpec(
  input: unknown,
  book: PriceBook,
  settings: ShopSettings,
  units: LengthUnit = settings.units,
): { ok: true; spec: BuildSpec } | { ok: false; issues: SpecIssue[] } {
  const parsed = parseSpec(input, units);
  if (!parsed.ok) return parsed;
  const issues = withUnits(units, () => buildIssues(parsed.spec, book, settings));
  return issues.length ? { ok: false, issues } : parsed;
}

function buildIssues(spec: BuildSpec, book: PriceBook, settings: ShopSettings): SpecIssue[] {
  const missing = references(spec, book);
  if (missing.length) return missing;
  let list: CutList;
  try {
    list = cutList(spec, book, settings);
  } catch (err) {
    if (err instanceof BuildError) return [{ path: err.path, message: sentence(err.message) }];
    if (err instanceof RangeError) return [{ path: '', message: sentence(err.message) }];
    throw err;
  }
  const bench = spec.design === 'assembly-bench';
  const issues = [...partsOnSheets(list, book, settings, bench), ...frontSizes(list, settings, bench)];
  if (issues.length) return issues;
  return pieceChecks(list, book, { ...settings, units: messageUnits() })
    .checks.filter((c) => c.level === 'error')
    .map((c) => ({ path: c.path ?? '', message: c.message }));
}

type SheetUse = 'case' | 'back' | 'front' | 'drawer' | 'drawer bottom' | 'top';
/** Which sheet goods may serve a part: case panels, fronts and drawer boxes want plywood, MDF or particleboard; backs and bottoms take hardboard too. */
const SHEET_KINDS: Record<SheetUse, readonly SheetGood['kind'][]> = {
  case: ['plywood', 'mdf', 'particleboard'],
  back: ['plywood', 'mdf', 'particleboard', 'hardboard'],
  front: ['plywood', 'mdf', 'particleboard'],
  drawer: ['plywood', 'mdf', 'particleboard'],
  'drawer bottom': ['plywood', 'mdf', 'particleboard', 'hardboard'],
  top: ['plywood', 'mdf', 'particleboard', 'hardboard'],
};

/** What a price-book item is, in a client's words, whichever list holds it (undefined: in none). */
function kindOf(book: PriceBook, id: string): { name: string; what: string } | undefined {
  const sheet = book.sheetGoods.find((x) => x.id === id);
  if (sheet) return { name: sheet.name, what: `a sheet material (${SHEET_KIND_WORDS[sheet.kind]})` };
  const lumber = book.lumber.find((x) => x.id === id);
  if (lumber) return { name: lumber.name, what: 'solid wood' };
  const banding = book.edgeBanding.find((x) => x.id === id);
  if (banding) return { name: banding.name, what: 'edge banding' };
  const finish = book.finishes.find((x) => x.id === id);
  if (finish) return { name: finish.name, what: 'a finish' };
  const hw = book.hardware.find((x) => x.id === id);
  if (hw) return { name: hw.name, what: `hardware (${HARDWARE_WORDS[hw.kind]})` };
  return undefined;
}

const SHEET_KIND_WORDS: Record<SheetGood['kind'], string> = {
  plywood: 'plywood',
  mdf: 'MDF',
  particleboard: 'particleboard',
  hardboard: 'hardboard',
};
const HARDWARE_WORDS: Record<HardwareKind, string> = {
  slide: 'a drawer slide',
  hinge: 'a hinge',
  shelf_pin: 'a shelf pin',
  pull: 'a pull',
  caster: 'a caster',
  leveling_foot: 'a leveling foot',
  pocket_screw: 'a pocket screw',
  rail_screw: 'a rail screw',
  anti_tip_kit: 'an anti-tip kit',
  hanging_rail: 'a hanging rail',
  screw: 'a screw',
  bolt: 'a bolt',
  connector: 'a connector',
};

/** The sheet kinds a use takes, in words: `plywood, MDF or particleboard`. */
function sheetWords(use: SheetUse): string {
  const words = SHEET_KINDS[use].map((k) => SHEET_KIND_WORDS[k]);
  return words.length > 1 ? `${words.slice(0, -1).join(', ')} or ${words.at(-1)}` : (words[0] ?? '');
}

/**
 * Every item the spec names is in the price book, in the right list and of a
 * kind that suits its part; each refusal names the field, what it holds and
 * what kind the part needs. Items the piece does not use (the casters of a
 * bench on feet, a laminated top's skins) are not looked at, so retiring them
 * refuses nothing.
 */
function references(spec: BuildSpec, book: PriceBook): SpecIssue[] {
  const issues: SpecIssue[] = [];
  /** An id in no list, or in another list than `wanted`: its issue. */
  const wrong = (path: string, id: string, what: string, wanted: string): boolean => {
    const other = kindOf(book, id);
    issues.push({
      path,
      message: other
        ? `The ${what} must be ${wanted}; ${other.name} is ${other.what}.`
        : `The ${what} "${id}" is not in the shop's price book (or is no longer offered): choose ${wanted}.`,
    });
    return false;
  };
  const sheet = (path: string, id: string, use: SheetUse, what: string, minMm = 0) => {
    const m = book.sheetGoods.find((x) => x.id === id);
    if (!m) return wrong(path, id, what, `a sheet material (${sheetWords(use)})`);
    if (!SHEET_KINDS[use].includes(m.kind))
      return issues.push({
        path,
        message: `${m.name} is ${SHEET_KIND_WORDS[m.kind]}, which is not used for the ${what}: choose ${sheetWords(use)}.`,
      });
    if (m.thicknessMm < minMm)
      issues.push({
        path,
        message: `${m.name} is too thin for the ${what}: choose stock of at least ${len(minMm)}.`,
      });
  };
  const hardware = (path: string, id: string, kind: HardwareKind, what: string) => {
    const h = book.hardware.find((x) => x.id === id);
    if (!h || h.kind !== kind) wrong(path, id, what, `${HARDWARE_WORDS[kind]} from the shop's hardware`);
  };
  sheet('carcassMaterialId', spec.carcassMaterialId, 'case', 'case material', MIN_PANEL_MM);
  sheet('backMaterialId', spec.backMaterialId, 'back', 'back material');
  sheet('frontMaterialId', spec.frontMaterialId, 'front', 'door and drawer front material', MIN_PANEL_MM);
  sheet('drawerMaterialId', spec.drawerMaterialId, 'drawer', 'drawer box material', MIN_DRAWER_SIDE_MM);
  sheet('drawerBottomMaterialId', spec.drawerBottomMaterialId, 'drawer bottom', 'drawer bottom material');
  const carcass = book.sheetGoods.find((x) => x.id === spec.carcassMaterialId);
  const back = book.sheetGoods.find((x) => x.id === spec.backMaterialId);
  if (carcass && back && back.thicknessMm >= carcass.thicknessMm)
    issues.push({
      path: 'backMaterialId',
      message: `${back.name} is as thick as the case sides: choose a thinner back.`,
    });
  const drawer = book.sheetGoods.find((x) => x.id === spec.drawerMaterialId);
  const bottom = book.sheetGoods.find((x) => x.id === spec.drawerBottomMaterialId);
  if (drawer && bottom && bottom.thicknessMm >= drawer.thicknessMm)
    issues.push({
      path: 'drawerBottomMaterialId',
      message: `${bottom.name} is as thick as the drawer sides: choose a thinner drawer bottom.`,
    });
  if (!book.edgeBanding.some((b) => b.id === spec.bandingId))
    wrong('bandingId', spec.bandingId, 'edge banding', "one of the shop's edge bandings");
  hardware('pullId', spec.pullId, 'pull', 'pull');
  if (spec.finishId && !book.finishes.some((f) => f.id === spec.finishId))
    wrong('finishId', spec.finishId, 'finish', "one of the shop's finishes");
  if (spec.trim && !book.lumber.some((l) => l.id === spec.trim?.lumberId))
    wrong('trim.lumberId', spec.trim.lumberId, 'trim', "solid wood from the shop's lumber");
  if (spec.design === 'assembly-bench') {
    if (spec.mobility !== 'leveling-feet') hardware('casterId', spec.casterId, 'caster', 'caster');
    if (spec.mobility !== 'locking-casters') hardware('footId', spec.footId, 'leveling_foot', 'leveling foot');
    if (spec.top.kind === 'torsion-box') {
      sheet('top.skinMaterialId', spec.top.skinMaterialId, 'top', 'top skin material');
      sheet('top.coreMaterialId', spec.top.coreMaterialId, 'case', 'top core material');
    }
  }
  return issues;
}

/** The field to change for a part too large for its sheet, from the part's id. */
/** A bench's part names its case (`c2-b1-k1-door`): the issue's path and words start at that case. */
function caseOf(p: CutPart, bench: boolean): { path: string; words: string } {
  const m = bench ? /^c(\d+)-/.exec(p.id) : null;
  return m ? { path: `cases[${Number(m[1]) - 1}].`, words: `Case ${m[1]}, ` } : { path: '', words: '' };
}

function partPath(p: CutPart, bench: boolean): string {
  const m = /-b(\d+)-k(\d+)-/.exec(p.id);
  if (m) return `${caseOf(p, bench).path}bays[${Number(m[1]) - 1}].compartments[${Number(m[2]) - 1}]`;
  if (/-back(-\d+)?$/.test(p.id)) return 'backMaterialId';
  if (/-side$|-partition$/.test(p.id)) return 'heightMm';
  if (p.id.startsWith('top-skin')) return 'top.skinMaterialId';
  if (p.id.startsWith('top-')) return 'widthMm';
  return 'widthMm';
}

function advice(p: CutPart): string {
  if (/-back(-\d+)?$/.test(p.id))
    return 'add a bay so the back can be split over its partition, make the case smaller, or choose a back material without grain (hardboard or MDF)';
  if (/-door$/.test(p.id)) return 'make the door smaller, or choose a front material without grain (MDF)';
  if (/-drawer-front$/.test(p.id)) return 'make the drawer smaller, or choose a front material without grain (MDF)';
  if (p.id.startsWith('top-')) return 'make the top smaller, or choose a material without grain (MDF)';
  return 'make the piece smaller, or choose a material whose sheets are large enough';
}

/** Every sheet part fits one stock sheet of its material, inside the edge trim, with its grain rule. */
function partsOnSheets(list: CutList, book: PriceBook, settings: ShopSettings, bench: boolean): SpecIssue[] {
  const issues: SpecIssue[] = [];
  for (const p of list.parts) {
    if (p.stock !== 'sheet') continue;
    const m = book.sheetGoods.find((x) => x.id === p.materialId);
    if (!m) {
      issues.push({ path: partPath(p, bench), message: `The ${p.name} is of a material the shop does not stock.` });
      continue;
    }
    if (sheetFits(m, settings.sheetTrimMm, p.lengthMm, p.widthMm, p.grain)) continue;
    const turned = p.grain === 'fixed' && sheetFits(m, settings.sheetTrimMm, p.lengthMm, p.widthMm, 'free');
    issues.push({
      path: partPath(p, bench),
      message: `The ${p.name} (${len(p.lengthMm)} x ${len(p.widthMm)}) is larger than a ${len(m.sheetLengthMm)} x ${len(m.sheetWidthMm)} sheet of ${m.name}${turned ? ' with its grain running the length of the part' : ''}: ${advice(p)}.`,
    });
  }
  return issues;
}

/** Doors and drawer fronts of sizes a shop builds (limits above, common practice). */
function frontSizes(list: CutList, settings: ShopSettings, bench: boolean): SpecIssue[] {
  const issues: SpecIssue[] = [];
  for (const p of list.parts) {
    const m = /-b(\d+)-k(\d+)-(door|drawer-front)$/.exec(p.id);
    if (!m) continue;
    const b = Number(m[1]) - 1;
    const k = Number(m[2]) - 1;
    const own = caseOf(p, bench);
    const path = `${own.path}bays[${b}].compartments[${k}]`;
    const at = `${own.words}${where(b, k)}`;
    if (m[3] === 'door') {
      const w = p.widthMm;
      if (p.lengthMm < MIN_DOOR_HEIGHT_MM - 1e-6)
        issues.push({
          path: `${path}.heightMm`,
          message: `${at}: the door would be ${len(p.lengthMm)} tall; a door needs at least ${len(MIN_DOOR_HEIGHT_MM)} for its hinges: make the section taller, or choose open shelves or a drawer.`,
        });
      if (w > settings.maxDoorWidthMm + 1e-6)
        issues.push({
          path: `${path}.doors`,
          message: `${at}: each door would be ${len(w)} wide, more than the ${len(settings.maxDoorWidthMm)} the shop hangs: add a bay to divide the opening, or make it narrower.`,
        });
      else if (w < MIN_DOOR_WIDTH_MM - 1e-6)
        issues.push({
          path: `${path}.doors`,
          message: `${at}: ${p.quantity > 1 ? 'each door' : 'the door'} would be ${len(w)} wide; a door needs at least ${len(MIN_DOOR_WIDTH_MM)} for its hinges and pull: ${p.quantity > 1 ? 'choose one door, or make the bay wider' : 'make the bay wider'}.`,
        });
    } else {
      const w = p.lengthMm;
      const h = p.widthMm;
      const [low, high] = DRAWER_FRONT_HEIGHT_MM;
      if (h > high + 1e-6)
        issues.push({
          path: `${path}.heightMm`,
          message: `${at}: the drawer front would be ${len(h)} tall, more than the ${len(high)} a drawer is built to: make it a door, add sections, or set a lower height.`,
        });
      else if (h < low - 1e-6)
        issues.push({
          path: `${path}.heightMm`,
          message: `${at}: the drawer front would be ${len(h)} tall, less than the ${len(low)} a drawer needs: make it taller.`,
        });
      if (w > MAX_DRAWER_WIDTH_MM + 1e-6)
        issues.push({
          path: `${own.path}bays[${b}].widthMm`,
          message: `${at}: the drawer would be ${len(w)} wide, more than the ${len(MAX_DRAWER_WIDTH_MM)} a pair of slides carries square: add a bay to divide it.`,
        });
    }
  }
  return issues;
}
