import { useState } from 'react';
import type { ImportPreview as Preview, PriceBookKind } from '@benchwright/contracts';
import { ApiRequestError, Notice } from '@benchwright/ui';
import { csvHref, useConfirmImport, usePreviewImport } from '../api/price-book';
import { ImportPreview } from './import-preview';
import type { CellUnits } from './cells';

/** A kind's CSV: the export link, and an import that always shows the API's preview before the owner confirms. */
export function CsvImport({ kind, label, cu }: { kind: PriceBookKind; label: string; cu: CellUnits }) {
  const [text, setText] = useState<string | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const dry = usePreviewImport(kind);
  const confirm = useConfirmImport(kind);
  const reset = () => (setText(null), setPreview(null), dry.reset(), confirm.reset());

  async function choose(file: File | undefined) {
    reset();
    setDone(null);
    if (!file) return;
    const t = await file.text();
    setText(t);
    dry.mutate(t, { onSuccess: (r) => setPreview(r.preview) });
  }
  const error = dry.error ?? confirm.error;
  return (
    <div className="mt-3 flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-4">
        <a className="text-wood underline" href={csvHref(kind)} download={`${kind}.csv`}>
          Export {label.toLowerCase()} as CSV
        </a>
        <label className="text-sm">
          Import a CSV of {label.toLowerCase()}:{' '}
          <input
            type="file"
            accept=".csv,text/csv"
            aria-label={`Import ${label.toLowerCase()} CSV`}
            onChange={(e) => void choose(e.target.files?.[0])}
          />
        </label>
      </div>
      {dry.isPending ? <p>Reading the file…</p> : null}
      {error ? (
        <Notice tone="error">
          {error.message}
          {error instanceof ApiRequestError && error.issues.length
            ? ` ${error.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`
            : ''}
        </Notice>
      ) : null}
      {done ? <Notice tone="ok">{done}</Notice> : null}
      {preview && text !== null ? (
        <ImportPreview
          kind={kind}
          cu={cu}
          preview={preview}
          saving={confirm.isPending}
          onCancel={reset}
          onConfirm={() =>
            confirm.mutate(text, {
              onSuccess: (r) => {
                reset();
                setDone(
                  `Imported: ${r.preview.added.length} added, ${r.preview.changed.length} changed (price book version ${r.version}).`,
                );
              },
            })
          }
        />
      ) : null}
    </div>
  );
}
