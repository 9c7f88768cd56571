import { useState, type FormEvent } from 'react';
import { designs, DESIGN_SLUGS, type BuildSpec, type DesignSlug } from '@benchwright/pricing/geometry';
import { ApiRequestError, Button, Notice } from '@benchwright/ui';
import { Configurator, defaultsOf, plainPath } from '@benchwright/ui/configurator';
import { useStartProject } from '../api/clients';

/**
 * Starts a project for a client who called: a design, then the portal's own configurator (every choice the design
 * allows, the drawing, checks and budget), then notes. The API checks the piece as it checks a client's request.
 */
export function StartProjectForm({ clientId, onStarted }: { clientId: string; onStarted?: (id: string) => void }) {
  const start = useStartProject();
  const [slug, setSlug] = useState<DesignSlug>(DESIGN_SLUGS[0]);
  const [spec, setSpec] = useState<BuildSpec>(() => defaultsOf(DESIGN_SLUGS[0]));
  const [quantity, setQuantity] = useState(1);
  const [notes, setNotes] = useState('');
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string; issues?: string[] } | null>(null);
  const [key, setKey] = useState(() => crypto.randomUUID());

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setMessage(null);
    try {
      const project = await start.mutateAsync({
        key,
        clientId,
        items: [{ spec: spec as never, quantity }],
        notes,
      });
      setKey(crypto.randomUUID());
      setMessage({ tone: 'ok', text: 'The project is started; the client is mailed a link to it.' });
      onStarted?.(project.id);
    } catch (err) {
      if (err instanceof ApiRequestError)
        setMessage({
          tone: 'error',
          text: err.message,
          issues: err.issues.map((i) => `${plainPath(i.path) ? `${plainPath(i.path)}: ` : ''}${i.message}`),
        });
      else setMessage({ tone: 'error', text: 'The server could not be reached; try again.' });
    }
  };

  return (
    <div>
      <div className="mb-4">
        <label htmlFor="project-design" className="mb-1 block font-semibold">
          Design
        </label>
        <select
          id="project-design"
          value={slug}
          onChange={(e) => {
            const next = e.target.value as DesignSlug;
            setSlug(next);
            setSpec(defaultsOf(next));
          }}
          className="w-full rounded border border-rule bg-white px-3 py-2"
        >
          {DESIGN_SLUGS.map((d) => (
            <option key={d} value={d}>
              {designs[d].name}
            </option>
          ))}
        </select>
        <p className="mt-1 text-sm text-ink-soft">{designs[slug].summary}</p>
      </div>
      <Configurator key={slug} slug={slug} spec={spec} setSpec={setSpec} quantity={quantity} setQuantity={setQuantity}>
        {({ blocked }) => (
          <form onSubmit={onSubmit} noValidate aria-label="Start a project">
            {message ? (
              <Notice tone={message.tone}>
                {message.text}
                {message.issues?.length ? (
                  <ul className="list-disc pl-5">
                    {message.issues.map((i) => (
                      <li key={i}>{i}</li>
                    ))}
                  </ul>
                ) : null}
              </Notice>
            ) : null}
            <label className="mb-3 block">
              <span className="mb-1 block font-semibold">Notes</span>
              <textarea
                className="w-full rounded border border-rule bg-white px-2 py-1"
                rows={3}
                maxLength={4000}
                value={notes}
                onChange={(e) => setNotes(e.target.value)}
              />
            </label>
            <Button type="submit" disabled={start.isPending || blocked}>
              {start.isPending ? 'Starting…' : 'Start the project'}
            </Button>
          </form>
        )}
      </Configurator>
    </div>
  );
}
