import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { SafetyNotice } from "@/components/safety-notice";
import { getLatestDecisionNotes, getOpenRevisionSummary } from "@/db/queries/editorial";
import { getReport, listCitableAnalyses } from "@/db/queries/reports";
import { formatDateTime } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";
import { revisionKindLabels } from "@/lib/validations/editorial";
import { RevisionForm } from "./_components/revision-form";

export const metadata: Metadata = { title: "Revise a published report" };

const kindWords = { waveform: "waveform", heat_up_log: "heat-up log" } as const;

export default async function ReviseReportPage({ params }: PageProps<"/workspace/reports/[id]/revise">) {
  const { id } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/reports/${id}/revise`);
  const report = /^[0-9a-f-]{36}$/i.test(id) ? await getReport({ id, viewer: user }) : null;
  if (!report) notFound();
  const [open, latest, citable] = await Promise.all([
    getOpenRevisionSummary({ reportId: id }),
    getLatestDecisionNotes({ reportId: id }),
    listCitableAnalyses({ authorId: report.authorId, toolIds: report.tools.map((tool) => tool.id) }),
  ]);
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm text-ink-faint">
          <Link href={`/workspace/reports/${id}`} className="underline hover:text-copper">
            {report.title}
          </Link>{" "}
          · <Link href={`/reports/${report.slug}`} className="underline hover:text-copper">as published</Link>
        </p>
        <h1 className="font-serif text-3xl">Revise the published report</h1>
        <p className="max-w-3xl text-ink-soft">
          A published report is never overwritten. Your revision goes to the desk with its change note; readers keep seeing the published revision, with its
          own figures, until an editor approves this one. Earlier revisions stay readable at their own addresses.
        </p>
      </header>
      <SafetyNotice compact />
      {report.status !== "published" ? (
        <p role="status" className="rounded border border-rule bg-paper-sunk px-4 py-2 text-sm">
          Only a published report can be revised; this one is {report.status.replace("_", " ")}.
        </p>
      ) : open ? (
        <p role="status" className="rounded border border-rule bg-paper-sunk px-4 py-2 text-sm">
          Revision {open.number} ({revisionKindLabels[open.kind].toLowerCase()}) is {open.status === "scheduled" && open.scheduledFor ? `scheduled for ${formatDateTime(open.scheduledFor)}` : "with the desk"}.
          Wait for its decision before proposing another.
        </p>
      ) : (
        <>
          {latest?.decision === "reject_revision" ? (
            <div role="note" className="max-w-3xl border-l-4 border-verdict-inconclusive bg-paper-sunk px-4 py-3 text-sm">
              <p className="font-semibold">The desk declined revision {latest.revisionNumber} on {formatDateTime(latest.createdAt)}:</p>
              <p className="mt-1 whitespace-pre-line">{latest.notes}</p>
            </div>
          ) : null}
          <RevisionForm
            report={{
              id: report.id,
              title: report.title,
              disclosure: report.disclosure,
              bodyMdx: report.bodyMdx,
              citations: report.citations.map((citation) => ({ label: citation.label, analysisId: citation.analysisId })),
            }}
            citable={citable.map((row) => ({
              analysisId: row.analysisId,
              description: `${row.testedOn} · ${row.toolName} · ${kindWords[row.captureKind]} ${row.captureFileName} · analysed ${
                row.finishedAt ? formatDateTime(row.finishedAt) : ""
              }${row.analysisVersion ? ` (code ${row.analysisVersion})` : ""}`,
            }))}
          />
        </>
      )}
    </div>
  );
}
