import { useId, useState, type ReactNode } from 'react';
import type { DesignOption } from '@benchwright/contracts';
import { formatLength, formatWeight, parseLength, parseWeight, type LengthUnit } from '@benchwright/pricing/geometry';
import { FieldIssues } from './issues';

const input = 'w-full rounded border bg-white px-2 py-1 text-ink focus:outline-2 focus:outline-sage';

/** A label with the words that tell it apart from its neighbours, read out but not shown (`Case 2, Bay 1`). */
function Label({ htmlFor, label, context }: { htmlFor: string; label: string; context?: string }) {
  return (
    <label htmlFor={htmlFor} className="mb-1 block font-semibold">
      {context ? <span className="sr-only">{context} </span> : null}
      {label}
    </label>
  );
}

/**
 * A length typed in the client's units (23 3/4, 1' 11 3/4", 603 mm...), kept as typed; a slip is said beside the
 * field and changes nothing. It shows a new value when the piece changes under it (the unit, a reset, a case that
 * follows the top). `share` makes it nullable: "share what is left".
 */
export function LengthField({
  id,
  label,
  context,
  mm,
  unit,
  limits,
  issues = [],
  share,
  onChange,
  onFocus,
  onBlur,
}: {
  id: string;
  label: string;
  context?: string;
  mm: number | null;
  unit: LengthUnit;
  limits?: readonly [number, number];
  issues?: readonly string[];
  /** nullable: the length to set when the client stops sharing */
  share?: { fallbackMm: number };
  onChange: (mm: number | null) => void;
  onFocus?: () => void;
  onBlur?: () => void;
}) {
  const show = (v: number | null) => (v === null ? '' : formatLength(v, { unit }));
  const [text, setText] = useState(() => show(mm));
  const [seen, setSeen] = useState({ mm, unit });
  const [slip, setSlip] = useState<string | undefined>();
  if (seen.mm !== mm || seen.unit !== unit) {
    // the piece changed under the field: show it, unless it is what is typed
    setSeen({ mm, unit });
    let typed: number | null = null;
    try {
      typed = parseLength(text, unit);
    } catch {
      typed = null;
    }
    if (seen.unit !== unit || mm === null || typed === null || Math.abs(typed - mm) > 0.05) {
      setText(show(mm));
      setSlip(undefined);
    }
  }
  const errId = `${id}-error`;
  const hintId = `${id}-hint`;
  const messages = slip ? [slip] : issues;
  const shared = share && mm === null;
  return (
    <div className="mb-3 min-w-0">
      <Label htmlFor={id} label={label} context={context} />
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <input
          id={id}
          className={`${input} max-w-40 ${messages.length ? 'border-alert' : 'border-rule'}`}
          value={shared ? 'shares what is left' : text}
          disabled={shared}
          inputMode="decimal"
          aria-invalid={messages.length ? true : undefined}
          aria-describedby={messages.length ? errId : limits ? hintId : undefined}
          onFocus={onFocus}
          onBlur={onBlur}
          onChange={(e) => {
            setText(e.target.value);
            try {
              const v = parseLength(e.target.value, unit);
              setSlip(undefined);
              setSeen({ mm: v, unit });
              onChange(v);
            } catch (err) {
              setSlip((err as Error).message);
            }
          }}
        />
        {share ? (
          <label className="text-sm">
            <input
              type="checkbox"
              checked={mm === null}
              onChange={(e) => onChange(e.target.checked ? null : share.fallbackMm)}
            />{' '}
            share what is left
          </label>
        ) : null}
      </div>
      {limits && !messages.length ? (
        <p id={hintId} className="mt-1 text-sm text-ink-soft">
          {formatLength(limits[0], { unit })} to {formatLength(limits[1], { unit })}
        </p>
      ) : null}
      <FieldIssues id={errId} messages={messages} />
    </div>
  );
}

/**
 * A weight typed in the view's weight (pounds with inches, kilograms with millimeters; "300 kg" is read as said),
 * kept as typed and stored in kilograms. A slip, or a weight past the limits, is said beside the field and changes
 * nothing; a weight that reads the same as a limit is the limit. `note` is shown under it.
 */
