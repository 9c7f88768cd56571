import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  formatDate,
  PROJECT_STATUSES,
  SHOP_PROJECT_STATUS_LABELS,
  type ProjectSort,
  type ProjectStatus,
  type ProjectSummary,
  type SortDirection,
} from '@benchwright/contracts';
import { MoreButton, Money, Notice } from '@benchwright/ui';
import { useProjects } from '@benchwright/ui';

// once the deposit is paid a project is a job on the board, and a closed one is done
const PAST_REQUEST: ProjectStatus[] = ['deposit_paid', 'in_production', 'ready', 'delivered', 'closed'];
const OPEN_REQUESTS = PROJECT_STATUSES.filter((s) => !PAST_REQUEST.includes(s));
const PAGE = 50;

function what(p: ProjectSummary): string {
  return p.items.map((i) => (i.quantity > 1 ? `${i.quantity} x ${i.name}` : i.name)).join(', ');
}

/** The search box's text, once the owner has stopped typing for a moment. */
function useSettled(value: string, ms = 300): string {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

function SortHeader({
  label,
  sort,
  current,
  onSort,
  align,
}: {
  label: string;
  sort: ProjectSort;
  current: { sort: ProjectSort; dir: SortDirection };
  onSort: (sort: ProjectSort) => void;
  align?: 'right';
}) {
  const active = current.sort === sort;
  return (
    <th
      className={`py-2 ${align === 'right' ? 'text-right' : ''}`}
      aria-sort={active ? (current.dir === 'asc' ? 'ascending' : 'descending') : 'none'}
    >
      <button type="button" className="font-semibold hover:underline" onClick={() => onSort(sort)}>
        {label}
        {active ? (current.dir === 'asc' ? ' ↑' : ' ↓') : ''}
      </button>
    </th>
  );
}

/**
 * The requests and estimates, a page at a time from the server: the open requests by default (jobs in the shop
 * are on the board), or one status, or all; a search of the client's name and the notes; a sort by any column.
 */
export function ProjectTable({ empty, linkTo }: { empty: string; linkTo?: (projectId: string) => string }) {
  const [status, setStatus] = useState<'open' | 'all' | ProjectStatus>('open');
  const [text, setText] = useState('');
  const [order, setOrder] = useState<{ sort: ProjectSort; dir: SortDirection }>({ sort: 'created', dir: 'desc' });
  const q = useSettled(text);
  const list = useProjects({
    status: status === 'open' ? OPEN_REQUESTS : status === 'all' ? undefined : [status],
    q: q || undefined,
    ...order,
    limit: PAGE,
  });
  const onSort = (sort: ProjectSort) =>
    setOrder((o) =>
      o.sort === sort
        ? { sort, dir: o.dir === 'asc' ? 'desc' : 'asc' }
        : { sort, dir: sort === 'client' || sort === 'status' ? 'asc' : 'desc' },
    );
  const rows = list.data?.pages.flatMap((p) => p.projects) ?? [];
  return (
    <div>
      <div className="mb-3 flex flex-wrap items-end gap-3">
        <label className="flex flex-col text-sm">
          Show
          <select
            className="rounded border border-rule bg-white px-2 py-1"
            value={status}
            onChange={(e) => setStatus(e.target.value as typeof status)}
          >
            <option value="open">Open requests</option>
            <option value="all">All projects</option>
            {PROJECT_STATUSES.map((s) => (
              <option key={s} value={s}>
                {SHOP_PROJECT_STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Search
          <input
            type="search"
            className="rounded border border-rule bg-white px-2 py-1"
            placeholder="Client or notes"
            maxLength={100}
            value={text}
            onChange={(e) => setText(e.target.value)}
          />
        </label>
      </div>
      {list.isPending ? (
        <p>Loading…</p>
      ) : list.isError ? (
        <Notice tone="error">{list.error.message}</Notice>
      ) : !rows.length ? (
        <p className="text-ink-soft">{q || status !== 'open' ? 'Nothing matches.' : empty}</p>
      ) : (
        <>
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="border-b-2 border-rule">
                <SortHeader label="Client" sort="client" current={order} onSort={onSort} />
                <th className="py-2">Piece</th>
                <SortHeader label="Status" sort="status" current={order} onSort={onSort} />
                <SortHeader label="Asked" sort="created" current={order} onSort={onSort} />
                <SortHeader label="Latest estimate" sort="total" current={order} onSort={onSort} align="right" />
              </tr>
            </thead>
            <tbody>
              {rows.map((p) => {
                const e = p.latestEstimate;
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
                    <td className="py-2">{formatDate(p.createdAt)}</td>
                    <td className="py-2 text-right">{e ? <Money cents={e.totals.totalCents} /> : '—'}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <MoreButton list={list} />
        </>
      )}
    </div>
  );
}
