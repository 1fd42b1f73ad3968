import { requestStatusLabels, type RequestStatusName } from "@/lib/request-statuses";

const statusStyles: Record<RequestStatusName, string> = {
  open: "border-ink-faint text-ink-soft",
  planned: "border-verdigris bg-verdigris-wash text-verdigris-deep",
  measured: "border-verdict-meets text-verdict-meets",
  declined: "border-rule bg-paper-sunk text-ink-faint",
};

/** The status in words (colour only repeats it); a merged request says so instead of just "declined". */
export function RequestStatusBadge({ status, merged = false }: { status: RequestStatusName; merged?: boolean }) {
  return (
    <span className={`inline-block rounded-full border px-2 py-0.5 text-xs font-semibold uppercase tracking-wide ${statusStyles[status]}`}>
      {merged ? "Merged" : requestStatusLabels[status]}
    </span>
  );
}
