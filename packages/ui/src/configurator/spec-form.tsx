import { useRef, useState, type Dispatch, type ReactNode, type SetStateAction } from 'react';
import type { Design, DesignOption } from '@benchwright/contracts';
import {
  addRearCase,
  addSideCase,
  benchLayout,
  designs,
  resizeBench,
  specBays,
  toMm,
  type AssemblyBenchSpec,
  type Bay,
  type BenchCase,
  type BuildSpec,
  type Compartment,
  type DesignSlug,
  type LengthUnit,
} from '@benchwright/pricing/geometry';
import { Button } from '../components';
import { CountField, LengthField, OptionField, SelectField, WeightField } from './fields';
import { FieldIssues, useIssueLookup } from './issues';

type SetSpec = Dispatch<SetStateAction<BuildSpec>>;
type Options = Design['options'];
type Limits = (typeof designs)[DesignSlug]['limits'];

const KINDS = [
  ['drawer', 'Drawer'],
  ['door', 'Door'],
  ['open', 'Open shelves'],
] as const;
const ROWS = [
  ['front', 'Front row'],
  ['back', 'Back row'],
] as const;
const FACINGS = [
  ['front', 'the front'],
  ['back', 'the back'],
  ['left', 'the left end'],
  ['right', 'the right end'],
] as const;
const HINGE_SIDES = [
  ['left', 'The left, as you face the door'],
  ['right', 'The right, as you face the door'],
] as const;
const PLACES = [
  ['next', 'Against the previous case in its row (the left end if none)'],
  ['set', 'At a distance from the left end'],
] as const;
/** what the bench may be set to carry, in kilograms (the engine's limits) */
const WORKING_LOAD_KG = [0, 1000] as const;
/** the torsion box's rib spacing, in millimeters (the engine's limits) */
const GRID_SPACING_MM = [100, 400] as const;
const MOBILITY: Record<string, string> = {
  'casters-and-feet': 'Locking casters, and leveling feet to stand it firm',
  'locking-casters': 'Locking casters',
  'leveling-feet': 'Leveling feet',
  none: 'None: it stands on its base',
};
const MATERIALS = [
  ['carcassMaterialId', 'Case'],
  ['backMaterialId', 'Back'],
  ['frontMaterialId', 'Doors and drawer fronts'],
  ['drawerMaterialId', 'Drawer boxes'],
  ['drawerBottomMaterialId', 'Drawer bottoms'],
] as const;

/** Construction choices a piece may make for itself over the shop's settings; absent, the shop's default holds. */
type Override = 'frontStyle' | 'joinery' | 'drawerFronts';

/** The spec with its own choice for `key`, or none (the shop's default, from its settings). */
function withOverride<K extends Override>(s: BuildSpec, key: K, value: BuildSpec[K] | undefined): BuildSpec {
  const { [key]: _old, ...rest } = s;
  return (value ? { ...rest, [key]: value } : rest) as BuildSpec;
}

/** A section without a hinge side: a pair of doors hinges on both sides, and only a door has hinges. */
function withoutHinge({ hingeSide: _side, ...rest }: Compartment): Compartment {
  return rest;
}

const newSection = (): Compartment => ({
  kind: 'drawer',
  heightMm: null,
  doors: 1,
  adjustableShelves: 0,
  fixedShelves: 0,
});

/** A titled group of fields. */
function Group({ title, children, issues = [] }: { title: string; children: ReactNode; issues?: readonly string[] }) {
  return (
    <fieldset className="mb-4 min-w-0 rounded border border-rule p-3">
      <legend className="px-1 font-semibold">{title}</legend>
      <FieldIssues messages={issues} />
      {children}
    </fieldset>
  );
}

