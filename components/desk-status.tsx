import Link from "next/link";
import { getLatestDecisionNotes, getOpenRevisionSummary } from "@/db/queries/editorial";
import type { ReportStatus } from "@/db/schema";
import { formatDateTime } from "@/lib/format";

/**
 * What the desk last said about a report, for its reviewer: the notes of a send-back or a declined revision, and for a
 * published report where readers find it and how to revise it.
 */
export async function DeskStatus({ report }: { report: { id: string; slug: string; status: ReportStatus } }) {
  const [latest, open] = await Promise.all([getLatestDecisionNotes({ reportId: report.id }), getOpenRevisionSummary({ reportId: report.id })]);
  const notesShown = latest && (latest.decision === "send_back" || latest.decision === "reject_revision") && latest.notes;
  const readable = report.status === "published" || report.status === "retracted";
  if (!notesShown && !readable) return null;
  return (
    <div className="space-y-3">
      {notesShown ? (
        <div role="note" className="max-w-3xl border-l-4 border-verdict-inconclusive bg-paper-sunk px-4 py-3 text-sm">
          <p className="font-semibold">
            {latest.decision === "send_back" ? "Sent back by the desk" : `The desk declined revision ${latest.revisionNumber ?? ""}`} on {formatDateTime(latest.createdAt)}:
          </p>
          <p className="mt-1 whitespace-pre-line">{latest.notes}</p>
        </div>
      ) : null}
      {readable ? (
        <p className="text-sm">
          <Link href={`/reports/${report.slug}`} className="font-semibold text-copper underline">
            Read it as published
          </Link>
          {report.status === "published" ? (
            open ? (
              <span className="text-ink-soft"> · revision {open.number} is with the desk</span>
            ) : (
              <>
                {" "}
                ·{" "}
                <Link href={`/workspace/reports/${report.id}/revise`} className="font-semibold text-copper underline">
                  Propose a correction or amendment
                </Link>
              </>
            )
          ) : null}
        </p>
      ) : null}
    </div>
  );
}
