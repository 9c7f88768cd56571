import { useId, useRef, type ReactNode } from 'react';
import { formatDate, type UploadSummary } from '@benchwright/contracts';
import { Button, Notice } from './components';

/** 1536000 -> "1.5 MB". */
export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${Math.round(n / 1024)} KB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}

/**
 * A project's files: thumbnails that open the full picture, PDFs as download links, who added each and when, a
 * remove button where allowed, and a file input to attach another. Both apps use it; the server decides.
 */
export function UploadGallery({
  uploads,
  fileHref,
  thumbnailHref,
  canRemove,
  onRemove,
  onAttach,
  attachLabel = 'Attach a photo, sketch or PDF',
  accept = 'image/jpeg,image/png,image/webp,application/pdf',
  capture,
  pending,
  error,
  stageLabel,
  empty = 'No files yet.',
}: {
  uploads: UploadSummary[];
  fileHref: (id: string) => string;
  thumbnailHref: (id: string) => string;
  canRemove?: (u: UploadSummary) => boolean;
  onRemove?: (u: UploadSummary) => void;
  /** absent: the list only */
  onAttach?: (file: File) => void;
  attachLabel?: string;
  accept?: string;
  /** `environment` opens the back camera on a phone */
  capture?: 'environment' | 'user';
  pending?: boolean;
  error?: string;
  stageLabel?: (key: string) => string;
  empty?: ReactNode;
}) {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  return (
    <div>
      {uploads.length === 0 ? (
        <p className="mb-3 text-ink-soft">{empty}</p>
      ) : (
        <ul className="mb-4 grid grid-cols-2 gap-3 sm:grid-cols-3 md:grid-cols-4" aria-label="Files">
          {uploads.map((u) => (
            <li key={u.id} className="rounded border border-rule bg-paper p-2">
              {u.kind === 'image' ? (
                <a href={fileHref(u.id)} target="_blank" rel="noreferrer" title={`Open ${u.name} full size`}>
                  <img
                    src={thumbnailHref(u.id)}
                    alt={u.name}
                    loading="lazy"
                    className="mb-1 aspect-square w-full rounded object-cover"
                  />
                </a>
              ) : (
                <a
                  href={fileHref(u.id)}
                  className="mb-1 flex aspect-square w-full items-center justify-center rounded bg-paper-deep font-semibold text-wood underline"
                  download
                >
                  PDF · download
                </a>
              )}
              <p className="truncate text-sm font-semibold" title={u.name}>
                {u.name}
              </p>
              <p className="text-xs text-ink-soft">
                {u.stageKey ? `${stageLabel ? stageLabel(u.stageKey) : u.stageKey} · ` : ''}
                {u.by.name} · {formatDate(u.at)} · {formatBytes(u.sizeBytes)}
              </p>
              {onRemove && canRemove?.(u) ? (
                <Button variant="quiet" className="px-0 py-1 text-sm" onClick={() => onRemove(u)} disabled={pending}>
                  Remove {u.name}
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {error ? <Notice tone="error">{error}</Notice> : null}
      {onAttach ? (
        <p>
          <label htmlFor={inputId} className="mb-1 block font-semibold">
            {attachLabel}
          </label>
          <input
            id={inputId}
            ref={input}
            type="file"
            accept={accept}
            capture={capture}
            disabled={pending}
            className="block w-full max-w-full text-sm"
            onChange={(e) => {
              const file = e.currentTarget.files?.[0];
              if (file) onAttach(file);
              if (input.current) input.current.value = '';
            }}
          />
          <span className="text-sm text-ink-soft">
            {pending ? 'Sending…' : 'JPEG, PNG, WebP or PDF, up to 15 MB each; 30 files a project.'}
          </span>
        </p>
      ) : null}
    </div>
  );
}
