import { Link } from 'react-router-dom';
import { SHOP_PROJECT_STATUS_LABELS, type Project, type ProjectStatus } from '@benchwright/contracts';
import { designs, type DesignSlug } from '@benchwright/pricing/geometry';
import { Money, Notice } from '@benchwright/ui';
import { useProjects } from '../api/get-projects';

// once the deposit is paid a project is a job on the board, and a closed one is done
const PAST_REQUEST: ProjectStatus[] = ['deposit_paid', 'in_production', 'ready', 'delivered', 'closed'];

function what(p: Project): string {
  return p.items
    .map((i) => {
      const slug = (i.spec as { design?: string }).design;
      const name = slug && slug in designs ? designs[slug as DesignSlug].name : 'Custom piece';
      return i.quantity > 1 ? `${i.quantity} x ${name}` : name;
    })
    .join(', ');
}

/** The requests not yet in the shop, as a table (jobs in the shop are on the board). */
export function ProjectTable({ empty, linkTo }: { empty: string; linkTo?: (projectId: string) => string }) {
  const q = useProjects();
  if (q.isPending) return <p>Loading…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const rows = q.data.filter((p) => !PAST_REQUEST.includes(p.status));
  if (!rows.length) return <p className="text-ink-soft">{empty}</p>;
  return (
    <table className="w-full border-collapse text-left">
      <thead>
        <tr className="border-b-2 border-rule">
          <th className="py-2">Client</th>
          <th className="py-2">Piece</th>
          <th className="py-2">Status</th>
          <th className="py-2 text-right">Latest estimate</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((p) => {
          const e = p.estimates.at(-1);
          return (
            <tr key={p.id} className="border-b border-rule">
              <td className="py-2">
                {linkTo ? (
                  <Link to={linkTo(p.id)} className="text-wood underline">
                    {p.client.name}
                  </Link>
                ) : (
                  p.client.name
                )}
              </td>
              <td className="py-2">{what(p)}</td>
              <td className="py-2">{SHOP_PROJECT_STATUS_LABELS[p.status]}</td>
              <td className="py-2 text-right">{e ? <Money cents={e.totals.totalCents} /> : '—'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
