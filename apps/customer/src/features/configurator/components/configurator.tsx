import { useEffect, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { BuildSpec, DesignSlug } from '@benchwright/pricing/geometry';
import { Button, Notice, Panel } from '@benchwright/ui';
import { useMe } from '@benchwright/ui/auth';
import { Configurator as PieceConfigurator, specFrom } from '@benchwright/ui/configurator';
import { paths } from '../../../config/paths';
import { useCreateProject } from '../api/create-project';
import { LeadTimeNote } from './lead-time-note';
import type { CreateProjectBody } from '@benchwright/contracts';

const draftKey = (slug: string) => `benchwright:draft:${slug}`;

function savedDraft(slug: DesignSlug): unknown {
  try {
    return JSON.parse(sessionStorage.getItem(draftKey(slug)) ?? 'null');
  } catch {
    return null;
  }
}

/**
 * The portal's configurator: the shared form and preview (`@benchwright/ui/configurator`), the piece kept as a
 * draft in the session while the client signs in, and the request for an estimate.
 */
export function Configurator({ slug }: { slug: DesignSlug }) {
  const [spec, setSpec] = useState<BuildSpec>(() => specFrom(slug, savedDraft(slug)));
  const [quantity, setQuantity] = useState(1);
  const [notes, setNotes] = useState('');
  const me = useMe();
  const create = useCreateProject();
  const navigate = useNavigate();
  useEffect(() => sessionStorage.setItem(draftKey(slug), JSON.stringify(spec)), [slug, spec]);
  const client = me.data?.role === 'client';
  return (
    <PieceConfigurator
      slug={slug}
      spec={spec}
      setSpec={setSpec}
      quantity={quantity}
      setQuantity={setQuantity}
      leadTime={(hours) => <LeadTimeNote hours={hours} />}
    >
      {({ blocked }) => (
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
              <Button type="submit" disabled={create.isPending || blocked}>
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
      )}
    </PieceConfigurator>
  );
}