function SectionEditor({
  c,
  k,
  path,
  context,
  unit,
  count,
  onChange,
  onRemove,
}: {
  c: Compartment;
  k: number;
  path: string;
  context: string;
  unit: LengthUnit;
  count: number;
  onChange: (c: Compartment) => void;
  onRemove?: () => void;
}) {
  const issuesAt = useIssueLookup();
  const here = `${context}, Section ${k + 1}`;
  const id = path.replace(/[^\w]+/g, '-');
  return (
    <div className="mb-2 rounded bg-paper/60 p-2">
      <p className="mb-1 text-sm font-semibold">Section {k + 1}</p>
      <div className="grid gap-x-3 sm:grid-cols-2">
        <SelectField
          label="Kind"
          context={here}
          value={c.kind}
          choices={KINDS}
          issues={issuesAt(`${path}.kind`, path)}
          onChange={(kind) =>
            onChange({
              ...(kind === 'door' ? c : withoutHinge(c)),
              kind,
              ...(kind === 'drawer' ? { adjustableShelves: 0, fixedShelves: 0 } : {}),
            })
          }
        />
        <LengthField
          id={`${id}-height`}
          label="Height"
          context={here}
          mm={c.heightMm}
          unit={unit}
          issues={issuesAt(`${path}.heightMm`)}
          share={{ fallbackMm: toMm(count > 1 ? 8 : 24) }}
          onChange={(heightMm) => onChange({ ...c, heightMm })}
        />
        {c.kind === 'door' ? (
          <SelectField
            label="Doors"
            context={here}
            value={c.doors}
            choices={[
              [1, 'One door'],
              [2, 'A pair of doors'],
            ]}
            issues={issuesAt(`${path}.doors`)}
            onChange={(doors) => onChange(doors === 2 ? { ...withoutHinge(c), doors } : { ...c, doors })}
          />
        ) : null}
        {c.kind === 'door' && c.doors === 1 ? (
          <SelectField
            label="Hinged on"
            context={here}
            value={c.hingeSide ?? 'left'}
            choices={HINGE_SIDES}
            issues={issuesAt(`${path}.hingeSide`)}
            onChange={(hingeSide) => onChange({ ...c, hingeSide })}
          />
        ) : null}
        {c.kind !== 'drawer' ? (
          <>
            <CountField
              label="Adjustable shelves"
              context={here}
              value={c.adjustableShelves}
              min={0}
              max={8}
              issues={issuesAt(`${path}.adjustableShelves`)}
              onChange={(adjustableShelves) => onChange({ ...c, adjustableShelves })}
            />
            <CountField
              label="Fixed shelves"
              context={here}
              value={c.fixedShelves}
              min={0}
              max={6}
              issues={issuesAt(`${path}.fixedShelves`)}
              onChange={(fixedShelves) => onChange({ ...c, fixedShelves })}
            />
          </>
        ) : null}
      </div>
      {onRemove ? (
        <Button type="button" variant="quiet" className="px-0 py-0 text-sm" onClick={onRemove}>
          Remove section {k + 1}
          <span className="sr-only"> of {context}</span>
        </Button>
      ) : null}
    </div>
  );
}

