import { and, desc, eq } from "drizzle-orm";
import type { Transaction } from "@/db";
import { analyses, captures, labs, makers, reportAnalyses, reports, reportTools, testRuns, tools, users, type TestedUnit } from "@/db/schema";
import { suggestDisclosure } from "@/lib/report-submission";
import { demoReportDrafts } from "./reports-data";

type Cited = { label: string; analysisId: string; kind: "waveform" | "heat_up_log" };

// The body uses every embed its citations can feed, so the demo shows each of them.
function draftBody(toolName: string, cited: Cited[]): string {
  const waveform = cited.find((citation) => citation.kind === "waveform");
  const heatUp = cited.find((citation) => citation.kind === "heat_up_log");
  const sections = [
    `## What we measured\n\nThe ${toolName} ran at full demand on the bench supply while a clamp and an isolated probe recorded its current and voltage.`,
    "<SafetyNotice />",
  ];
  if (waveform) {
    sections.push(
      `## Power input against the rating\n\n<VerdictTable analysis="${waveform.label}" />`,
      `## Current and voltage\n\n<WaveformChart analysis="${waveform.label}" />`,
      `## How the controller switches\n\nThe heater is switched in whole cycles; the strip shows which half-cycles conduct.\n\n<ConductionMap analysis="${waveform.label}" />`,
      `## Harmonics\n\n<HarmonicChart analysis="${waveform.label}" />`,
    );
  }
  if (heatUp) sections.push(`## Heat-up\n\n<HeatUpCurve analysis="${heatUp.label}" />\n\n<VerdictTable analysis="${heatUp.label}" />`);
  sections.push("## Rated against measured\n\n<SpecTable />");
  if (!waveform && !heatUp) sections.push("*No analysis is cited yet: cite one under “Cited analyses” and embed it here.*");
  return `${sections.join("\n\n")}\n`;
}

/**
 * A draft per lab by its reviewer, on the tool of their latest run, citing that run's finished analyses. Upserts by
 * fixed id; citations are rebuilt each time, so they follow the runs the bench seeder made.
 */
export async function seedReports(tx: Transaction) {
  const summaries: string[] = [];
  for (const draft of demoReportDrafts) {
    const [author] = await tx.select({ id: users.id }).from(users).where(eq(users.email, draft.reviewerEmail));
    if (!author) throw new Error(`demo reviewer ${draft.reviewerEmail} missing: run the people seeder first`);
    const [run] = await tx
      .select({ id: testRuns.id, toolId: testRuns.toolId, unit: testRuns.unit, toolName: makers.name, model: tools.model })
      .from(testRuns)
      .innerJoin(labs, eq(labs.id, testRuns.labId))
      .innerJoin(tools, eq(tools.id, testRuns.toolId))
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .where(and(eq(labs.slug, draft.labSlug), eq(testRuns.reviewerId, author.id)))
      .orderBy(desc(testRuns.testedOn), desc(testRuns.createdAt))
      .limit(1);
    const fallbackTool = run ? null : (await tx.select({ id: tools.id }).from(tools).orderBy(tools.slug).limit(1))[0];
    const toolId = run?.toolId ?? fallbackTool?.id;
    if (!toolId) throw new Error("no tools to write about: run the catalogue seeder first");
    const toolName = run ? `${run.toolName} ${run.model}` : "tool";

    const done = run
      ? await tx
          .select({ id: analyses.id, kind: captures.kind })
          .from(analyses)
          .innerJoin(captures, eq(captures.id, analyses.captureId))
          .where(and(eq(captures.runId, run.id), eq(analyses.status, "done")))
          .orderBy(desc(analyses.finishedAt))
      : [];
    const cited: Cited[] = [];
    for (const kind of ["waveform", "heat_up_log"] as const) {
      const latest = done.find((analysis) => analysis.kind === kind);
      if (latest) cited.push({ label: kind === "waveform" ? "full-power" : "heat-up", analysisId: latest.id, kind });
    }

    const fields = {
      slug: draft.slug,
      title: draft.title,
      authorId: author.id,
      status: "draft" as const,
      submittedAt: null,
      bodyMdx: draftBody(toolName, cited),
      disclosure: run ? suggestDisclosure([{ toolName, unit: run.unit as TestedUnit }]) : "",
    };
    await tx.insert(reports).values({ id: draft.id, ...fields }).onConflictDoUpdate({ target: reports.id, set: fields });
    await tx.delete(reportTools).where(eq(reportTools.reportId, draft.id));
    await tx.insert(reportTools).values({ reportId: draft.id, toolId, position: 0 });
    await tx.delete(reportAnalyses).where(eq(reportAnalyses.reportId, draft.id));
    if (cited.length) {
      await tx.insert(reportAnalyses).values(cited.map(({ label, analysisId }) => ({ reportId: draft.id, analysisId, label })));
    }
    summaries.push(`${draft.labSlug} citing ${cited.length} analyses${run ? "" : " (no runs seeded yet)"}`);
  }
  return summaries.join(", ");
}
