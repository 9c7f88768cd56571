import {
  forwardRef,
  useId,
  useState,
  type ButtonHTMLAttributes,
  type InputHTMLAttributes,
  type ReactNode,
} from 'react';
import { formatLength, toSvg, type Drawing as DrawingData, type LengthUnit } from '@benchwright/pricing/geometry';

export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: 'primary' | 'quiet' }) {
  const look =
    variant === 'primary'
      ? 'bg-wood text-paper hover:bg-wood-dark disabled:opacity-60'
      : 'bg-transparent text-wood underline-offset-4 hover:underline';
  return (
    <button
      className={`rounded px-4 py-2 font-semibold focus:outline-2 focus:outline-offset-2 focus:outline-sage ${look} ${className}`}
      {...props}
    />
  );
}

type FieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string };

/** A labelled input with its error beside it; keeps what was typed (uncontrolled, for react-hook-form). */
/**
 * The "more" button under a paged list (TanStack Query's infinite query): shown only while a next page exists,
 * disabled while it loads.
 */
export function MoreButton({
  list,
  label = 'Load more',
}: {
  list: { hasNextPage: boolean; isFetchingNextPage: boolean; fetchNextPage: () => unknown };
  label?: string;
}) {
  if (!list.hasNextPage) return null;
  return (
    <Button
      type="button"
      variant="quiet"
      className="mt-3"
      disabled={list.isFetchingNextPage}
      onClick={() => void list.fetchNextPage()}
    >
      {list.isFetchingNextPage ? 'Loading…' : label}
    </Button>
  );
}

export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field(
  { label, error, hint, id, ...props },
  ref,
) {
  const auto = useId();
  const inputId = id ?? auto;
  const errId = `${inputId}-error`;
  return (
    <div className="mb-4">
      <label htmlFor={inputId} className="mb-1 block font-semibold">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errId : undefined}
        className={`w-full rounded border bg-white px-3 py-2 text-ink ${error ? 'border-alert' : 'border-rule'} focus:outline-2 focus:outline-sage`}
        {...props}
      />
      {hint && !error ? <p className="mt-1 text-sm text-ink-soft">{hint}</p> : null}
      {error ? (
        <p id={errId} role="alert" className="mt-1 text-sm text-alert">
          {error}
        </p>
      ) : null}
    </div>
  );
});

export function Notice({ tone = 'info', children }: { tone?: 'info' | 'error' | 'ok'; children: ReactNode }) {
  const look =
    tone === 'error'
      ? 'border-alert bg-alert-light'
      : tone === 'ok'
        ? 'border-sage bg-sage-light'
        : 'border-rule bg-paper-deep';
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`mb-4 rounded border-l-4 px-4 py-3 ${look}`}>
      {children}
    </div>
  );
}

/** A titled section; `level={1}` makes its title the page's one `h1` (the first panel of a page without another). */
export function Panel({ title, level = 2, children }: { title?: string; level?: 1 | 2; children: ReactNode }) {
  const titleId = useId();
  const Heading = level === 1 ? 'h1' : 'h2';
  return (
    <section className="mb-6 rounded border border-rule bg-white/70 p-6" aria-labelledby={title ? titleId : undefined}>
      {title ? (
        <Heading id={titleId} className={`mb-4 font-semibold ${level === 1 ? 'text-2xl' : 'text-xl'}`}>
          {title}
        </Heading>
      ) : null}
      {children}
    </section>
  );
}

const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
/** Cents as dollars: $1,234.50. */
export function Money({ cents }: { cents: number }) {
  return <span className="tabular-nums">{usd.format(cents / 100)}</span>;
}
export function formatMoney(cents: number): string {
  return usd.format(cents / 100);
}

export function Length({ mm, unit }: { mm: number; unit: LengthUnit }) {
  return <span className="tabular-nums">{formatLength(mm, { unit })}</span>;
}

/** A drawing from the engine, rendered as SVG (the same data the PDF uses). */
export function Drawing({
  drawing,
  label,
  maxHeight = '22rem',
}: {
  drawing: DrawingData;
  label?: string;
  maxHeight?: string;
}) {
  // scale to the column's width, but never taller than maxHeight (a tall bookcase stays on screen)
  const svg = toSvg(drawing).replace(
    / width="\d+" height="\d+"/,
    ` style="display:block;width:100%;height:auto;max-height:${maxHeight}"`,
  );
  return <figure aria-label={label ?? drawing.title} className="w-full" dangerouslySetInnerHTML={{ __html: svg }} />;
}

/** A table's header row in the house style: column names, the first with the row padding. */
export function TableHead({ columns }: { columns: readonly string[] }) {
  return (
    <thead>
      <tr className="border-b border-rule">
        {columns.map((c, i) => (
          <th key={`${i}-${c}`} className={i === 0 ? 'py-1' : undefined}>
            {c}
          </th>
        ))}
      </tr>
    </thead>
  );
}

/** A comment box: what the client and the owner say to each other about a project (sent by the caller). */
export function CommentForm({
  label,
  onSend,
  pending,
  error,
}: {
  label: string;
  onSend: (message: string, done: () => void) => void;
  pending: boolean;
  error?: string | null;
}) {
  const [text, setText] = useState('');
  return (
    <form
      aria-label={label}
      onSubmit={(e) => {
        e.preventDefault();
        if (text.trim()) onSend(text, () => setText(''));
      }}
    >
      <label className="mb-2 block">
        <span className="block font-semibold">{label}</span>
        <textarea
          className="w-full rounded border border-rule bg-white px-2 py-1"
          rows={3}
          maxLength={2000}
          value={text}
          onChange={(e) => setText(e.target.value)}
        />
      </label>
      {error ? (
        <p role="alert" className="mb-2 text-sm text-alert">
          {error}
        </p>
      ) : null}
      <Button type="submit" variant="quiet" className="px-0" disabled={pending || !text.trim()}>
        {pending ? 'Sending…' : 'Send'}
      </Button>
    </form>
  );
}
