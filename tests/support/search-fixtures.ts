import { randomUUID } from "node:crypto";
import type { ReportStatus, RevisionKind, RevisionStatus } from "@/db/schema";
import { frozenContent, frozenTool } from "./frozen-content";
import { insertReportWithRevisions } from "./published-fixtures";

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

export function insertReport({
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
  const frozenTools = tools.map((tool) => frozenTool({ id: tool.id, slug: tool.slug, name: tool.name }));
  const titleOf = (number: number) => revisions.find((revision) => revision.number === number)?.title ?? "";
  return insertReportWithRevisions({
    toolIds: tools.map((tool) => tool.id),
    authorId,
    status,
    // Published now unless a test dates them: the catalogue's "newest result" reads these times.
    revisions: revisions.map(({ title: _title, ...revision }) => ({ ...revision, publishedAt: revision.publishedAt ?? new Date() })),
    current,
    contentOf: (number) => frozenContent({ title: titleOf(number), tools: frozenTools, author: { id: authorId, name: "Fixture Reviewer" } }),
    title: revisions[0]?.title,
    workingBody,
    firstPublishedAt: new Date(),
  });
}
