import { useMemo, useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import {
  priceColumns,
  PRICE_KINDS,
  type PriceBookEntry,
  type PriceBookKind,
  type PriceColumn,
} from '@benchwright/contracts';
import { ApiRequestError, Button, Notice } from '@benchwright/ui';
import { useAddItem, useEditItem } from '../api/price-book';
import { choiceLabel, fieldErrors, heading, itemOf, showValue, type CellUnits } from './cells';

/** One field's input while a row is edited or added: a choice where the engine's schema has one. */
function Input({
  c,
  cu,
  value,
  onChange,
  error,
  label,
}: {
  c: PriceColumn;
  cu: CellUnits;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  label: string;
}) {
  const cls = `w-full min-w-16 rounded border bg-white px-1 py-0.5 ${error ? 'border-alert' : 'border-rule'}`;
  return (
    <div>
      {c.options ? (
        <select aria-label={label} className={cls} value={value} onChange={(e) => onChange(e.target.value)}>
          {c.optional || value === '' ? <option value="" /> : null}
          {c.options.map((o) => (
            <option key={o} value={o}>
              {choiceLabel(c, o, cu)}
            </option>
          ))}
        </select>
      ) : (
        <input
          aria-label={label}
          aria-invalid={error ? true : undefined}
          className={cls}
          value={value}
          inputMode={c.type === 'money' || c.type === 'number' ? 'decimal' : undefined}
          onChange={(e) => onChange(e.target.value)}
        />
      )}
      {error ? (
        <p role="alert" className="text-xs text-alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A row's fields as the inputs start: in the shop's units, a choice by its key (the select shows its label). */
const draftOf = (cols: PriceColumn[], item: Record<string, unknown>, cu: CellUnits) =>
  Object.fromEntries(
    cols.map((c) => [c.field, c.options ? String(item[c.field] ?? '') : showValue(c, item[c.field], cu, item)]),
  );

const issuesOf = (e: unknown) => (e instanceof ApiRequestError ? e.issues : []);

/**
 * A kind's items in the shop's units (`cells.ts` converts from and to the stored ones): sortable by any column,
 * filtered by a search, edited in place (the API's field errors beside each field), added at the foot, retired or
 * restored (there is no delete: estimates keep naming an item).
 */
export function PriceTable({ kind, entries, cu }: { kind: PriceBookKind; entries: PriceBookEntry[]; cu: CellUnits }) {
  const cols = useMemo(() => priceColumns(kind), [kind]);
  const label = PRICE_KINDS[kind].label;
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filter, setFilter] = useState('');
  const [showRetired, setShowRetired] = useState(false);
  const [editing, setEditing] = useState<string | null>(null);
  const [draft, setDraft] = useState<Record<string, string>>({});
  const [shown, setShown] = useState<Record<string, string>>({});
  const [adding, setAdding] = useState<Record<string, string> | null>(null);
  // fields that could not be read in the shop's units, before anything is sent
  const [unread, setUnread] = useState<{ edit: Record<string, string>; add: Record<string, string> }>({
    edit: {},
    add: {},
  });
  const edit = useEditItem(kind);
  const add = useAddItem(kind);
  const editErrors = { ...fieldErrors(issuesOf(edit.error)), ...unread.edit };
  const addErrors = { ...fieldErrors(issuesOf(add.error)), ...unread.add };

  const data = useMemo(() => entries.filter((e) => showRetired || !e.retiredAt), [entries, showRetired]);
  const columns = useMemo<ColumnDef<PriceBookEntry>[]>(
    () =>
      cols.map((c) => ({
        id: c.field,
        header: heading(c, cu),
        accessorFn: (e) =>
          c.type === 'money' || c.type === 'number' ? e.item[c.field] : showValue(c, e.item[c.field], cu, e.item),
        sortUndefined: 'last',
        sortDescFirst: false,
      })),
    [cols, cu],
  );
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getRowId: (e) => e.id,
    globalFilterFn: (row, _col, q: string) =>
      cols.some((c) =>
        showValue(c, row.original.item[c.field], cu, row.original.item).toLowerCase().includes(q.toLowerCase()),
      ),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const save = (id: string) => {
    edit.reset();
    const { item, errors } = itemOf(cols, draft, cu, shown);
    setUnread((u) => ({ ...u, edit: errors }));
    if (Object.keys(errors).length) return;
    if (!Object.keys(item).length) return setEditing(null); // nothing changed: no new version
    edit.mutate({ id, body: { item } }, { onSuccess: () => setEditing(null) });
  };
  const create = (draft: Record<string, string>) => {
    add.reset();
    const { item, errors } = itemOf(cols, draft, cu);
    setUnread((u) => ({ ...u, add: errors }));
    if (Object.keys(errors).length) return;
    add.mutate({ item }, { onSuccess: () => setAdding(null) });
  };
  const stopEditing = () => (setEditing(null), edit.reset(), setUnread((u) => ({ ...u, edit: {} })));

  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center gap-4">
        <input
          type="search"
          aria-label={`Filter ${label.toLowerCase()}`}
          placeholder="Filter…"
          className="rounded border border-rule bg-white px-2 py-1"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
        />
        <label className="flex items-center gap-1 text-sm">
          <input type="checkbox" checked={showRetired} onChange={(e) => setShowRetired(e.target.checked)} /> Show
          retired
        </label>
      </div>
      {edit.error && !Object.keys(editErrors).length ? <Notice tone="error">{edit.error.message}</Notice> : null}
      {editErrors[''] ? <Notice tone="error">{editErrors['']}</Notice> : null}
      <div className="overflow-x-auto">
        <table aria-label={label} className="w-full border-collapse text-left text-sm">
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id} className="border-b-2 border-rule">
                {g.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      className="py-1 pr-2"
                      aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : undefined}
                    >
                      <button type="button" className="font-semibold" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        {dir === 'asc' ? ' ▲' : dir === 'desc' ? ' ▼' : ''}
                      </button>
                    </th>
                  );
                })}
                <th className="py-1">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => {
              const e = row.original;
              const isEditing = editing === e.id;
              return (
                <tr key={row.id} className={`border-b border-rule align-top ${e.retiredAt ? 'text-ink-soft' : ''}`}>
                  {cols.map((c, i) => (
                    <td key={c.field} className="py-1 pr-2">
                      {isEditing && i > 0 ? (
                        <Input
                          c={c}
                          cu={cu}
                          label={`${heading(c, cu)} of ${e.id}`}
                          value={draft[c.field] ?? ''}
                          onChange={(v) => setDraft((d) => ({ ...d, [c.field]: v }))}
                          error={editErrors[c.field]}
                        />
                      ) : (
                        showValue(c, e.item[c.field], cu, e.item)
                      )}
                      {i === 0 && e.retiredAt ? <span className="ml-1 text-xs">(retired)</span> : null}
                    </td>
                  ))}
                  <td className="whitespace-nowrap py-1">
                    {isEditing ? (
                      <>
                        <Button
                          type="button"
                          className="px-2 py-0.5"
                          onClick={() => save(e.id)}
                          disabled={edit.isPending}
                        >
                          Save
                        </Button>
                        <Button type="button" variant="quiet" onClick={stopEditing}>
                          Cancel
                        </Button>
                      </>
                    ) : (
                      <>
                        <Button
                          type="button"
                          variant="quiet"
                          aria-label={`Edit ${e.id}`}
                          onClick={() => {
                            stopEditing();
                            const d = draftOf(cols, e.item, cu);
                            setDraft(d);
                            setShown(d);
                            setEditing(e.id);
                          }}
                        >
                          Edit
                        </Button>
                        <Button
                          type="button"
                          variant="quiet"
                          aria-label={`${e.retiredAt ? 'Restore' : 'Retire'} ${e.id}`}
                          onClick={() => edit.mutate({ id: e.id, body: { retired: !e.retiredAt } })}
                        >
                          {e.retiredAt ? 'Restore' : 'Retire'}
                        </Button>
                      </>
                    )}
                  </td>
                </tr>
              );
            })}
            {adding ? (
              <tr className="align-top">
                {cols.map((c) => (
                  <td key={c.field} className="py-1 pr-2">
                    <Input
                      c={c}
                      cu={cu}
                      label={`New ${heading(c, cu).toLowerCase()}`}
                      value={adding[c.field] ?? ''}
                      onChange={(v) => setAdding((d) => ({ ...d, [c.field]: v }))}
                      error={addErrors[c.field]}
                    />
                  </td>
                ))}
                <td className="whitespace-nowrap py-1">
                  <Button type="button" className="px-2 py-0.5" disabled={add.isPending} onClick={() => create(adding)}>
                    Add
                  </Button>
                  <Button
                    type="button"
                    variant="quiet"
                    onClick={() => (setAdding(null), add.reset(), setUnread((u) => ({ ...u, add: {} })))}
                  >
                    Cancel
                  </Button>
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      {add.error && !Object.keys(addErrors).length ? <Notice tone="error">{add.error.message}</Notice> : null}
      {!adding ? (
        <Button type="button" variant="quiet" className="mt-2" onClick={() => setAdding({})}>
          Add {label.toLowerCase().replace(/s$/, '')}
        </Button>
      ) : null}
    </div>
  );
}
