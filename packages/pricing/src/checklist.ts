import type { StageKey } from './price-book';
import type { Traveller } from './traveller';

export interface ChecklistItem {
  /** stable within a job: "<stage>.<what>" */
  key: string;
  stage: StageKey;
  text: string;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * What the builder ticks off in each stage of a job, worded from the job's own
 * paper (its sheets, parts and pick list). The steps are the shop's usual
 * order of work (common practice); a step that does not apply to the job
 * (no drawers, no casters) is left out.
 *
 * @example
 * stageChecklist(traveller).filter((i) => i.stage === 'cutting')
 * // [{ key: 'cutting.breakdown', text: 'Break down the 9 sheets to their layouts', ... }, ...]
 */
export function stageChecklist(t: Pick<Traveller, 'pieces' | 'materials' | 'pickList' | 'bandingMetres'>) {
  const sheets = t.materials.reduce((n, m) => n + m.sheetCount, 0);
  const parts = t.pieces.reduce((n, p) => n + p.parts.reduce((k, part) => k + part.quantity, 0), 0);
  const lumber = t.pieces.some((p) => p.parts.some((part) => part.stock === 'lumber'));
  const count = (kind: string) => t.pickList.filter((h) => h.kind === kind).reduce((n, h) => n + h.pieces, 0);
  const slides = count('slide');
  const hinges = count('hinge');
  const pulls = count('pull');
  const casters = count('caster');
  const feet = count('leveling_foot');
  const banded = t.bandingMetres.length > 0;
  const items: ChecklistItem[] = [];
  const add = (stage: StageKey, what: string, text: string, when = true) => {
    if (when) items.push({ key: `${stage}.${what}`, stage, text });
  };

  add('material', 'sheets', `Sheet goods in and checked for thickness and flatness: ${plural(sheets, 'sheet')}`);
  add('material', 'lumber', 'Solid wood in and acclimatised to the shop', lumber);
  add('material', 'banding', 'Edge banding on hand for every banded edge', banded);
  add('material', 'hardware', `Hardware in and counted against the pick list (${plural(t.pickList.length, 'line')})`);

  add('cutting', 'breakdown', `Break down the ${plural(sheets, 'sheet')} to their layouts`);
  add('cutting', 'parts', `Every part cut, counted against the cut list and labelled: ${plural(parts, 'part')}`);
  add('cutting', 'banding', 'Edges banded and trimmed flush', banded);
  add('cutting', 'machining', 'Dados, grooves, shelf-pin rows and pocket holes machined');

  add('casework', 'dry-fit', 'Cases dry-fitted; diagonals equal before the glue sets');
  add('casework', 'assembly', 'Cases glued and fastened, squeeze-out cleaned');
  add('casework', 'backs', 'Backs fitted and fastened');

  add('drawers_doors', 'boxes', 'Drawer boxes built and square', slides > 0);
  add(
    'drawers_doors',
    'slides',
    `Slides fitted (${plural(slides, 'slide')}); every drawer runs and closes`,
    slides > 0,
  );
  add('drawers_doors', 'doors', `Doors hung (${plural(hinges, 'hinge')}); reveals even, hinges adjusted`, hinges > 0);
  add('drawers_doors', 'pulls', `Pulls fitted: ${plural(pulls, 'pull')}`, pulls > 0);

  add('finish', 'sanding', 'Sanded through the grits; dust off before the first coat');
  add('finish', 'coats', 'Every coat of finish applied as specified and cured before handling');

  add('ready', 'run', 'Every drawer and door runs; hardware tight; labels and tape off');
  add('ready', 'mobility', 'Casters lock and leveling feet reach the floor', casters + feet > 0);
  add('ready', 'photos', 'Photos of the finished piece added to the job');

  add('delivered', 'placed', 'Delivered and set in place, level');
  add('delivered', 'cautions', 'The cautions (anchoring, load limits) gone through with the client');
  return items;
}
