/** One piece's choices as the revision was priced (the engine's `choicesOf`, kept in the revision's record). */
export interface PieceChoices {
  /** the piece's name, e.g. its drawing's title */
  title?: string;
  choices: readonly { label: string; value: string }[];
}

/**
 * The client's choices for each piece of an estimate, as label and value
 * pairs. Renders nothing for a revision recorded before choices were kept.
 */
export function ChoicesList({
  pieces,
  heading = 'Choices',
  level = 3,
}: {
  pieces: readonly PieceChoices[];
  heading?: string;
  level?: 2 | 3;
}) {
  const shown = pieces.filter((p) => p.choices.length > 0);
  if (!shown.length) return null;
  const H = level === 2 ? 'h2' : 'h3';
  const Sub = level === 2 ? 'h3' : 'h4';
  return (
    <section className="mt-4" aria-label={heading}>
      <H className="mb-2 font-semibold">{heading}</H>
      {shown.map((p, i) => (
        <div key={i} className="mb-3">
          {shown.length > 1 && p.title ? <Sub className="mb-1 font-semibold">{p.title}</Sub> : null}
          <dl className="grid grid-cols-1 gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
            {p.choices.map((c) => (
              <div key={c.label} className="contents">
                <dt className="text-ink-soft">{c.label}</dt>
                <dd className="mb-1 sm:mb-0">{c.value}</dd>
              </div>
            ))}
          </dl>
        </div>
      ))}
    </section>
  );
}
