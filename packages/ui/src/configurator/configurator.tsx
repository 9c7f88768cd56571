import { useEffect, useState, type Dispatch, type ReactNode, type SetStateAction } from 'react';
import {
  designs,
  formatWeight,
  upgradeSpec,
  type BuildSpec,
  type DesignSlug,
  type LengthUnit,
} from '@benchwright/pricing/geometry';
import { ApiRequestError } from '../api-client';
import { Button, formatMoney, Notice, Panel } from '../components';
import { useDesign, usePreview } from './api';
import { CountField } from './fields';
import { IssuesProvider, issueMap, plainPath } from './issues';
import { SpecForm } from './spec-form';

/** A fresh copy of the design's standard piece. */
export const defaultsOf = (slug: DesignSlug): BuildSpec => structuredClone(designs[slug].defaults) as BuildSpec;

/** A piece kept from before (a draft), in today's shape, or the design's standard piece if it is not one of this design. */
export function specFrom(slug: DesignSlug, saved: unknown): BuildSpec {
  const s = upgradeSpec(saved) as { design?: unknown } | null;
  return s && typeof s === 'object' && s.design === slug ? (s as BuildSpec) : defaultsOf(slug);
}

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export interface ConfiguratorProps {
  slug: DesignSlug;
  spec: BuildSpec;
  setSpec: Dispatch<SetStateAction<BuildSpec>>;
  quantity: number;
  setQuantity: (n: number) => void;
  /** beside the budget: the portal's lead time, from the preview's shop hours */
  leadTime?: (hours: number | undefined) => ReactNode;
  /** under the piece: what the app does with it (ask for an estimate, start a project); `blocked` while it cannot be built */
  children?: (state: { blocked: boolean }) => ReactNode;
}

/**
 * The configurator, shared by the portal and the shop app: every choice the design allows (the form), and beside it
 * the drawing, weight, checks and budget range from the server's preview as the piece changes, each of the
 * server's messages also shown beside the field it is about. The app keeps the piece (`spec`) and what is done with it.
 */
export function Configurator({ slug, spec, setSpec, quantity, setQuantity, leadTime, children }: ConfiguratorProps) {
  const design = designs[slug];
  const choices = useDesign(slug);
  // the shop's units until the client chooses others
  const [chosenUnit, setUnit] = useState<LengthUnit | null>(null);
  const unit = chosenUnit ?? choices.data?.units ?? 'in';
  const live = useDebounced(spec, 300);
  const preview = usePreview(live, quantity);
  const issues = preview.error instanceof ApiRequestError ? preview.error.issues : [];
  const q = preview.data;
  const budget = q ? `${formatMoney(q.budget.lowCents)} to ${formatMoney(q.budget.highCents)}` : null;
  return (
    <div className="grid min-w-0 gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
      <Panel title="Your piece">
        <div role="radiogroup" aria-label="Units" className="mb-3 flex gap-3 text-sm">
          {(['in', 'mm'] as const).map((u) => (
            <label key={u}>
              <input type="radio" name="unit" checked={unit === u} onChange={() => setUnit(u)} />{' '}
              {u === 'in' ? 'inches' : 'millimeters'}
            </label>
          ))}
        </div>
        {choices.isError ? (
          <Notice tone="error">The shop’s materials could not be loaded; the piece keeps its standard ones.</Notice>
        ) : null}
        <IssuesProvider issues={issueMap(issues)}>
          <SpecForm
            spec={spec}
            setSpec={setSpec}
            limits={design.limits}
            options={choices.data?.options ?? {}}
            unit={unit}
          />
        </IssuesProvider>
        <CountField label="How many" value={quantity} min={1} max={20} onChange={setQuantity} />
        <Button type="button" variant="quiet" className="px-0" onClick={() => setSpec(defaultsOf(slug))}>
          Back to our standard piece
        </Button>
        {/* on a phone the drawing comes after the form: the budget stays in view at the foot of the screen */}
        <div className="sticky bottom-0 -mx-6 mt-3 flex flex-wrap items-baseline justify-between gap-2 border-t border-rule bg-paper px-6 py-2 lg:hidden">
          <span className="font-semibold">
            {issues.length ? 'Cannot be built as set' : (budget ?? 'Working out the budget…')}
          </span>
          <a href="#piece-preview" className="text-sm underline">
            See the drawing
          </a>
        </div>
      </Panel>

      {/* a wide screen keeps the drawing and budget in view beside the long form; a phone has the bar above */}
      <div
        id="piece-preview"
        className="min-w-0 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto"
      >
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
                {budget}
                {quantity > 1 ? ` for ${quantity}` : ''}
              </p>
              <p className="mb-3 text-sm text-ink-soft">
                A budget range at today’s prices, tax included. Your estimate comes from the shop, once they have looked
                at your request.{q.items[0] ? ` About ${formatWeight(q.items[0].massKg, unit)} each.` : ''}
              </p>
              {leadTime?.(q.hours)}
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
        {children?.({ blocked: issues.length > 0 })}
      </div>
    </div>
  );
}
