import { useEffect, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import {
  designs,
  formatLength,
  formatWeight,
  parseLength,
  type DesignSlug,
  type LengthUnit,
} from '@benchwright/pricing/geometry';
import { ApiRequestError, Button, Field, formatMoney, Notice, Panel } from '@benchwright/ui';
import { useMe } from '@benchwright/ui/auth';
import { paths } from '../../../config/paths';
import { useCreateProject } from '../api/create-project';
import { usePreview } from '../api/preview';
import { LeadTimeNote } from './lead-time-note';
import type { CreateProjectBody } from '@benchwright/contracts';

interface Compartment {
  kind: 'drawer' | 'door' | 'open';
  heightMm: number | null;
  doors: 1 | 2;
  adjustableShelves: number;
  fixedShelves: number;
}
interface Bay {
  widthMm: number | null;
  compartments: Compartment[];
}
type Spec = {
  design: DesignSlug;
  widthMm: number;
  heightMm: number;
  depthMm: number;
  bays?: Bay[];
  /** a bench's arrangement: this form edits the first case's bays */
  cases?: { bays: Bay[] }[];
} & Record<string, unknown>;

/** The bays the form edits: a bench's first case's, any other design's own. */
const baysOf = (s: Spec): Bay[] => s.cases?.[0]?.bays ?? s.bays ?? [];
const withBays = (s: Spec, bays: Bay[]): Spec =>
  s.cases?.[0] ? { ...s, cases: s.cases.map((c, i) => (i === 0 ? { ...c, bays } : c)) } : { ...s, bays };

const KIND_LABELS: Record<Compartment['kind'], string> = { drawer: 'Drawer', door: 'Door', open: 'Open shelves' };
const DIMENSIONS = [
  ['widthMm', 'Width'],
  ['heightMm', 'Height'],
  ['depthMm', 'Depth'],
] as const;

const draftKey = (slug: string) => `benchwright:draft:${slug}`;
/** a fresh copy of the design's standard piece */
const defaultsOf = (slug: DesignSlug) => structuredClone(designs[slug].defaults) as unknown as Spec;

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** "bays[0].compartments[1].heightMm" -> "Bay 1, Section 2, height" (the words on the screen) */
function plainPath(path: string): string {
  return path
    .replace(/^items\[0\]\.spec\.?/, '')
    .replace(/cases\[(\d+)\]/g, (_m, i) => `Case ${Number(i) + 1}`)
    .replace(/bays\[(\d+)\]/g, (_m, i) => `Bay ${Number(i) + 1}`)
    .replace(/compartments\[(\d+)\]/g, (_m, i) => `Section ${Number(i) + 1}`)
    .replace(/\.?widthMm/, ', width')
    .replace(/\.?heightMm/, ', height')
    .replace(/\.?depthMm/, ', depth')
    .replace(/\./g, ', ')
    .replace(/^, /, '');
}

function DimensionField({
  label,
  mm,
  unit,
  limits,
  onChange,
}: {
  label: string;
  mm: number;
  unit: LengthUnit;
  limits: [number, number];
  onChange: (mm: number) => void;
}) {
  const [text, setText] = useState(formatLength(mm, { unit }));
  const [error, setError] = useState<string | undefined>();
  return (
    <div className="w-48">
      <Field
        id={`dim-${label.toLowerCase()}`}
        label={label}
        value={text}
        error={error}
        hint={`${formatLength(limits[0], { unit })} to ${formatLength(limits[1], { unit })}`}
        onChange={(e) => {
          setText(e.target.value);
          try {
            const v = parseLength(e.target.value, unit);
            setError(undefined);
            onChange(v);
          } catch (err) {
            setError((err as Error).message);
          }
        }}
      />
    </div>
  );
}

function BayEditor({
  bay,
  index,
  onChange,
  onRemove,
}: {
  bay: Bay;
  index: number;
  onChange: (b: Bay) => void;
  onRemove?: () => void;
}) {
  const set = (k: number, c: Partial<Compartment>) =>
    onChange({ ...bay, compartments: bay.compartments.map((x, i) => (i === k ? { ...x, ...c } : x)) });
  return (
    <fieldset className="mb-3 rounded border border-rule p-3">
      <legend className="px-1 font-semibold">Bay {index + 1} (from the floor up)</legend>
      {bay.compartments.map((c, k) => (
        <div key={k} className="mb-2 flex flex-wrap items-center gap-2 text-sm">
          <label>
            Section {k + 1}
            <select
              aria-label={`Bay ${index + 1} section ${k + 1}`}
              className="ml-1 rounded border border-rule bg-white"
              value={c.kind}
              onChange={(e) =>
                set(k, {
                  kind: e.target.value as Compartment['kind'],
                  ...(e.target.value === 'drawer' ? { adjustableShelves: 0, fixedShelves: 0 } : {}),
                })
              }
            >
              {Object.entries(KIND_LABELS).map(([v, l]) => (
                <option key={v} value={v}>
                  {l}
                </option>
              ))}
            </select>
          </label>
          {c.kind === 'door' ? (
            <label>
              doors
              <select
                className="ml-1 rounded border border-rule bg-white"
                value={c.doors}
                onChange={(e) => set(k, { doors: Number(e.target.value) as 1 | 2 })}
              >
                <option value={1}>1</option>
                <option value={2}>2</option>
              </select>
            </label>
          ) : null}
          {c.kind !== 'drawer' ? (
            <label>
              shelves
              <input
                aria-label={`Bay ${index + 1} section ${k + 1} shelves`}
                type="number"
                min={0}
                max={8}
                className="ml-1 w-14 rounded border border-rule bg-white px-1"
                value={c.adjustableShelves}
                onChange={(e) =>
                  set(k, { adjustableShelves: Math.max(0, Math.min(8, Math.round(Number(e.target.value) || 0))) })
                }
              />
            </label>
          ) : null}
          {bay.compartments.length > 1 ? (
            <Button
              type="button"
              variant="quiet"
              className="px-1 py-0"
              onClick={() => onChange({ ...bay, compartments: bay.compartments.filter((_, i) => i !== k) })}
            >
              Remove
            </Button>
          ) : null}
        </div>
      ))}
      <div className="flex gap-3">
        {bay.compartments.length < 8 ? (
          <Button
            type="button"
            variant="quiet"
            className="px-0"
            onClick={() =>
              onChange({
                ...bay,
                compartments: [
                  ...bay.compartments,
                  { kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
                ],
              })
            }
          >
            Add a section
          </Button>
        ) : null}
        {onRemove ? (
          <Button type="button" variant="quiet" className="px-0" onClick={onRemove}>
            Remove this bay
          </Button>
        ) : null}
      </div>
    </fieldset>
  );
}

/**
 * The configurator: set one of the shop's designs to your space and see its
 * drawing, weight, checks and budget range at once (from the server's
 * preview, a budget range from the designs' cut list), then ask the shop for an estimate.
 */
export function Configurator({ slug }: { slug: DesignSlug }) {
  const design = designs[slug];
  const [spec, setSpec] = useState<Spec>(() => {
    const saved = sessionStorage.getItem(draftKey(slug));
    return saved ? (JSON.parse(saved) as Spec) : defaultsOf(slug);
  });
  const [quantity, setQuantity] = useState(1);
  const [unit, setUnit] = useState<LengthUnit>('in');
  const [notes, setNotes] = useState('');
  // the size fields keep what was typed; they start afresh when the unit changes or the size is reset
  const [resets, setResets] = useState(0);
  const me = useMe();
  const create = useCreateProject();
  const navigate = useNavigate();
  useEffect(() => sessionStorage.setItem(draftKey(slug), JSON.stringify(spec)), [slug, spec]);
  const live = useDebounced(spec, 300);
  const preview = usePreview(live, quantity);
  const issues = preview.error instanceof ApiRequestError ? preview.error.issues : [];
  const limits = design.limits;
  const q = preview.data;
  const client = me.data?.role === 'client';
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
      <Panel title="Size and layout">
        <div role="radiogroup" aria-label="Units" className="mb-3 flex gap-3 text-sm">
          {(['in', 'mm'] as const).map((u) => (
            <label key={u}>
              <input type="radio" name="unit" checked={unit === u} onChange={() => setUnit(u)} />{' '}
              {u === 'in' ? 'inches' : 'millimeters'}
            </label>
          ))}
        </div>
        {DIMENSIONS.map(([k, label]) => (
          <DimensionField
            key={`${k}-${unit}-${resets}`}
            label={label}
            mm={spec[k]}
            unit={unit}
            limits={limits[k]}
            onChange={(mm) => setSpec((s) => ({ ...s, [k]: mm }))}
          />
        ))}
        {baysOf(spec).map((b, i) => (
          <BayEditor
            key={i}
            bay={b}
            index={i}
            onChange={(nb) =>
              setSpec((s) =>
                withBays(
                  s,
                  baysOf(s).map((x, j) => (j === i ? nb : x)),
                ),
              )
            }
            onRemove={
              baysOf(spec).length > limits.bays[0]
                ? () =>
                    setSpec((s) =>
                      withBays(
                        s,
                        baysOf(s).filter((_, j) => j !== i),
                      ),
                    )
                : undefined
            }
          />
        ))}
        {baysOf(spec).length < limits.bays[1] ? (
          <Button
            type="button"
            variant="quiet"
            className="mb-3 px-0"
            onClick={() =>
              setSpec((s) =>
                withBays(s, [
                  ...baysOf(s),
                  ...baysOf(s)
                    .slice(-1)
                    .map((b) => structuredClone(b)),
                ]),
              )
            }
          >
            Add a bay
          </Button>
        ) : null}
        <label className="mb-3 block">
          <span className="block font-semibold">How many</span>
          <input
            type="number"
            min={1}
            max={20}
            className="w-20 rounded border border-rule bg-white px-2 py-1"
            value={quantity}
            onChange={(e) => setQuantity(Math.max(1, Math.min(20, Math.round(Number(e.target.value) || 1))))}
          />
        </label>
        <Button
          type="button"
          variant="quiet"
          className="px-0"
          onClick={() => {
            setSpec(defaultsOf(slug));
            setResets((n) => n + 1);
          }}
        >
          Back to our standard size
        </Button>
      </Panel>

      <div>
        <Panel title={design.name}>
          {q?.items[0] ? (
            <figure
              aria-label={`Drawing of the ${design.name.toLowerCase()}`}
              className={`mb-3 [&>svg]:h-auto [&>svg]:max-h-[26rem] [&>svg]:w-full ${preview.isPlaceholderData ? 'opacity-60' : ''}`}
              dangerouslySetInnerHTML={{ __html: q.items[0].drawingSvg }}
            />
          ) : null}
          {issues.length ? (
            <Notice tone="error">
              <p className="font-semibold">This cannot be built as set:</p>
              <ul className="list-disc pl-5">
                {issues.map((x) => (
                  <li key={x.path + x.message}>
                    {plainPath(x.path) ? `${plainPath(x.path)}: ` : ''}
                    {x.message}
                  </li>
                ))}
              </ul>
            </Notice>
          ) : preview.isError ? (
            <Notice tone="error">{preview.error.message}</Notice>
          ) : null}
          {q && !issues.length ? (
            <>
              <p className="text-xl font-semibold" aria-label="Budget range">
                {formatMoney(q.budget.lowCents)} to {formatMoney(q.budget.highCents)}
                {quantity > 1 ? ` for ${quantity}` : ''}
              </p>
              <p className="mb-3 text-sm text-ink-soft">
                A budget range at today’s prices, tax included. Your estimate comes from the shop, once they have looked
                at your request. About {formatWeight(q.items[0].massKg, unit)} each.
              </p>
              <LeadTimeNote hours={q.hours} />
              {q.checks.length ? (
                <ul className="mb-3 list-disc pl-5 text-sm">
                  {q.checks.map((c) => (
                    <li key={c.code + c.message} className={c.level === 'error' ? 'text-alert' : ''}>
                      {c.message}
                    </li>
                  ))}
                </ul>
              ) : null}
            </>
          ) : !preview.isError ? (
            <p>Working out the budget…</p>
          ) : null}
        </Panel>

        <Panel title="Ask for an estimate">
          {client ? (
            <form
              onSubmit={(e) => {
                e.preventDefault();
                create.send(
                  { items: [{ spec: spec as CreateProjectBody['items'][number]['spec'], quantity }], notes },
                  {
                    onSuccess: (p) => {
                      sessionStorage.removeItem(draftKey(slug));
                      navigate(paths.project.getHref(p.id));
                    },
                  },
                );
              }}
            >
              <label className="mb-3 block">
                <span className="block font-semibold">Anything the shop should know</span>
                <textarea
                  className="w-full rounded border border-rule bg-white px-2 py-1"
                  rows={3}
                  maxLength={4000}
                  value={notes}
                  onChange={(e) => setNotes(e.target.value)}
                />
              </label>
              {create.isError ? <Notice tone="error">{create.error.message}</Notice> : null}
              <Button type="submit" disabled={create.isPending || issues.length > 0}>
                {create.isPending ? 'Sending…' : 'Request an estimate'}
              </Button>
            </form>
          ) : me.data ? (
            <p>Signed in as the shop: estimates are requested by clients.</p>
          ) : (
            <p>
              <Link to={paths.signIn.getHref(paths.design.getHref(slug))} className="text-wood underline">
                Sign in
              </Link>{' '}
              or{' '}
              <Link to={paths.signUp.getHref()} className="text-wood underline">
                create an account
              </Link>{' '}
              to ask for an estimate; what you set here is kept.
            </p>
          )}
        </Panel>
      </div>
    </div>
  );
}
