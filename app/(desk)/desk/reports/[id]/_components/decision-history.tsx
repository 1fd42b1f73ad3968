import type { DecisionEntry } from "@/db/queries/editorial";
import type { DecisionKind } from "@/db/schema";
import { formatDateTime } from "@/lib/format";

const decisionLabels: Record<DecisionKind, string> = {
  approve: "Approved and published",
  schedule: "Approved and scheduled",
  send_back: "Sent back",
  reject_revision: "Revision declined",
  retract: "Retracted",
};

export function DecisionHistory({ decisions }: { decisions: DecisionEntry[] }) {
  return (
    <section aria-labelledby="decisions-heading" className="space-y-2">
      <h2 id="decisions-heading" className="font-serif text-2xl">
        Decisions
      </h2>
      {decisions.length === 0 ? (
        <p className="text-sm text-ink-soft">No decision yet.</p>
      ) : (
        <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
          {decisions.map((entry) => (
            <li key={entry.id} className="px-4 py-2">
              <p>
                <span className="figure text-ink-faint">{formatDateTime(entry.createdAt)}</span> · <strong>{decisionLabels[entry.decision]}</strong>
                {entry.revisionNumber ? ` (revision ${entry.revisionNumber})` : ""}
                {entry.decision === "schedule" && entry.scheduledFor ? ` for ${formatDateTime(entry.scheduledFor)}` : ""} by {entry.editorName ?? "a deleted account"}
              </p>
              {entry.notes ? <p className="mt-1 whitespace-pre-line text-ink-soft">{entry.notes}</p> : null}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
