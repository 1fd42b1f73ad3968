import { formatNumber } from "@/components/report-embeds/figure-format";
import type { CompareSide } from "@/lib/validations/compare";

/** Each tool's marks in its colour: the fill of the dot and bar, and the text colour the whisker ends take. */
const sideMarks: Record<CompareSide, { fill: string; ends: string }> = {
  a: { fill: "bg-copper", ends: "text-copper" },
  b: { fill: "bg-verdigris", ends: "text-verdigris" },
};

export type UncertaintyBarRow = {
  side: CompareSide;
  value: number;
  expandedUncertainty: number | null;
  rated: number | null;
  lower: number | null;
  upper: number | null;
};

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
 * band (shaded; a one-sided tolerance runs to the edge). Drawn with positioned boxes on the server, so it needs no
 * script and its labels keep their size at any width. Hidden from screen readers, which read the table beside it.
 */
export function UncertaintyBars({ rows, unit }: { rows: UncertaintyBarRow[]; unit: string }) {
  if (rows.length === 0) return null;
  const [min, max] = domainOf(rows);
  const at = (value: number) => `${((value - min) / (max - min)) * 100}%`;
  const span = (from: number, to: number) => ({ left: at(from), width: `${((to - from) / (max - min)) * 100}%` });
  const ticks = [min + (max - min) * 0.08, (min + max) / 2, max - (max - min) * 0.08];
  return (
    <div aria-hidden="true" className="space-y-1">
      {rows.map((row) => {
        const u = row.expandedUncertainty ?? 0;
        const marks = sideMarks[row.side];
        const bandFrom = row.lower ?? (row.upper !== null ? min : null);
        const bandTo = row.upper ?? (row.lower !== null ? max : null);
        return (
          <div key={row.side} className="relative h-7">
            {bandFrom !== null && bandTo !== null ? <div className="absolute inset-y-1 bg-verdigris-wash" style={span(bandFrom, bandTo)} /> : null}
            {row.rated !== null ? <div className="absolute inset-y-0 w-0.5 -translate-x-1/2 bg-ink" style={{ left: at(row.rated) }} /> : null}
            {u > 0 ? (
              <div className={`absolute top-1/2 h-3 -translate-y-1/2 border-x-2 border-current ${marks.ends}`} style={span(row.value - u, row.value + u)}>
                <div className={`absolute inset-x-0 top-1/2 h-0.5 -translate-y-1/2 ${marks.fill}`} />
              </div>
            ) : null}
            <div className={`absolute top-1/2 size-3 -translate-x-1/2 -translate-y-1/2 rounded-full ${marks.fill}`} style={{ left: at(row.value) }} />
          </div>
        );
      })}
      <div className="relative h-5 border-t border-rule text-xs text-ink-faint">
        {ticks.map((tick, index) => (
          <span
            key={tick}
            className={`figure absolute top-1 whitespace-nowrap ${index === 0 ? "" : index === ticks.length - 1 ? "-translate-x-full" : "-translate-x-1/2"}`}
            style={{ left: at(tick) }}
          >
            {formatNumber(tick, 3)} {unit}
          </span>
        ))}
      </div>
    </div>
  );
}
