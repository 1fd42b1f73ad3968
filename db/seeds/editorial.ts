import { and, eq, inArray } from "drizzle-orm";
import type { Transaction } from "@/db";
import { analyses, captures, comments, makerReplies, reportAnalyses, reports, reportTools, users } from "@/db/schema";
import { approveReport, attachMakerReply, proposeRevision, queueSubmissionMail, sendBackReport } from "@/lib/editorial";
import { demoComments, demoCorrection, demoEditorEmail, demoMakerReply, demoPublications, demoSendBackNotes, type DemoPublication } from "./editorial-data";

async function userIdsByEmail(tx: Transaction, emails: readonly string[]) {
  const rows = await tx.select({ id: users.id, email: users.email, role: users.role }).from(users).where(inArray(users.email, [...emails]));
  return new Map(rows.map((row) => [row.email, row]));
}

/** A new report with the draft's tools and citations, written and submitted; null when the draft cites nothing yet. */
async function submitFromDraft(tx: Transaction, publication: DemoPublication, authorId: string, submittedAt: Date) {
  const [toolRows, cited] = await Promise.all([
    tx.select({ toolId: reportTools.toolId, position: reportTools.position }).from(reportTools).where(eq(reportTools.reportId, publication.draftId)),
    tx
      .select({ analysisId: reportAnalyses.analysisId, label: reportAnalyses.label, kind: captures.kind })
      .from(reportAnalyses)
      .innerJoin(analyses, eq(analyses.id, reportAnalyses.analysisId))
      .innerJoin(captures, eq(captures.id, analyses.captureId))
      .where(and(eq(reportAnalyses.reportId, publication.draftId), eq(analyses.status, "done"))),
  ]);
  if (cited.length === 0 || toolRows.length === 0) return false;
  const labels = {
    waveform: cited.find((citation) => citation.kind === "waveform")?.label ?? null,
    heatUp: cited.find((citation) => citation.kind === "heat_up_log")?.label ?? null,
  };
  const [draft] = await tx.select({ disclosure: reports.disclosure }).from(reports).where(eq(reports.id, publication.draftId));
  const first = publication.id === demoCorrection.reportId ? demoCorrection.firstClaim : "";
  await tx.insert(reports).values({
    id: publication.id,
    slug: publication.slug,
    title: publication.title,
    authorId,
    status: "submitted",
    submittedAt,
    bodyMdx: `${publication.body(labels)}${first}`,
    disclosure: draft?.disclosure ?? "",
  });
  await tx.insert(reportTools).values(toolRows.map((row) => ({ reportId: publication.id, ...row })));
  await tx.insert(reportAnalyses).values(cited.map(({ analysisId, label }) => ({ reportId: publication.id, analysisId, label })));
  return true;
}

/**
 * Published reports made through the desk's own flows (so their frozen content and compiled bodies are real): one per
 * lab, one sent back once before publication, the Wrenford one corrected in a second revision, one left waiting on the
 * desk, a maker's reply, and comments in every state with the author's reply. A report that exists is left as it is.
 */
export async function seedEditorial(tx: Transaction) {
  const people = await userIdsByEmail(tx, [demoEditorEmail, ...demoPublications.map((publication) => publication.reviewerEmail), ...demoComments.map((comment) => comment.authorEmail)]);
  const editor = people.get(demoEditorEmail);
  if (!editor) throw new Error(`demo editor ${demoEditorEmail} missing: run the people seeder first`);
  const existing = new Set(
    (await tx.select({ id: reports.id }).from(reports).where(inArray(reports.id, demoPublications.map((publication) => publication.id)))).map((row) => row.id),
  );
  const day = 24 * 3600_000;
  const made: string[] = [];
  for (const publication of demoPublications) {
    if (existing.has(publication.id)) continue;
    const author = people.get(publication.reviewerEmail);
    if (!author) throw new Error(`demo reviewer ${publication.reviewerEmail} missing`);
    if (!(await submitFromDraft(tx, publication, author.id, new Date(Date.now() - 3 * day)))) continue;
    if (publication.path === "submitted") {
      await queueSubmissionMail(tx, { reportId: publication.id });
    } else {
      if (publication.path === "sent-back-then-published") {
        await sendBackReport(tx, { reportId: publication.id, editorId: editor.id, notes: demoSendBackNotes });
        await tx.update(reports).set({ status: "submitted", submittedAt: new Date(Date.now() - 2 * day) }).where(eq(reports.id, publication.id));
      }
      await approveReport(tx, { reportId: publication.id, editorId: editor.id, notes: "", publishAt: null });
    }
    if (publication.id === demoCorrection.reportId) {
      const [current] = await tx.select({ bodyMdx: reports.bodyMdx, title: reports.title, disclosure: reports.disclosure }).from(reports).where(eq(reports.id, publication.id));
      await proposeRevision(tx, {
        viewer: { id: author.id, role: author.role },
        reportId: publication.id,
        kind: "correction",
        changeNote: demoCorrection.changeNote,
        title: current!.title,
        disclosure: current!.disclosure,
        bodyMdx: current!.bodyMdx.replace(demoCorrection.firstClaim, demoCorrection.correctedClaim),
        citations: [],
      });
      await approveReport(tx, { reportId: publication.id, editorId: editor.id, notes: "Thanks for catching it.", publishAt: null });
    }
    made.push(publication.slug);
  }

  const published = new Set(
    (await tx.select({ id: reports.id }).from(reports).where(and(inArray(reports.id, demoPublications.map((publication) => publication.id)), eq(reports.status, "published")))).map(
      (row) => row.id,
    ),
  );
  let replies = 0;
  if (published.has(demoMakerReply.reportId)) {
    const [reply] = await tx.select({ id: makerReplies.id }).from(makerReplies).where(eq(makerReplies.reportId, demoMakerReply.reportId));
    if (!reply) {
      await attachMakerReply(tx, { editorId: editor.id, ...demoMakerReply });
      replies++;
    }
  }
  let commentsAdded = 0;
  if (published.has(demoCorrection.reportId)) {
    const rows = demoComments.flatMap((comment) => {
      const author = people.get(comment.authorEmail);
      if (!author) return [];
      return [
        {
          id: comment.id,
          reportId: demoCorrection.reportId,
          authorId: author.id,
          parentId: "parentId" in comment ? comment.parentId : null,
          body: comment.body,
          status: comment.status,
          moderatedById: comment.status === "pending" ? null : editor.id,
          moderatedAt: comment.status === "pending" ? null : new Date(),
        },
      ];
    });
    const inserted = await tx.insert(comments).values(rows).onConflictDoNothing({ target: comments.id }).returning({ id: comments.id });
    commentsAdded = inserted.length;
  }
  return `${made.length} reports through the desk${made.length ? ` (${made.join(", ")})` : ""}, ${replies} maker's replies and ${commentsAdded} comments added`;
}
