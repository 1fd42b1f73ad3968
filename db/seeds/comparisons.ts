import { eq } from "drizzle-orm";
import type { Transaction } from "@/db";
import { toolName } from "@/db/queries/catalogue";
import { listReportReferenceNames, markReportSubmitted, replaceReportTools, upsertCitation } from "@/db/queries/reports";
import { makers, reports, testRuns, tools, users, type TestedUnit } from "@/db/schema";
import { approveReport, queueSubmissionMail } from "@/lib/editorial";
import { submissionProblems, suggestDisclosure } from "@/lib/report-submission";
import { seedRun } from "./bench-runs";
import { comparisonPublication, comparisonRun } from "./comparisons-data";
import { demoEditorEmail } from "./editorial-data";

/**
 * The run behind the equal-terms comparison, and its report written, submitted and approved through the workspace's
 * and the desk's own steps. A report that exists is left as it is; without object storage the run has no analyses to
 * cite, and the report waits for a seed with the fakes running.
 */
export async function seedComparisons(tx: Transaction) {
  const storageReachable = { value: true };
  const seeded = await seedRun(tx, comparisonRun, new Date(), storageReachable);
  const runSummary = `1 run, ${seeded.readingsAdded} readings added, ${seeded.analysed} captures analysed`;

  const [existing] = await tx.select({ id: reports.id }).from(reports).where(eq(reports.id, comparisonPublication.id));
  if (existing) return `${runSummary}; report already there`;
  if (!storageReachable.value) return `${runSummary}; report not written (object storage not reachable)`;

  const [[author], [editor], [run]] = await Promise.all([
    tx.select({ id: users.id }).from(users).where(eq(users.email, comparisonRun.reviewerEmail)),
    tx.select({ id: users.id }).from(users).where(eq(users.email, demoEditorEmail)),
    tx
      .select({ toolId: testRuns.toolId, unit: testRuns.unit, toolName })
      .from(testRuns)
      .innerJoin(tools, eq(tools.id, testRuns.toolId))
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .where(eq(testRuns.id, comparisonRun.id)),
  ]);
  if (!author || !editor || !run) throw new Error("demo reviewer, editor or run missing: run the earlier seeders first");

  const { labels, body } = comparisonPublication;
  await tx.insert(reports).values({
    id: comparisonPublication.id,
    slug: comparisonPublication.slug,
    title: comparisonPublication.title,
    authorId: author.id,
    bodyMdx: body(labels),
    disclosure: suggestDisclosure([{ toolName: run.toolName, unit: run.unit as TestedUnit }]),
  });
  await replaceReportTools(tx, { reportId: comparisonPublication.id, toolIds: [run.toolId] });
  const [waveform, heatUp] = comparisonRun.captures;
  if (!waveform || !heatUp) throw new Error("the comparison run needs a waveform and a heat-up capture");
  await upsertCitation(tx, { reportId: comparisonPublication.id, analysisId: waveform.analysisId, label: labels.waveform });
  await upsertCitation(tx, { reportId: comparisonPublication.id, analysisId: heatUp.analysisId, label: labels.heatUp });

  const problems = submissionProblems({ bodyMdx: body(labels), known: await listReportReferenceNames(tx, { reportId: comparisonPublication.id }), imagesWithoutAltText: [] });
  if (problems.length) throw new Error(`comparison report would not be submitted: ${problems.join("; ")}`);
  await markReportSubmitted(tx, { id: comparisonPublication.id });
  await queueSubmissionMail(tx, { reportId: comparisonPublication.id });
  await approveReport(tx, { reportId: comparisonPublication.id, editorId: editor.id, notes: "", publishAt: null });
  return `${runSummary}; published ${comparisonPublication.slug}`;
}