function BayEditor({
  bay,
  index,
  path,
  context,
  unit,
  onChange,
  onRemove,
}: {
  bay: Bay;
  index: number;
  path: string;
  context: string;
  unit: LengthUnit;
  onChange: (b: Bay) => void;
  onRemove?: () => void;
}) {
  const issuesAt = useIssueLookup();
  const here = `${context}Bay ${index + 1}`;
  const set = (k: number, c: Compartment) =>
    onChange({ ...bay, compartments: bay.compartments.map((x, i) => (i === k ? c : x)) });
  return (
    <Group title={`${here} (sections from the floor up)`} issues={issuesAt(path, `${path}.compartments`)}>
      <LengthField
        id={`${path.replace(/[^\w]+/g, '-')}-width`}
        label="Width inside"
        context={here}
        mm={bay.widthMm}
        unit={unit}
        issues={issuesAt(`${path}.widthMm`)}
        share={{ fallbackMm: toMm(18) }}
        onChange={(widthMm) => onChange({ ...bay, widthMm })}
      />
      {bay.compartments.map((c, k) => (
        <SectionEditor
          key={k}
          c={c}
          k={k}
          path={`${path}.compartments[${k}]`}
          context={here}
          unit={unit}
          count={bay.compartments.length}
          onChange={(nc) => set(k, nc)}
          onRemove={
            bay.compartments.length > 1
              ? () => onChange({ ...bay, compartments: bay.compartments.filter((_, i) => i !== k) })
              : undefined
          }
        />
      ))}
      <div className="flex flex-wrap gap-x-4">
        {bay.compartments.length < 8 ? (
          <Button
            type="button"
            variant="quiet"
            className="px-0"
            onClick={() => onChange({ ...bay, compartments: [...bay.compartments, newSection()] })}
          >
            Add a section<span className="sr-only"> to {here}</span>
          </Button>
        ) : null}
        {onRemove ? (
          <Button type="button" variant="quiet" className="px-0" onClick={onRemove}>
            Remove {here.toLowerCase().startsWith('case') ? here : `bay ${index + 1}`}
          </Button>
        ) : null}
      </div>
    </Group>
  );
}

/** The bays of a case, side by side, each with its sections. */
function BaysEditor({
  bays,
  path,
  context,
  limits,
  unit,
  onChange,
}: {
  bays: Bay[];
  /** the path of the bays within the piece: `bays` or `cases[1].bays` */
  path: string;
  context: string;
  limits: readonly [number, number];
  unit: LengthUnit;
  onChange: (bays: Bay[]) => void;
}) {
  const issuesAt = useIssueLookup();
  const issues = issuesAt(path);
  return (
    <>
      <FieldIssues id={`${path.replace(/[^\w]+/g, '-')}-error`} messages={issues} />
      {bays.map((b, i) => (
        <BayEditor
          key={i}
          bay={b}
          index={i}
          path={`${path}[${i}]`}
          context={context}
          unit={unit}
          onChange={(nb) => onChange(bays.map((x, j) => (j === i ? nb : x)))}
          onRemove={bays.length > limits[0] ? () => onChange(bays.filter((_, j) => j !== i)) : undefined}
        />
      ))}
      {bays.length < limits[1] ? (
        <Button
          type="button"
          variant="quiet"
          className="mb-3 px-0"
          onClick={() => onChange([...bays, ...bays.slice(-1).map((b) => structuredClone(b))])}
        >
          Add a bay{context ? <span className="sr-only"> to {context.replace(/, $/, '')}</span> : null}
        </Button>
      ) : null}
    </>
  );
}

