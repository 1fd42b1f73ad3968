import { formatNumber } from "@/components/report-embeds/figure-format";

export type UncertaintyBarRow = {
  key: string;
  /** The tool's colour, as a class on the marks (fill/stroke via currentColor). */
  colorClass: string;
  value: number;
  expandedUncertainty: number | null;
  rated: number | null;
  lower: number | null;
  upper: number | null;
};

const width = 640;
const rowHeight = 34;
const axisHeight = 22;

/** The span every mark must fit in, padded a little so no mark sits on the frame. */
function domainOf(rows: readonly UncertaintyBarRow[]): [number, number] {
  const values = rows.flatMap((row) => {
    const u = row.expandedUncertainty ?? 0;
    return [row.value - u, row.value + u, row.rated, row.lower, row.upper].filter((value): value is number => value !== null && Number.isFinite(value));
  });
  let min = Math.min(...values);
  let max = Math.max(...values);
  if (min === max) {
    min -= Math.abs(min) * 0.1 || 1;
    max += Math.abs(max) * 0.1 || 1;
  }
  const pad = (max - min) * 0.08;
  return [min - pad, max + pad];
}

/**
 * Measured ± U for each tool on one shared scale, against that tool's own rated value (the dark tick) and tolerance
 * band (shaded; a one-sided tolerance runs to the edge). Plain SVG drawn on the server: no script to load. Hidden from
 * screen readers, which read the table beside it.
 */
export function UncertaintyBars({ rows, unit }: { rows: UncertaintyBarRow[]; unit: string }) {
  if (rows.length === 0) return null;
  const [min, max] = domainOf(rows);
  const x = (value: number) => ((value - min) / (max - min)) * width;
  const height = rows.length * rowHeight + axisHeight;
  const ticks = [min + (max - min) * 0.08, (min + max) / 2, max - (max - min) * 0.08];
  return (
    <svg viewBox={`0 0 ${width} ${height}`} className="h-auto w-full" aria-hidden="true" focusable="false">
      {rows.map((row, index) => {
        const top = index * rowHeight;
        const middle = top + rowHeight / 2;
        const bandFrom = row.lower ?? (row.upper !== null ? min : null);
        const bandTo = row.upper ?? (row.lower !== null ? max : null);
        const u = row.expandedUncertainty ?? 0;
        return (
          <g key={row.key} className={row.colorClass}>
            {bandFrom !== null && bandTo !== null ? (
              <rect x={x(bandFrom)} y={top + 4} width={Math.max(1, x(bandTo) - x(bandFrom))} height={rowHeight - 8} className="fill-verdigris-wash" />
            ) : null}
            {row.rated !== null ? <line x1={x(row.rated)} x2={x(row.rated)} y1={top + 2} y2={top + rowHeight - 2} className="stroke-ink" strokeWidth={2} /> : null}
            {u > 0 ? (
              <g stroke="currentColor" strokeWidth={2}>
                <line x1={x(row.value - u)} x2={x(row.value + u)} y1={middle} y2={middle} />
                <line x1={x(row.value - u)} x2={x(row.value - u)} y1={middle - 7} y2={middle + 7} />
                <line x1={x(row.value + u)} x2={x(row.value + u)} y1={middle - 7} y2={middle + 7} />
              </g>
            ) : null}
            <circle cx={x(row.value)} cy={middle} r={5} fill="currentColor" />
          </g>
        );
      })}
      <line x1={0} x2={width} y1={rows.length * rowHeight + 2} y2={rows.length * rowHeight + 2} className="stroke-rule" />
      {ticks.map((tick, index) => (
        <text
          key={tick}
          x={x(tick)}
          y={height - 4}
          textAnchor={index === 0 ? "start" : index === ticks.length - 1 ? "end" : "middle"}
          className="fill-ink-faint font-mono text-[11px]"
        >
          {formatNumber(tick, 3)} {unit}
        </text>
      ))}
    </svg>
  );
}
