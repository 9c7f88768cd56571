/**
 * The traveller's machining drawings on screen: each part with machining or
 * banded edges, drawn from the engine's drawing model (the PDF draws the
 * same model), scaled to its column: one column on a phone, two or more on a
 * tablet or a desk.
 */
import { Panel } from '@benchwright/ui';
import type { LengthUnit, TravellerPiece } from '@benchwright/pricing/geometry';
import { partDrawings, type PartDrawing, type PartShape } from '@benchwright/pricing/part-drawing';
import { useMemo } from 'react';

const INK = '#231c15';

/** One part drawn as SVG: outline, hatched cuts, bores, pocket slots, thick banded edges, dimensions and tags. */
export function PartDrawingSvg({ d }: { d: PartDrawing }) {
  const vb = d.viewBox;
  const s = d.textSize;
  const hatch = `bw-cut-${d.key}`;
  const line = (w: number) => ({ stroke: INK, strokeWidth: s * w, fill: 'none' });
  const el = (sh: PartShape, i: number) => {
    switch (sh.type) {
      case 'outline':
        return <polygon key={i} points={sh.points.map((p) => p.join(',')).join(' ')} {...line(0.08)} fill="#f6f1e7" />;
      case 'cut':
        return (
          <rect key={i} x={sh.x} y={sh.y} width={sh.width} height={sh.height} {...line(0.04)} fill={`url(#${hatch})`} />
        );
      case 'band':
        return <line key={i} x1={sh.x1} y1={sh.y1} x2={sh.x2} y2={sh.y2} {...line(0.3)} />;
      case 'hole':
        return <circle key={i} cx={sh.cx} cy={sh.cy} r={sh.r} {...line(0.05)} fill="#ffffff" />;
      case 'pocket':
        return (
          <rect
            key={i}
            x={sh.x}
            y={sh.y}
            width={sh.width}
            height={sh.height}
            rx={Math.min(sh.width, sh.height) / 2}
            {...line(0.05)}
            fill="#ffffff"
          />
        );
      case 'line':
        return (
          <line
            key={i}
            x1={sh.x1}
            y1={sh.y1}
            x2={sh.x2}
            y2={sh.y2}
            {...line(sh.style === 'dim' ? 0.04 : 0.025)}
            strokeDasharray={sh.style === 'centre' ? `${s * 0.5} ${s * 0.2}` : undefined}
          />
        );
      case 'tag':
        return (
          <g key={i}>
            <circle cx={sh.cx} cy={sh.cy} r={sh.r} {...line(0.05)} fill="#ffffff" />
            <text
              x={sh.cx}
              y={sh.cy + sh.r * 0.42}
              fontSize={sh.r * 1.2}
              textAnchor="middle"
              fontWeight={600}
              fill={INK}
            >
              {sh.text}
            </text>
          </g>
        );
      case 'text':
        return (
          <text
            key={i}
            x={sh.x}
            y={sh.y}
            fontSize={sh.size}
            textAnchor={sh.anchor}
            fill={INK}
            fontStyle={sh.role === 'edge' ? 'italic' : undefined}
            transform={sh.vertical ? `rotate(-90 ${sh.x} ${sh.y})` : undefined}
          >
            {sh.text}
          </text>
        );
    }
  };
  return (
    <svg
      viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}
      role="img"
      aria-label={`${d.name}, ${d.size}`}
      className="block h-auto w-full"
      fontFamily="'Source Sans 3', 'Source Sans Pro', sans-serif"
    >
      <defs>
        <pattern
          id={hatch}
          patternUnits="userSpaceOnUse"
          width={s * 0.35}
          height={s * 0.35}
          patternTransform="rotate(45)"
        >
          <line x1={0} y1={0} x2={0} y2={s * 0.35} stroke={INK} strokeWidth={s * 0.05} />
        </pattern>
      </defs>
      {d.shapes.map(el)}
    </svg>
  );
}

/** One drawing with its heading (name, quantity, size, where it goes) and its numbered notes. */
export function PartDrawingCard({ d }: { d: PartDrawing }) {
  return (
    <figure
      className="break-inside-avoid rounded border border-rule/60 bg-white p-2"
      aria-label={`Machining: ${d.name}`}
    >
      <figcaption className="mb-1">
        <span className="font-semibold">
          {d.name} × {d.quantity}
        </span>{' '}
        <span className="tabular-nums">{d.size}</span>
        <span className="block text-sm text-ink-soft">
          {d.where.join(' · ')} · {d.materialName}
        </span>
      </figcaption>
      <PartDrawingSvg d={d} />
      <ol className="mt-1 list-decimal pl-5 text-sm">
        {d.notes.map((n, i) => (
          <li key={i}>{n}</li>
        ))}
      </ol>
    </figure>
  );
}

/** The traveller's "Machining" section: every machined or banded part, identical ones once. */
export function MachiningPanel({ pieces, units }: { pieces: TravellerPiece[]; units: LengthUnit }) {
  const drawings = useMemo(() => partDrawings({ pieces }, units), [pieces, units]);
  if (!drawings.length) return null;
  return (
    <Panel title="Machining">
      <p className="mb-3 text-sm text-ink-soft">
        Each part is drawn flat with its length across; the edges and ends are named beside it. Hatched bands are dados,
        rabbets and grooves; circles are bores; thick lines are banded edges; slots are pocket holes. Numbers match the
        notes under each drawing.
      </p>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-2 xl:grid-cols-3 print:grid-cols-2">
        {drawings.map((d) => (
          <PartDrawingCard key={d.key} d={d} />
        ))}
      </div>
    </Panel>
  );
}