function CaseEditor({
  c,
  index,
  placedAtMm,
  unit,
  count,
  onChange,
  onRemove,
}: {
  c: BenchCase;
  index: number;
  /** where the case stands now, from the left overhang line: a set distance starts there, so nothing moves */
  placedAtMm: number;
  unit: LengthUnit;
  count: number;
  onChange: (c: BenchCase) => void;
  onRemove?: () => void;
}) {
  const issuesAt = useIssueLookup();
  const path = `cases[${index}]`;
  const here = `Case ${index + 1}`;
  return (
    <Group
      title={`${here}: ${c.row === 'front' ? 'front row' : 'back row'}, facing ${FACINGS.find(([f]) => f === c.facing)?.[1]}`}
      issues={issuesAt(path)}
    >
      <div className="grid gap-x-3 sm:grid-cols-2">
        <LengthField
          id={`case-${index}-width`}
          label="Width"
          context={here}
          mm={c.widthMm}
          unit={unit}
          issues={issuesAt(`${path}.widthMm`)}
          onChange={(widthMm) => widthMm !== null && onChange({ ...c, widthMm })}
        />
        <LengthField
          id={`case-${index}-depth`}
          label="Depth"
          context={here}
          mm={c.depthMm}
          unit={unit}
          issues={issuesAt(`${path}.depthMm`)}
          onChange={(depthMm) => depthMm !== null && onChange({ ...c, depthMm })}
        />
        <SelectField
          label="Row"
          context={here}
          value={c.row}
          choices={ROWS}
          issues={issuesAt(`${path}.row`)}
          onChange={(row) => onChange({ ...c, row })}
        />
        <SelectField
          label="Opens to"
          context={here}
          value={c.facing}
          choices={FACINGS}
          issues={issuesAt(`${path}.facing`)}
          onChange={(facing) => onChange({ ...c, facing })}
        />
        <SelectField
          label="Placed along the bench"
          context={here}
          value={c.xMm === null ? 'next' : 'set'}
          choices={PLACES}
          onChange={(v) => onChange({ ...c, xMm: v === 'next' ? null : Math.max(0, Math.round(placedAtMm * 10) / 10) })}
        />
        {c.xMm !== null ? (
          <LengthField
            id={`case-${index}-x`}
            label="Distance from the left end, inside the overhang"
            context={here}
            mm={c.xMm}
            unit={unit}
            issues={issuesAt(`${path}.xMm`)}
            onChange={(xMm) => xMm !== null && onChange({ ...c, xMm })}
          />
        ) : null}
      </div>
      <BaysEditor
        bays={c.bays}
        path={`${path}.bays`}
        context={`${here}, `}
        limits={[1, 3]}
        unit={unit}
        onChange={(bays) => onChange({ ...c, bays })}
      />
      {onRemove && count > 1 ? (
        <Button type="button" variant="quiet" className="px-0" onClick={onRemove}>
          Remove case {index + 1}
        </Button>
      ) : null}
    </Group>
  );
}

