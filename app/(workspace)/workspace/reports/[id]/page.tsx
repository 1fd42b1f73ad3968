import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DeskStatus } from "@/components/desk-status";
import { SafetyNotice } from "@/components/safety-notice";
import { editableReportStatuses, getReport, listCitableAnalyses, listToolChoices } from "@/db/queries/reports";
import { listCalibrationWarnings } from "@/db/queries/runs";
import { suggestDisclosure } from "@/lib/report-submission";
import { requirePagePermission } from "@/lib/session";
import { CalibrationWarnings } from "../_components/calibration-warnings";
import { CitationsPanel } from "../_components/citations-panel";
import { EmbedGuide } from "../_components/embed-guide";
import { ImagesPanel } from "../_components/images-panel";
import { ReportEditor } from "../_components/report-editor";
import { reportStatusLabels } from "../_components/report-status";
import { ReportView } from "../_components/report-view";
import { SubmitPanel } from "../_components/submit-panel";

export const metadata: Metadata = { title: "Report" };

const kindWords = { waveform: "waveform", heat_up_log: "heat-up log" } as const;

export default async function ReportPage({ params }: PageProps<"/workspace/reports/[id]">) {
  const { id } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/reports/${id}`);
  const report = /^[0-9a-f-]{36}$/i.test(id) ? await getReport({ id, viewer: user }) : null;
  if (!report) notFound();

  if (!editableReportStatuses.includes(report.status)) {
    return (
      <div className="space-y-4">
        <p role="status" className="rounded border border-rule bg-paper-sunk px-4 py-2 text-sm">
          {reportStatusLabels[report.status]}
          {report.submittedAt ? ` on ${report.submittedAt.toISOString().slice(0, 10)}` : ""}:{" "}
          {report.status === "submitted" ? "read-only while the editors have it." : "read-only; a change goes through a revision the desk approves."}
        </p>
        <DeskStatus report={report} />
        <ReportView report={report} />
      </div>
    );
  }

  const [tools, citable, warnings] = await Promise.all([
    listToolChoices(),
    listCitableAnalyses({ authorId: report.authorId, toolIds: report.tools.map((tool) => tool.id) }),
    listCalibrationWarnings({ runIds: [...new Set(report.citations.map((citation) => citation.runId))] }),
  ]);
  const disclosure = report.disclosure || suggestDisclosure(report.citations.map((citation) => ({ toolName: citation.toolName, unit: citation.unit })));

  return (
    <div className="space-y-8">
      <header className="space-y-1">
        <p className="text-sm text-ink-faint">
          <Link href="/workspace/reports" className="underline hover:text-copper">Reports</Link> · {reportStatusLabels[report.status]} ·{" "}
          <Link href={`/workspace/reports/${report.id}/view`} className="underline hover:text-copper">View as saved</Link>
        </p>
        <h1 className="font-serif text-3xl">{report.title}</h1>
        <p className="text-ink-soft">By {report.authorName}</p>
      </header>
      <DeskStatus report={report} />
      <SafetyNotice compact />
      <CalibrationWarnings warnings={warnings} toolOfRun={new Map(report.citations.map((citation) => [citation.runId, citation.toolName]))} />
      <ReportEditor
        report={{
          id: report.id,
          title: report.title,
          toolId: report.tools[0]?.id ?? "",
          secondToolId: report.tools[1]?.id,
          disclosure,
          bodyMdx: report.bodyMdx,
        }}
        tools={tools}
      />
      <EmbedGuide
        labels={report.citations.map((citation) => citation.label)}
        imageNames={report.images.map((image) => image.name)}
        toolSlugs={report.tools.map((tool) => tool.slug)}
      />
      <CitationsPanel
        reportId={report.id}
        citations={report.citations.map(({ unit: _unit, runId: _runId, finishedAt: _finishedAt, ...citation }) => citation)}
        citable={citable.map((row) => ({
          analysisId: row.analysisId,
          description: `${row.testedOn} · ${row.toolName} · ${kindWords[row.captureKind]} ${row.captureFileName} · analysed ${row.finishedAt?.toISOString().slice(0, 16).replace("T", " ") ?? ""}${
            row.analysisVersion ? ` (code ${row.analysisVersion})` : ""
          }`,
        }))}
      />
      <ImagesPanel reportId={report.id} images={report.images} />
      <SubmitPanel reportId={report.id} />
    </div>
  );
}
