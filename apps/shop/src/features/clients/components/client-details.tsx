import { Link } from 'react-router-dom';
import { Money, Notice } from '@benchwright/ui';
import { useClient } from '../api/clients';

/** A client's contact details, figures and projects. */
export function ClientDetails({ id, projectHref }: { id: string; projectHref: (id: string) => string }) {
  const client = useClient(id);
  if (client.isPending) return <p>Loading the client…</p>;
  if (client.isError) return <Notice tone="error">{client.error.message}</Notice>;
  const c = client.data;
  return (
    <div>
      <h1 className="mb-2 text-2xl font-bold">{c.name}</h1>
      <dl className="mb-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        <dt className="font-semibold">E-mail</dt>
        <dd>
          <a href={`mailto:${c.email}`} className="text-wood underline">
            {c.email}
          </a>
          {c.claimed ? '' : ' (has not claimed the account yet)'}
        </dd>
        <dt className="font-semibold">Phone</dt>
        <dd>{c.phone || '—'}</dd>
        <dt className="font-semibold">Address</dt>
        <dd className="whitespace-pre-line">{c.address || '—'}</dd>
        <dt className="font-semibold">Accepted</dt>
        <dd>
          <Money cents={c.acceptedCents} />
        </dd>
        <dt className="font-semibold">Paid</dt>
        <dd>
          <Money cents={c.paidCents} />
        </dd>
      </dl>
      <h2 className="mb-2 text-lg font-bold">Projects</h2>
      {c.projects.length === 0 ? (
        <p className="text-ink-soft">No projects yet.</p>
      ) : (
        <ul className="list-disc pl-6">
          {c.projects.map((p) => (
            <li key={p.id}>
              <Link to={projectHref(p.id)} className="text-wood underline">
                {p.notes ? `“${p.notes.slice(0, 60)}”` : `${p.items} item${p.items === 1 ? '' : 's'}`}
              </Link>{' '}
              · {p.status.replace(/_/g, ' ')} · {new Date(p.createdAt).toLocaleDateString()}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