/** The bench's own choices: its top, overhangs, trim, mobility and the cases under it. */
function BenchFields({
  spec,
  setSpec,
  options,
  unit,
}: {
  spec: AssemblyBenchSpec;
  setSpec: SetSpec;
  options: Options;
  unit: LengthUnit;
}) {
  const issuesAt = useIssueLookup();
  const set = (f: (s: AssemblyBenchSpec) => AssemblyBenchSpec) =>
    setSpec((s) => (s.design === 'assembly-bench' ? f(s) : s));
  const top = spec.top;
  const places = benchLayout(spec);
  const setTop = (t: Partial<AssemblyBenchSpec['top']>) => set((s) => ({ ...s, top: { ...s.top, ...t } }));
  const trim = spec.trim ?? {
    lumberId: options['trim.lumberId']?.[0]?.id ?? '',
    widthMm: toMm(3.5),
    thicknessMm: toMm(0.75),
  };
  return (
    <>
      <Group title="Top" issues={issuesAt('top')}>
        <div className="grid gap-x-3 sm:grid-cols-2">
          <SelectField
            label="Top"
            value={top.kind}
            choices={[
              ['torsion-box', 'Torsion box: two skins on a frame and grid, flat and stiff'],
              ['laminated', 'Laminated: layers glued face to face'],
            ]}
            issues={issuesAt('top.kind')}
            onChange={(kind) => setTop({ kind })}
          />
          <LengthField
            id="top-thickness"
            label="Top thickness"
            mm={top.thicknessMm}
            unit={unit}
            limits={[38, 152]}
            issues={issuesAt('top.thicknessMm')}
            onChange={(v) => v !== null && setTop({ thicknessMm: v })}
          />
          <OptionField
            label={top.kind === 'torsion-box' ? 'Top skins' : 'Top layers'}
            value={top.skinMaterialId}
            options={options['top.skinMaterialId']}
            issues={issuesAt('top.skinMaterialId')}
            onChange={(v) => v && setTop({ skinMaterialId: v })}
          />
          {top.kind === 'torsion-box' ? (
            <OptionField
              label="Top frame and grid"
              value={top.coreMaterialId}
              options={options['top.coreMaterialId']}
              issues={issuesAt('top.coreMaterialId')}
              onChange={(v) => v && setTop({ coreMaterialId: v })}
            />
          ) : null}
          <SelectField
            label="Top edge"
            value={top.edge}
            choices={[
              ['trim', 'Solid-wood trim'],
              ['banded', 'Edge banding'],
            ]}
            issues={issuesAt('top.edge')}
            onChange={(edge) =>
              set((s) => ({ ...s, top: { ...s.top, edge }, trim: edge === 'trim' ? (s.trim ?? trim) : s.trim }))
            }
          />
        </div>
      </Group>
      {top.edge === 'trim' ? (
        <Group title="Trim" issues={issuesAt('trim')}>
          <div className="grid gap-x-3 sm:grid-cols-2">
            <OptionField
              label="Trim wood"
              value={trim.lumberId}
              options={options['trim.lumberId']}
              issues={issuesAt('trim.lumberId')}
              onChange={(v) => v && set((s) => ({ ...s, trim: { ...trim, ...s.trim, lumberId: v } }))}
            />
            <LengthField
              id="trim-width"
              label="Trim width"
              mm={trim.widthMm}
              unit={unit}
              limits={[12, 100]}
              issues={issuesAt('trim.widthMm')}
              onChange={(v) => v !== null && set((s) => ({ ...s, trim: { ...trim, ...s.trim, widthMm: v } }))}
            />
          </div>
        </Group>
      ) : null}
      <Group title="Overhangs of the top">
        <div className="grid grid-cols-2 gap-x-3">
          {(
            [
              ['overhangFrontMm', 'Front'],
              ['overhangBackMm', 'Back'],
              ['overhangLeftMm', 'Left end'],
              ['overhangRightMm', 'Right end'],
            ] as const
          ).map(([k, label]) => (
            <LengthField
              key={k}
              id={`overhang-${label.split(' ')[0]!.toLowerCase()}`}
              label={label}
              context="Overhang at the"
              mm={spec[k]}
              unit={unit}
              issues={issuesAt(k)}
              onChange={(v) => v !== null && set((s) => ({ ...s, [k]: v }))}
            />
          ))}
        </div>
      </Group>
      <Group title="Casters and feet">
        <SelectField
          label="Stands on"
          value={spec.mobility}
          choices={(['casters-and-feet', 'locking-casters', 'leveling-feet'] as const).map((m) => [m, MOBILITY[m]!])}
          issues={issuesAt('mobility')}
          onChange={(mobility) => set((s) => ({ ...s, mobility }))}
        />
        <div className="grid gap-x-3 sm:grid-cols-2">
          {spec.mobility !== 'leveling-feet' ? (
            <OptionField
              label="Casters"
              value={spec.casterId}
              options={options.casterId}
              issues={issuesAt('casterId')}
              onChange={(v) => v && set((s) => ({ ...s, casterId: v }))}
            />
          ) : null}
          {spec.mobility !== 'locking-casters' ? (
            <OptionField
              label="Feet"
              value={spec.footId}
              options={options.footId}
              issues={issuesAt('footId')}
              onChange={(v) => v && set((s) => ({ ...s, footId: v }))}
            />
          ) : null}
        </div>
        {spec.mobility !== 'leveling-feet' ? (
          <WeightField
            id="working-load"
            label="Working load on the bench"
            kg={spec.workingLoadKg}
            unit={unit}
            limits={WORKING_LOAD_KG}
            issues={issuesAt('workingLoadKg')}
            note="What it carries in use, beyond its own weight; the casters are checked against it. That check is the shop’s estimate, not a rating: the casters’ own rated load governs."
            onChange={(workingLoadKg) => set((s) => ({ ...s, workingLoadKg }))}
          />
        ) : null}
      </Group>
      <div className="mb-2">
        <h3 className="mb-2 text-lg font-semibold">The cases under the top</h3>
        <FieldIssues id="cases-error" messages={issuesAt('cases')} />
        {spec.cases.map((c, i) => (
          <CaseEditor
            key={i}
            c={c}
            index={i}
            placedAtMm={(places[i]?.xMm ?? spec.overhangLeftMm) - spec.overhangLeftMm}
            unit={unit}
            count={spec.cases.length}
            onChange={(nc) => set((s) => ({ ...s, cases: s.cases.map((x, j) => (j === i ? nc : x)) }))}
            onRemove={() => set((s) => ({ ...s, cases: s.cases.filter((_, j) => j !== i) }))}
          />
        ))}
        {spec.cases.length < 6 ? (
          <div className="flex flex-wrap gap-x-4">
            <Button type="button" variant="quiet" className="px-0" onClick={() => set(addRearCase)}>
              Add a rear case, back to back
            </Button>
            <Button type="button" variant="quiet" className="px-0" onClick={() => set(addSideCase)}>
              Add a side case
            </Button>
          </div>
        ) : null}
      </div>
    </>
  );
}

