import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import { countVerdicts } from "@/lib/verdict-summary";

/**
 * How a report's ratings were judged, one badge per result with its count. A retracted report's verdicts stay
 * visible, since the report does, but say plainly that they no longer stand.
 */
export function VerdictSummary({ results, retracted }: { results: readonly unknown[]; retracted: boolean }) {
  const counts = countVerdicts(results);
  if (counts.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-2 text-xs">
      <span className={retracted ? "font-semibold text-copper-deep" : "text-ink-soft"}>{retracted ? "Withdrawn verdicts:" : "Verdicts:"}</span>
      <ul className="flex flex-wrap gap-2">
        {counts.map(({ result, count }) => (
          <li key={result} className="flex items-center gap-1">
            <VerdictBadge result={result} />
            <span className="figure text-ink-soft">
              <span aria-hidden="true">×</span>
              <span className="sr-only">count</span> {count}
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}
