import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDate, type ClientSort } from '@benchwright/contracts';
import { Money, MoreButton, Notice } from '@benchwright/ui';
import { useClients, type ClientsParams } from '../api/clients';

const COLUMNS: { sort: ClientSort; label: string; numeric?: boolean }[] = [
  { sort: 'name', label: 'Client' },
  { sort: 'projects', label: 'Projects', numeric: true },
  { sort: 'accepted', label: 'Accepted', numeric: true },
  { sort: 'paid', label: 'Paid', numeric: true },
  { sort: 'activity', label: 'Last activity' },
];

/** The shop's clients with their figures (computed by the API), sorted by any column and searched by name or e-mail. */
export function ClientsTable({ linkTo, pageSize }: { linkTo: (id: string) => string; pageSize?: number }) {
  const [params, setParams] = useState<ClientsParams>({ q: '', sort: 'activity', order: 'desc', limit: pageSize });
  const clients = useClients(params);
  const rows = clients.data?.pages.flatMap((p) => p.clients) ?? [];
  const sortBy = (sort: ClientSort) =>
    setParams((p) => ({
      ...p,
      sort,
      order: p.sort === sort ? (p.order === 'asc' ? 'desc' : 'asc') : sort === 'name' ? 'asc' : 'desc',
    }));
  return (
    <div>
      <label htmlFor="client-search" className="mb-1 block font-semibold">
        Search clients
      </label>
      <input
        id="client-search"
        type="search"
        value={params.q}
        placeholder="Name or e-mail"
        onChange={(e) => setParams((p) => ({ ...p, q: e.target.value }))}
        className="mb-4 w-full max-w-sm rounded border border-rule bg-white px-3 py-2"
      />
      {clients.isError ? <Notice tone="error">{clients.error.message}</Notice> : null}
      {clients.isPending ? (
        <p>Loading the clients…</p>
      ) : (
        <table className="w-full text-left">
          <thead>
            <tr className="border-b border-rule">
              {COLUMNS.map((c) => (
                <th
                  key={c.sort}
                  scope="col"
                  className={`py-2 ${c.numeric ? 'pl-4 text-right' : c.sort === 'activity' ? 'pl-6' : ''}`}
                  aria-sort={params.sort === c.sort ? (params.order === 'asc' ? 'ascending' : 'descending') : undefined}
                >
                  <button type="button" className="font-semibold hover:text-wood" onClick={() => sortBy(c.sort)}>
                    {c.label}
                    {params.sort === c.sort ? (params.order === 'asc' ? ' ↑' : ' ↓') : ''}
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((c) => (
              <tr key={c.id} className="border-b border-rule/60">
                <td className="py-2">
                  <Link to={linkTo(c.id)} className="font-semibold text-wood underline">
                    {c.name}
                  </Link>
                  <span className="block text-sm text-ink-soft">
                    {c.email}
                    {c.claimed ? '' : ' · has not claimed the account yet'}
                  </span>
                </td>
                <td className="py-2 text-right">{c.projectCount}</td>
                <td className="py-2 text-right">
                  <Money cents={c.acceptedCents} />
                </td>
                <td className="py-2 text-right">
                  <Money cents={c.paidCents} />
                </td>
                <td className="py-2 pl-6">{formatDate(c.lastActivityAt)}</td>
              </tr>
            ))}
            {clients.data && rows.length === 0 ? (
              <tr>
                <td colSpan={5} className="py-3 text-ink-soft">
                  {params.q ? 'No client matches that search.' : 'No clients yet.'}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      )}
      <MoreButton list={clients} />
    </div>
  );
}