export function WeightField({
  id,
  label,
  context,
  kg,
  unit,
  limits,
  issues = [],
  note,
  onChange,
}: {
  id: string;
  label: string;
  context?: string;
  kg: number;
  unit: LengthUnit;
  limits: readonly [number, number];
  issues?: readonly string[];
  note?: ReactNode;
  onChange: (kg: number) => void;
}) {
  const [text, setText] = useState(() => formatWeight(kg, unit));
  const [seen, setSeen] = useState({ kg, unit });
  const [slip, setSlip] = useState<string | undefined>();
  if (seen.kg !== kg || seen.unit !== unit) {
    // the piece or the units changed under the field: show it
    setSeen({ kg, unit });
    setText(formatWeight(kg, unit));
    setSlip(undefined);
  }
  const [least, most] = limits;
  const errId = `${id}-error`;
  const hintId = `${id}-hint`;
  const messages = slip ? [slip] : issues;
  return (
    <div className="mb-3 min-w-0">
      <Label htmlFor={id} label={label} context={context} />
      <input
        id={id}
        className={`${input} max-w-40 ${messages.length ? 'border-alert' : 'border-rule'}`}
        value={text}
        inputMode="decimal"
        aria-invalid={messages.length ? true : undefined}
        aria-describedby={`${messages.length ? errId : hintId}${note ? ` ${id}-note` : ''}`}
        onChange={(e) => {
          setText(e.target.value);
          try {
            let v = parseWeight(e.target.value, unit);
            const reads = formatWeight(v, unit);
            if (reads === formatWeight(most, unit)) v = Math.min(v, most);
            if (reads === formatWeight(least, unit)) v = Math.max(v, least);
            if (v > most || v < least) {
              setSlip(`Enter a weight from ${formatWeight(least, unit)} to ${formatWeight(most, unit)}.`);
              return;
            }
            setSlip(undefined);
            setSeen({ kg: v, unit });
            onChange(v);
          } catch (err) {
            setSlip((err as Error).message);
          }
        }}
      />
      {!messages.length ? (
        <p id={hintId} className="mt-1 text-sm text-ink-soft">
          {formatWeight(least, unit)} to {formatWeight(most, unit)}
        </p>
      ) : null}
      <FieldIssues id={errId} messages={messages} />
      {note ? (
        <p id={`${id}-note`} className="mt-1 text-sm text-ink-soft">
          {note}
        </p>
      ) : null}
    </div>
  );
}

/** A choice from a short list of values, with its messages beside it. */
export function SelectField<V extends string | number>({
  label,
  context,
  value,
  choices,
  issues = [],
  onChange,
  hint,
}: {
  label: string;
  context?: string;
  value: V;
  choices: readonly (readonly [V, string])[];
  issues?: readonly string[];
  onChange: (v: V) => void;
  hint?: ReactNode;
}) {
  const id = useId();
  const errId = `${id}-error`;
  return (
    <div className="mb-3 min-w-0">
      <Label htmlFor={id} label={label} context={context} />
      <select
        id={id}
        className={`${input} ${issues.length ? 'border-alert' : 'border-rule'}`}
        value={String(value)}
        aria-invalid={issues.length ? true : undefined}
        aria-describedby={issues.length ? errId : undefined}
        onChange={(e) => {
          const hit = choices.find(([v]) => String(v) === e.target.value);
          if (hit) onChange(hit[0]);
        }}
      >
        {choices.map(([v, l]) => (
          <option key={String(v)} value={String(v)}>
            {l}
          </option>
        ))}
      </select>
      {hint ? <p className="mt-1 text-sm text-ink-soft">{hint}</p> : null}
      <FieldIssues id={errId} messages={issues} />
    </div>
  );
}

/** The words of a price-book choice: its name and its note. */
export const optionLabel = (o: DesignOption) => (o.note ? `${o.name} (${o.note})` : o.name);

/**
 * A choice among the price book's items for one field of the piece. The piece's own choice stays listed while
 * the options load or if the shop no longer offers it.
 */
export function OptionField({
  label,
  context,
  value,
  options = [],
  issues,
  none,
  onChange,
}: {
  label: string;
  context?: string;
  value: string | null;
  options?: readonly DesignOption[];
  issues?: readonly string[];
  /** the words for choosing none, where the field allows it */
  none?: string;
  onChange: (id: string | null) => void;
}) {
  const listed = value === null || options.some((o) => o.id === value);
  const choices: (readonly [string, string])[] = [
    ...(none !== undefined ? [['', none] as const] : []),
    ...(listed || value === null ? [] : [[value, options.length ? `${value} (no longer offered)` : value] as const]),
    ...options.map((o) => [o.id, optionLabel(o)] as const),
  ];
  return (
    <SelectField
      label={label}
      context={context}
      value={value ?? ''}
      choices={choices}
      issues={issues}
      onChange={(v) => onChange(v === '' ? null : v)}
    />
  );
}

/** A whole number between limits. */
export function CountField({
  label,
  context,
  value,
  min,
  max,
  issues = [],
  onChange,
}: {
  label: string;
  context?: string;
  value: number;
  min: number;
  max: number;
  issues?: readonly string[];
  onChange: (n: number) => void;
}) {
  const id = useId();
  return (
    <div className="mb-3 min-w-0">
      <Label htmlFor={id} label={label} context={context} />
      <input
        id={id}
        type="number"
        min={min}
        max={max}
        className={`${input} max-w-24 border-rule`}
        value={value}
        aria-describedby={issues.length ? `${id}-error` : undefined}
        onChange={(e) => onChange(Math.max(min, Math.min(max, Math.round(Number(e.target.value) || 0))))}
      />
      <FieldIssues id={`${id}-error`} messages={issues} />
    </div>
  );
}
