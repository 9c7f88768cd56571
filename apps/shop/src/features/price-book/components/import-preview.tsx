import { Fragment } from 'react';
import { priceColumns, type ImportPreview as Preview, type PriceBookKind } from '@benchwright/contracts';
import { Button, Notice } from '@benchwright/ui';
import { heading, showValue, type CellUnits } from './cells';

/**
 * What a CSV import would do, before anything is saved: the rows it adds, the rows it changes (each changed field
 * with its old and new value, in the shop's units like the table) and its errors by row and the file's column. Confirm is enabled only when there are no errors
 * and something to save.
 */
export function ImportPreview({
  kind,
  cu,
  preview,
  onConfirm,
  onCancel,
  saving = false,
}: {
  kind: PriceBookKind;
  cu: CellUnits;
  preview: Preview;
  onConfirm: () => void;
  onCancel: () => void;
  saving?: boolean;
}) {
  const cols = priceColumns(kind);
  const idCol = cols[0]!;
  const nothing = !preview.added.length && !preview.changed.length;
  const fields = [...cols.map((c) => ({ c, key: c.field })), { c: null, key: 'retired' }];
  return (
    <section aria-label="Import preview" className="mt-4 rounded border border-rule p-4">
      <h3 className="mb-2 font-semibold">Before anything is saved</h3>
      {preview.errors.length ? (
        <>
          <Notice tone="error">
            {preview.errors.length} problem{preview.errors.length === 1 ? '' : 's'} in the file: fix them and choose the
            file again. Nothing is saved while any row is wrong.
          </Notice>
          <table aria-label="Errors" className="mt-2 w-full text-left text-sm">
            <thead>
              <tr className="border-b border-rule">
                <th className="py-1">Row</th>
                <th>Column</th>
                <th>Problem</th>
              </tr>
            </thead>
            <tbody>
              {preview.errors.map((e, i) => (
                <tr key={i} className="border-b border-rule">
                  <td className="py-1">{e.row || 'file'}</td>
                  <td>{e.column || '—'}</td>
                  <td>{e.message}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
      {preview.added.length ? (
        <>
          <h4 className="mt-3 font-semibold">To add ({preview.added.length})</h4>
          <table aria-label="Rows to add" className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-rule">
                {cols.map((c) => (
                  <th key={c.field} className="py-1">
                    {heading(c, cu)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {preview.added.map((item, i) => (
                <tr key={i} className="border-b border-rule">
                  {cols.map((c) => (
                    <td key={c.field} className="py-1">
                      {showValue(c, item[c.field], cu, item)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
      {preview.changed.length ? (
        <>
          <h4 className="mt-3 font-semibold">To change ({preview.changed.length})</h4>
          <table aria-label="Rows to change" className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-rule">
                <th className="py-1">{heading(idCol, cu)}</th>
                <th>Column</th>
                <th>Now</th>
                <th>After the import</th>
              </tr>
            </thead>
            <tbody>
              {preview.changed.map((ch) => {
                const diffs = fields.filter(
                  ({ key }) => JSON.stringify(ch.before[key]) !== JSON.stringify(ch.after[key]),
                );
                return (
                  <Fragment key={ch.id}>
                    {diffs.map(({ c, key }, i) => (
                      <tr key={key} className="border-b border-rule">
                        <td className="py-1">{i === 0 ? ch.id : ''}</td>
                        <td>{c ? heading(c, cu) : 'Retired'}</td>
                        <td>{c ? showValue(c, ch.before[key], cu, ch.before) : ch.before[key] ? 'yes' : 'no'}</td>
                        <td>{c ? showValue(c, ch.after[key], cu, ch.after) : ch.after[key] ? 'yes' : 'no'}</td>
                      </tr>
                    ))}
                  </Fragment>
                );
              })}
            </tbody>
          </table>
        </>
      ) : null}
      {nothing && !preview.errors.length ? (
        <p className="mt-2">The file matches the price book: nothing to change.</p>
      ) : null}
      <div className="mt-4 flex gap-2">
        <Button type="button" onClick={onConfirm} disabled={saving || preview.errors.length > 0 || nothing}>
          {saving ? 'Saving…' : 'Confirm the import'}
        </Button>
        <Button type="button" variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </section>
  );
}
