import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { reportRevisions, reports, reportTools, type ReportStatus, type RevisionKind, type RevisionStatus } from "@/db/schema";
import { frozenContent, frozenTool } from "./frozen-content";

// Reports written straight to the database in a chosen editorial state, each revision with its own title and body,
// for tests of what the catalogue and the search read (the desk's flows that make them are tested on their own).

export type FixtureTool = { id: string; slug: string; name: string };

export type FixtureRevision = {
  number: number;
  status: RevisionStatus;
  kind?: RevisionKind;
  title: string;
  bodyMdx: string;
  publishedAt?: Date;
};

/** A made-up word no seeded text contains, so a search for it finds only what a test wrote. */
export function uniqueWord(): string {
  return `qz${randomUUID().replace(/[^a-f]/g, "").slice(0, 8)}`;
}

export async function insertReport({
  authorId,
  status,
  tools,
  revisions,
  current,
  workingBody = "",
}: {
  authorId: string;
  status: ReportStatus;
  tools: FixtureTool[];
  revisions: FixtureRevision[];
  /** The revision readers see, by number; null when none is published. */
  current: number | null;
  /** The report's own (working) body, which readers never see. */
  workingBody?: string;
}): Promise<{ id: string; slug: string }> {
  const slug = `search-${status}-${randomUUID().slice(0, 8)}`;
  const [report] = await db
    .insert(reports)
    .values({
      slug,
      title: revisions[0]?.title ?? slug,
      authorId,
      status,
      bodyMdx: workingBody,
      retractedAt: status === "retracted" ? new Date() : null,
      retractionReason: status === "retracted" ? "The clamp's scale was set wrong." : null,
    })
    .returning({ id: reports.id });
  const reportId = report!.id;
  if (tools.length) await db.insert(reportTools).values(tools.map((tool, position) => ({ reportId, toolId: tool.id, position })));
  const frozenTools = tools.map((tool) => frozenTool({ id: tool.id, slug: tool.slug, name: tool.name }));
  const inserted = revisions.length
    ? await db
        .insert(reportRevisions)
        .values(
          revisions.map((revision) => ({
            reportId,
            number: revision.number,
            kind: revision.kind ?? (revision.number === 1 ? ("original" as const) : ("correction" as const)),
            status: revision.status,
            changeNote: revision.number === 1 ? "First publication." : `Revision ${revision.number}.`,
            bodyMdx: revision.bodyMdx,
            content: frozenContent({ title: revision.title, tools: frozenTools, author: { id: authorId, name: "Fixture Reviewer" } }),
            publishedAt: revision.status === "published" ? (revision.publishedAt ?? new Date()) : null,
          })),
        )
        .returning({ id: reportRevisions.id, number: reportRevisions.number })
    : [];
  const currentId = inserted.find((row) => row.number === current)?.id ?? null;
  if (currentId) await db.update(reports).set({ publishedRevisionId: currentId, firstPublishedAt: new Date() }).where(eq(reports.id, reportId));
  return { id: reportId, slug };
}