/**
 * How the shop builds the piece, where a client may ask otherwise: case joints, drawer fronts and a torsion top's
 * grid. Folded away until opened (the shop's usual is right for most pieces), and opened by a message of its own.
 */
function ConstructionFields({ spec, setSpec, unit }: { spec: BuildSpec; setSpec: SetSpec; unit: LengthUnit }) {
  const issuesAt = useIssueLookup();
  const mine = issuesAt('joinery', 'drawerFronts', 'top.gridSpacingMm').length > 0;
  const [open, setOpen] = useState(mine);
  const [seen, setSeen] = useState(mine);
  if (seen !== mine) {
    // a message appears inside: show it
    setSeen(mine);
    if (mine) setOpen(true);
  }
  const drawers = specBays(spec).some((b) => b.compartments.some((c) => c.kind === 'drawer'));
  const top = spec.design === 'assembly-bench' && spec.top.kind === 'torsion-box' ? spec.top : null;
  return (
    <details
      className="mb-4 min-w-0 rounded border border-rule p-3"
      open={open}
      onToggle={(e) => setOpen(e.currentTarget.open)}
    >
      <summary className="cursor-pointer font-semibold">Construction</summary>
      <p className="mb-3 mt-1 text-sm text-ink-soft">
        How the shop joins the case{drawers ? ', sizes the drawer fronts' : ''}
        {top ? ' and grids the top' : ''}; left as the shop usually builds unless you choose.
      </p>
      <div className="grid gap-x-3 sm:grid-cols-2">
        <SelectField
          label="Case joints"
          value={spec.joinery ?? 'shop'}
          choices={[
            ['shop', 'As the shop usually builds'],
            ['dado', 'Dadoes: panels set into grooves in the sides'],
            ['butt', 'Butt joints, pocket-screwed'],
          ]}
          issues={issuesAt('joinery')}
          onChange={(v) => setSpec((s) => withOverride(s, 'joinery', v === 'shop' ? undefined : v))}
        />
        {drawers ? (
          <SelectField
            label="Drawer fronts"
            value={spec.drawerFronts ?? 'shop'}
            choices={[
              ['shop', 'As the shop usually builds'],
              ['equal', 'Equal: all the same height'],
              ['graduated', 'Graduated: each a step taller than the one above'],
            ]}
            issues={issuesAt('drawerFronts')}
            onChange={(v) => setSpec((s) => withOverride(s, 'drawerFronts', v === 'shop' ? undefined : v))}
          />
        ) : null}
        {top ? (
          <LengthField
            id="top-grid"
            label="Top grid, rib centers"
            mm={top.gridSpacingMm}
            unit={unit}
            limits={GRID_SPACING_MM}
            issues={issuesAt('top.gridSpacingMm')}
            onChange={(v) =>
              v !== null &&
              setSpec((s) => (s.design === 'assembly-bench' ? { ...s, top: { ...s.top, gridSpacingMm: v } } : s))
            }
          />
        ) : null}
      </div>
    </details>
  );
}

