import { useState, type FormEvent } from 'react';
import type { Design } from '@benchwright/contracts';
import { ApiRequestError, Button, Field, Notice } from '@benchwright/ui';
import { useDesigns, useStartProject } from '../api/clients';

const DIMENSIONS = [
  ['widthMm', 'Width'],
  ['heightMm', 'Height'],
  ['depthMm', 'Depth'],
] as const;

/**
 * Starts a project for a client from the shop: a design and its main dimensions, from the design's defaults (the
 * portal's full configurator form comes here once it is shared). The API checks the piece as it checks a request.
 */
export function StartProjectForm({ clientId, onStarted }: { clientId: string; onStarted?: (id: string) => void }) {
  const designs = useDesigns();
  const start = useStartProject();
  const [slug, setSlug] = useState('');
  const [dims, setDims] = useState<Record<string, string>>({});
  const [quantity, setQuantity] = useState('1');
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [key, setKey] = useState(() => crypto.randomUUID());
  if (designs.isPending) return <p>Loading the designs…</p>;
  if (designs.isError) return <Notice tone="error">{designs.error.message}</Notice>;
  const design: Design | undefined = designs.data.find((d) => d.slug === slug) ?? designs.data[0];
  if (!design) return <Notice tone="error">The shop has no designs.</Notice>;
  const defaults = design.defaults as Record<string, unknown>;
  const value = (k: string) => dims[`${design.slug}.${k}`] ?? String(defaults[k] ?? '');

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    setMessage(null);
    const spec: Record<string, unknown> = { ...defaults };
    for (const [k] of DIMENSIONS) spec[k] = Number(value(k));
    try {
      const project = await start.mutateAsync({
        key,
        clientId,
        items: [{ spec: spec as never, quantity: Number(quantity) }],
        notes,
      });
      setKey(crypto.randomUUID());
      setMessage({ tone: 'ok', text: 'The project is started; the client is mailed a link to it.' });
      onStarted?.(project.id);
    } catch (err) {
      if (err instanceof ApiRequestError) {
        const placed: Record<string, string> = {};
        for (const i of err.issues) {
          const m = /^items\[0\]\.(?:spec\.)?(\w+)/.exec(i.path);
          if (m?.[1]) placed[m[1]] = i.message;
          else if (i.path === 'notes') placed.notes = i.message;
        }
        setErrors(placed);
        const rest = err.issues.filter(
          (i) => !/^items\[0\]\.(spec\.)?(widthMm|heightMm|depthMm|quantity)$/.test(i.path),
        );
        setMessage({
          tone: 'error',
          text: [err.message, ...rest.map((i) => `${i.path}: ${i.message}`)].join(' '),
        });
      } else setMessage({ tone: 'error', text: 'The server could not be reached; try again.' });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Start a project">
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <div className="mb-4">
        <label htmlFor="project-design" className="mb-1 block font-semibold">
          Design
        </label>
        <select
          id="project-design"
          value={design.slug}
          onChange={(e) => setSlug(e.target.value)}
          className="w-full rounded border border-rule bg-white px-3 py-2"
        >
          {designs.data.map((d) => (
            <option key={d.slug} value={d.slug}>
              {d.name}
            </option>
          ))}
        </select>
        <p className="mt-1 text-sm text-ink-soft">{design.summary}</p>
      </div>
      <div className="grid gap-x-6 sm:grid-cols-3">
        {DIMENSIONS.map(([k, label]) => {
          const [min, max] = design.limits[k] ?? [];
          return (
            <Field
              key={k}
              label={`${label} (mm)`}
              inputMode="decimal"
              value={value(k)}
              hint={min !== undefined ? `${min} to ${max} mm` : undefined}
              error={errors[k]}
              onChange={(e) => setDims((d) => ({ ...d, [`${design.slug}.${k}`]: e.target.value }))}
            />
          );
        })}
      </div>
      <Field
        label="How many"
        inputMode="numeric"
        value={quantity}
        error={errors.quantity}
        onChange={(e) => setQuantity(e.target.value)}
      />
      <Field label="Notes" value={notes} error={errors.notes} onChange={(e) => setNotes(e.target.value)} />
      <Button type="submit" disabled={start.isPending}>
        {start.isPending ? 'Starting…' : 'Start the project'}
      </Button>
    </form>
  );
}
