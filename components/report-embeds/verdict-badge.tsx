import type { VerdictResult } from "@/lib/report-embeds";

// The result is always written out: colour alone would leave colour-blind readers and screen readers guessing.
const styles: Record<VerdictResult, { className: string; mark: string }> = {
  "meets rating": { className: "bg-verdict-meets", mark: "✓" },
  "above rating": { className: "bg-verdict-above", mark: "▲" },
  "below rating": { className: "bg-verdict-below", mark: "▼" },
  inconclusive: { className: "bg-verdict-inconclusive", mark: "?" },
};

export function VerdictBadge({ result }: { result: VerdictResult }) {
  const style = styles[result];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded px-2 py-0.5 text-xs font-semibold text-white ${style.className}`}>
      <span aria-hidden="true">{style.mark}</span>
      {result}
    </span>
  );
}