/**
 * Every choice the design allows, on one piece: its size, materials, finish, pulls, trim and layout; for the bench
 * its top, overhangs, mobility and cases too. Controlled: `spec` is the piece, `setSpec` changes it; lengths are
 * typed and shown in `unit`; each message of the server's checks is shown beside its field (`IssuesProvider`).
 */
export function SpecForm({
  spec,
  setSpec,
  limits,
  options,
  unit,
}: {
  spec: BuildSpec;
  setSpec: SetSpec;
  limits: Limits;
  options: Options;
  unit: LengthUnit;
}) {
  const issuesAt = useIssueLookup();
  // a bench's cases follow its top from the size it had when the field was entered, so typing "7" on the way to
  // "72" changes nothing for good
  const base = useRef<BuildSpec | null>(null);
  const patch = (p: Partial<BuildSpec>) => setSpec((s) => ({ ...s, ...p }) as BuildSpec);
  const field = (k: string) => ({ issues: issuesAt(k) });
  const option = (k: string): DesignOption[] | undefined => options[k];
  return (
    <div>
      <Group title="Size">
        <div className="grid gap-x-3 sm:grid-cols-3">
          {(
            [
              ['widthMm', 'Width'],
              ['heightMm', 'Height'],
              ['depthMm', 'Depth'],
            ] as const
          ).map(([k, label]) => (
            <LengthField
              key={k}
              id={`dim-${label.toLowerCase()}`}
              label={label}
              mm={spec[k]}
              unit={unit}
              limits={limits[k]}
              {...field(k)}
              onFocus={() => (base.current = spec)}
              onBlur={() => (base.current = null)}
              onChange={(v) => {
                if (v === null) return;
                if (spec.design === 'assembly-bench' && k !== 'heightMm') {
                  const from = base.current?.design === 'assembly-bench' ? base.current : null;
                  setSpec((s) => (s.design === 'assembly-bench' ? resizeBench(from ?? s, { [k]: v }) : s));
                } else patch({ [k]: v });
              }}
            />
          ))}
          {'toeKickMm' in spec ? (
            <LengthField
              id="dim-toe-kick"
              label={spec.design === 'bookcase' ? 'Plinth' : 'Toe kick'}
              mm={spec.toeKickMm}
              unit={unit}
              {...field('toeKickMm')}
              onChange={(v) => v !== null && patch({ toeKickMm: v } as Partial<BuildSpec>)}
            />
          ) : null}
        </div>
      </Group>

      {spec.design === 'base-cabinet' || spec.design === 'bookcase' || spec.design === 'wall-cabinet' ? (
        <Group title="How it stands">
          <div className="grid gap-x-3 sm:grid-cols-2">
            {spec.design !== 'wall-cabinet' ? (
              <SelectField
                label="Installation"
                value={spec.installation}
                choices={[
                  ['built-in', 'Built in, fixed to the wall'],
                  ['free-standing', 'Free-standing'],
                ]}
                {...field('installation')}
                onChange={(installation) => patch({ installation } as Partial<BuildSpec>)}
              />
            ) : null}
            {spec.design === 'base-cabinet' ? (
              <SelectField
                label="Stands on"
                value={spec.mobility}
                choices={[
                  ['none', MOBILITY.none!],
                  ['leveling-feet', MOBILITY['leveling-feet']!],
                ]}
                {...field('mobility')}
                onChange={(mobility) => patch({ mobility } as Partial<BuildSpec>)}
              />
            ) : null}
            {spec.design === 'wall-cabinet' ? (
              <SelectField
                label="Hung on"
                value={spec.hangingRail ? 'rail' : 'case'}
                choices={[
                  ['rail', 'A hanging rail screwed to the wall'],
                  ['case', 'Screws through the case back'],
                ]}
                {...field('hangingRail')}
                onChange={(v) => patch({ hangingRail: v === 'rail' } as Partial<BuildSpec>)}
              />
            ) : null}
          </div>
        </Group>
      ) : null}

      <Group title="Materials">
        <div className="grid gap-x-3 sm:grid-cols-2">
          {MATERIALS.map(([k, label]) => (
            <OptionField
              key={k}
              label={label}
              value={spec[k]}
              options={option(k)}
              {...field(k)}
              onChange={(v) => v && patch({ [k]: v })}
            />
          ))}
          <OptionField
            label="Edge banding"
            value={spec.bandingId}
            options={option('bandingId')}
            {...field('bandingId')}
            onChange={(v) => v && patch({ bandingId: v })}
          />
          <OptionField
            label="Pulls"
            value={spec.pullId}
            options={option('pullId')}
            {...field('pullId')}
            onChange={(v) => v && patch({ pullId: v })}
          />
          <SelectField
            label="Doors and drawer fronts sit"
            value={spec.frontStyle ?? 'shop'}
            choices={[
              ['shop', 'As the shop usually builds'],
              ['overlay', 'Over the case edges (overlay)'],
              ['inset', 'Inside the openings (inset)'],
            ]}
            {...field('frontStyle')}
            onChange={(v) => setSpec((s) => withOverride(s, 'frontStyle', v === 'shop' ? undefined : v))}
          />
        </div>
      </Group>

      <Group title="Finish">
        <div className="grid gap-x-3 sm:grid-cols-2">
          <OptionField
            label="Finish"
            value={spec.finishId}
            options={option('finishId')}
            none="None: left unfinished"
            {...field('finishId')}
            onChange={(finishId) => patch({ finishId, ...(finishId ? {} : { coats: null }) })}
          />
          {spec.finishId ? (
            <SelectField
              label="Coats"
              value={spec.coats ?? 0}
              choices={[[0, 'As the shop advises'], ...[1, 2, 3, 4, 5, 6].map((n) => [n, `${n}`] as const)]}
              {...field('coats')}
              onChange={(n) => patch({ coats: n === 0 ? null : n })}
            />
          ) : null}
        </div>
      </Group>

      {spec.design !== 'assembly-bench' ? (
        <Group title="Solid-wood trim" issues={issuesAt('trim')}>
          <OptionField
            label="Trim wood"
            value={spec.trim?.lumberId ?? null}
            options={option('trim.lumberId')}
            none="None"
            {...field('trim.lumberId')}
            onChange={(lumberId) =>
              patch({
                trim: lumberId ? { widthMm: toMm(1.5), thicknessMm: toMm(0.75), ...spec.trim, lumberId } : null,
              })
            }
          />
          {spec.trim ? (
            <LengthField
              id="trim-width"
              label="Trim width"
              mm={spec.trim.widthMm}
              unit={unit}
              limits={[12, 100]}
              {...field('trim.widthMm')}
              onChange={(v) =>
                v !== null && setSpec((s) => (s.trim ? ({ ...s, trim: { ...s.trim, widthMm: v } } as BuildSpec) : s))
              }
            />
          ) : null}
        </Group>
      ) : null}

      {spec.design === 'assembly-bench' ? (
        <BenchFields spec={spec} setSpec={setSpec} options={options} unit={unit} />
      ) : (
        <>
          <h3 className="mb-2 text-lg font-semibold">Bays and sections</h3>
          <BaysEditor
            bays={spec.bays}
            path="bays"
            context=""
            limits={limits.bays}
            unit={unit}
            onChange={(bays) => setSpec((s) => (s.design === 'assembly-bench' ? s : { ...s, bays }))}
          />
        </>
      )}
      <ConstructionFields spec={spec} setSpec={setSpec} unit={unit} />
    </div>
  );
}
