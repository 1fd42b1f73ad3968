import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { reportRevisions, reports, reportTools, type FrozenReportContent, type ReportStatus, type RevisionKind, type RevisionStatus } from "@/db/schema";
import { compileForStorage } from "@/lib/mdx/stored";
import { createAccount } from "./factories";
import { createTool } from "./report-fixtures";

// Reports in a given editorial state written straight to the database with frozen content from tests/support/
// frozen-content, for tests of what readers see (the desk's flows that make them are tested on their own).

export const fixtureRetractionReason = "The clamp's scale was set wrong.";

const fixtureBody = "## In short\n\nMeasured on the bench.\n\n<SpecTable />\n";

/**
 * A report on the given tools with the given revisions, `current` being the number readers see (null: none yet).
 * Each revision's content comes from `contentOf`, so revisions can differ in their figures; a revision's body and
 * publication time default to a fixed text and to 09:00 on the revision's number as a day of December 2026.
 */
export async function insertReportWithRevisions({
  toolIds,
  authorId,
  status,
  revisions,
  current,
  contentOf,
  title,
  workingBody = "",
  firstPublishedAt = new Date(Date.UTC(2026, 11, 1, 9)),
}: {
  toolIds: string[];
  authorId: string;
  status: ReportStatus;
  revisions: { number: number; status: RevisionStatus; kind?: RevisionKind; bodyMdx?: string; publishedAt?: Date }[];
  current: number | null;
  contentOf: (number: number) => FrozenReportContent;
  /** The report's own (working) title and body, which readers never see. */
  title?: string;
  workingBody?: string;
  firstPublishedAt?: Date;
}): Promise<{ id: string; slug: string }> {
  const slug = `${status}-${randomUUID().slice(0, 8)}`;
  const [report] = await db
    .insert(reports)
    .values({
      slug,
      title: title ?? slug,
      authorId,
      status,
      bodyMdx: workingBody,
      retractionReason: status === "retracted" ? fixtureRetractionReason : null,
      retractedAt: status === "retracted" ? new Date() : null,
    })
    .returning({ id: reports.id });
  const reportId = report!.id;
  if (toolIds.length) await db.insert(reportTools).values(toolIds.map((toolId, position) => ({ reportId, toolId, position })));
  if (revisions.length === 0) return { id: reportId, slug };
  const inserted = await db
    .insert(reportRevisions)
    .values(
      revisions.map((revision) => {
        const bodyMdx = revision.bodyMdx ?? fixtureBody;
        return {
          reportId,
          number: revision.number,
          kind: revision.kind ?? (revision.number === 1 ? ("original" as const) : ("correction" as const)),
          status: revision.status,
          changeNote: revision.number === 1 ? "First publication." : `Correction ${revision.number}.`,
          bodyMdx,
          compiledMdx: compileForStorage(bodyMdx).stored,
          content: contentOf(revision.number),
          publishedAt: revision.status === "published" ? (revision.publishedAt ?? new Date(Date.UTC(2026, 11, revision.number, 9))) : null,
        };
      }),
    )
    .returning({ id: reportRevisions.id, number: reportRevisions.number });
  const currentId = inserted.find((row) => row.number === current)?.id ?? null;
  await db
    .update(reports)
    .set({ publishedRevisionId: currentId, firstPublishedAt: currentId ? firstPublishedAt : null })
    .where(eq(reports.id, reportId));
  return { id: reportId, slug };
}

export type FixtureTool = Awaited<ReturnType<typeof createTool>>;

/**
 * A new tool with a report readers see in its second revision (a third still waiting on the desk) and a retracted
 * one. `contentOf` gives each revision's frozen content.
 */
export async function createToolWithPublishedReports({
  contentOf,
}: {
  contentOf: (tool: FixtureTool, report: "corrected" | "retracted", revision: number) => FrozenReportContent;
}): Promise<{ tool: FixtureTool; authorId: string; corrected: string; retracted: string }> {
  const [tool, author] = await Promise.all([createTool(), createAccount({ role: "reviewer" })]);
  const corrected = await insertReportWithRevisions({
    toolIds: [tool.id],
    authorId: author.id,
    status: "published",
    revisions: [
      { number: 1, status: "published" },
      { number: 2, status: "published" },
      { number: 3, status: "pending" },
    ],
    current: 2,
    contentOf: (number) => contentOf(tool, "corrected", number),
  });
  const retracted = await insertReportWithRevisions({
    toolIds: [tool.id],
    authorId: author.id,
    status: "retracted",
    revisions: [{ number: 1, status: "published" }],
    current: 1,
    contentOf: (number) => contentOf(tool, "retracted", number),
  });
  return { tool, authorId: author.id, corrected: corrected.slug, retracted: retracted.slug };
}
