import "server-only";
import { db, type Transaction } from "@/db";
import {
  deleteScheduledOriginal,
  findOpenRevision,
  getAccountAddress,
  getReportText,
  insertDecision,
  insertMakerReply,
  insertRevision,
  listEditors,
  listRunContexts,
  lockDueScheduledRevisions,
  lockPublishedReportForRevision,
  lockReportForDecision,
  nextRevisionNumber,
  setPublishedRevision,
  setReportRetracted,
  setReportStatus,
  updateOpenRevision,
  updateWorkingCopy,
  type LockedReport,
} from "@/db/queries/editorial";
import {
  findCitableAnalysis,
  listReportReferenceNames,
  listReportToolIds,
  loadReportEmbedSources,
  upsertCitation,
} from "@/db/queries/reports";
import type { Viewer } from "@/db/queries/runs";
import type { DecisionKind, FrozenReportContent, RevisionKind } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { can } from "@/lib/authz";
import { decisionMail, submissionMail } from "@/lib/editorial-mail";
import { serverEnv } from "@/lib/env";
import { UserFacingError } from "@/lib/errors";
import { compileForStorage } from "@/lib/mdx/stored";
import { enqueueMail } from "@/lib/outbox";
import { submissionProblems } from "@/lib/report-submission";

// The desk's flows. Each runs inside the caller's transaction: the state change, its decision row, its audit entry and
// its e-mails commit together or not at all.

/** The cache tag of everything readers see of one report. */
export function reportCacheTag(slug: string): string {
  return `report:${slug}`;
}

/** The cache tag of every list drawn from all published reports: the home page, the Atom feed, the sitemap. */
export const publishedReportsCacheTag = "published-reports";

/**
 * How long those lists may be served from the cache at most. The desk's actions clear the tag at once, but the worker
 * makes scheduled revisions live from another process, which cannot reach this cache.
 */
export const publishedListsMaxAgeSeconds = 60;

/**
 * The report as it stands, frozen: its text, and every figure its body can show read from the cited analyses, their
 * measurements and the tools' ratings at this moment, with the runs' protocol, conditions and instruments.
 */
export async function freezeReport(tx: Transaction, { reportId }: { reportId: string }): Promise<{ bodyMdx: string; content: FrozenReportContent }> {
  const [text, sources] = await Promise.all([getReportText(tx, { reportId }), loadReportEmbedSources(tx, { reportId })]);
  const runs = await listRunContexts(tx, { runIds: [...new Set(sources.analyses.map((analysis) => analysis.runId))] });
  return {
    bodyMdx: text.bodyMdx,
    content: { ...sources, title: text.title, disclosure: text.disclosure, author: { id: text.authorId, name: text.authorName }, runs },
  };
}

async function lockOrRefuse(tx: Transaction, reportId: string) {
  const report = await lockReportForDecision(tx, { id: reportId });
  if (!report) throw new UserFacingError("That report no longer exists.", 404);
  return report;
}

/**
 * Approves what waits on the desk (a submitted report, or a proposed revision of a published one), publishing it now
 * or at `publishAt`. The body is compiled here, once, and kept with the frozen figures; the scheduled job only flips
 * the revision live.
 */
export async function approveReport(
  tx: Transaction,
  { reportId, editorId, notes, publishAt }: { reportId: string; editorId: string; notes: string; publishAt: Date | null },
) {
  const report = await lockOrRefuse(tx, reportId);
  const open = await findOpenRevision(tx, { reportId });
  if (open?.status === "scheduled") {
    throw new UserFacingError(`Revision ${open.number} is already scheduled; send it back first to change the decision.`, 409);
  }
  if (report.status !== "submitted" && !(report.status === "published" && open)) {
    throw new UserFacingError("Nothing on this report waits for a decision.", 409);
  }
  const { bodyMdx, content } = await freezeReport(tx, { reportId });
  const { stored, problems } = compileForStorage(bodyMdx);
  if (!stored) throw new UserFacingError(`The body no longer compiles: ${problems[0]?.message ?? "unknown problem"}. Send it back.`, 409);

  const now = new Date();
  const values = {
    content,
    bodyMdx,
    compiledMdx: stored,
    status: publishAt ? ("scheduled" as const) : ("published" as const),
    scheduledFor: publishAt,
    publishedAt: publishAt ? null : now,
    approvedById: editorId,
  };
  let revision: { id: string; number: number; kind: RevisionKind };
  if (open) {
    await updateOpenRevision(tx, { id: open.id, values });
    revision = open;
  } else {
    const number = await nextRevisionNumber(tx, { reportId });
    const inserted = await insertRevision(tx, { reportId, number, kind: "original", changeNote: "First publication.", proposedById: report.authorId, ...values });
    revision = { ...inserted, kind: "original" };
  }
  if (!publishAt) await setPublishedRevision(tx, { reportId, revisionId: revision.id, at: now });
  const decision: DecisionKind = publishAt ? "schedule" : "approve";
  const { id: decisionId } = await insertDecision(tx, { reportId, revisionId: revision.id, editorId, decision, notes });
  await recordAudit(tx, {
    actorId: editorId,
    action: publishAt ? "report.scheduled" : "report.published",
    subjectType: "report",
    subjectId: reportId,
    details: { revision: revision.number, kind: revision.kind, ...(publishAt ? { publishAt: publishAt.toISOString() } : {}) },
  });
  await queueDecisionMail(tx, { decisionId, report, decision, notes, revisionNumber: revision.number, publishAt });
  return { slug: report.slug, revisionNumber: revision.number };
}

/**
 * Sends back what waits on the desk: a submitted report returns to its reviewer as "changes requested"; a proposed
 * revision is declined and the published version stays. A scheduled decision can be taken back the same way.
 */
export async function sendBackReport(tx: Transaction, { reportId, editorId, notes }: { reportId: string; editorId: string; notes: string }) {
  const report = await lockOrRefuse(tx, reportId);
  const open = await findOpenRevision(tx, { reportId });
  let decision: DecisionKind;
  if (report.status === "submitted") {
    if (open) await deleteScheduledOriginal(tx, { id: open.id });
    await setReportStatus(tx, { id: reportId, status: "changes_requested" });
    decision = "send_back";
  } else if (report.status === "published" && open) {
    await updateOpenRevision(tx, { id: open.id, values: { status: "rejected" } });
    decision = "reject_revision";
  } else {
    throw new UserFacingError("Nothing on this report waits for a decision.", 409);
  }
  const revisionId = report.status === "published" ? (open?.id ?? null) : null;
  const { id: decisionId } = await insertDecision(tx, { reportId, revisionId, editorId, decision, notes });
  await recordAudit(tx, {
    actorId: editorId,
    action: "report.sent_back",
    subjectType: "report",
    subjectId: reportId,
    details: { ...(open ? { revision: open.number } : {}), notes },
  });
  await queueDecisionMail(tx, { decisionId, report, decision, notes, revisionNumber: revisionId ? (open?.number ?? null) : null, publishAt: null });
}

/** A retraction keeps the page readable with its reason; whatever revision waited is declined with it. */
export async function retractReport(tx: Transaction, { reportId, editorId, reason }: { reportId: string; editorId: string; reason: string }) {
  const report = await lockOrRefuse(tx, reportId);
  if (report.status !== "published") throw new UserFacingError("Only a published report can be retracted.", 409);
  const open = await findOpenRevision(tx, { reportId });
  if (open) await updateOpenRevision(tx, { id: open.id, values: { status: "rejected" } });
  await setReportRetracted(tx, { id: reportId, reason, at: new Date() });
  const { id: decisionId } = await insertDecision(tx, { reportId, revisionId: null, editorId, decision: "retract", notes: reason });
  await recordAudit(tx, { actorId: editorId, action: "report.retracted", subjectType: "report", subjectId: reportId, details: { reason } });
  await queueDecisionMail(tx, { decisionId, report, decision: "retract", notes: reason, revisionNumber: null, publishAt: null });
  return { slug: report.slug };
}

export async function attachMakerReply(
  tx: Transaction,
  { reportId, editorId, makerName, receivedOn, body }: { reportId: string; editorId: string; makerName: string; receivedOn: string; body: string },
) {
  const report = await lockOrRefuse(tx, reportId);
  if (report.status !== "published" && report.status !== "retracted") throw new UserFacingError("A maker's reply goes on a published report.", 409);
  const { id } = await insertMakerReply(tx, { reportId, makerName, receivedOn, body, attachedById: editorId });
  await recordAudit(tx, { actorId: editorId, action: "report.maker_reply_attached", subjectType: "report", subjectId: reportId, details: { makerName, receivedOn } });
  return { id, slug: report.slug };
}

/**
 * A revision of a published report, proposed by its author or an editor: the report's working copy takes the new text
 * and citations (readers still see the published revision), and a pending revision goes to the desk.
 */
export async function proposeRevision(
  tx: Transaction,
  {
    viewer,
    reportId,
    kind,
    changeNote,
    title,
    disclosure,
    bodyMdx,
    citations,
  }: {
    viewer: Viewer;
    reportId: string;
    kind: Exclude<RevisionKind, "original">;
    changeNote: string;
    title: string;
    disclosure: string;
    bodyMdx: string;
    citations: { label: string; analysisId: string }[];
  },
) {
  const report = await lockPublishedReportForRevision(tx, { id: reportId, authorId: can(viewer.role, "workspace:edit-any") ? null : viewer.id });
  if (!report) throw new UserFacingError("Only the author or an editor can revise this report, and only while it is published.", 404);
  const open = await findOpenRevision(tx, { reportId });
  if (open) throw new UserFacingError(`Revision ${open.number} already waits for the desk; wait for its decision.`, 409);

  const toolIds = await listReportToolIds(tx, { reportId });
  const known = await listReportReferenceNames(tx, { reportId });
  for (const [index, citation] of citations.entries()) {
    if (!known.analysisLabels.includes(citation.label)) {
      throw new UserFacingError("Some fields need attention.", 422, { [`citations.${index}.analysisId`]: [`This report cites nothing labelled “${citation.label}”.`] });
    }
    if (!(await findCitableAnalysis(tx, { analysisId: citation.analysisId, authorId: report.authorId, toolIds }))) {
      throw new UserFacingError("Some fields need attention.", 422, {
        [`citations.${index}.analysisId`]: ["Choose a finished analysis of a run by the report's author on one of its tools."],
      });
    }
    await upsertCitation(tx, { reportId, analysisId: citation.analysisId, label: citation.label });
  }
  const problems = submissionProblems({ bodyMdx, known: await listReportReferenceNames(tx, { reportId }), imagesWithoutAltText: [] });
  if (problems.length) throw new UserFacingError("The revision cannot go to the desk yet: fix these first.", 422, { submission: problems });
  await updateWorkingCopy(tx, { id: reportId, fields: { title, disclosure, bodyMdx } });

  const frozen = await freezeReport(tx, { reportId });
  const number = await nextRevisionNumber(tx, { reportId });
  const revision = await insertRevision(tx, { reportId, number, kind, status: "pending", changeNote, proposedById: viewer.id, ...frozen });
  await recordAudit(tx, {
    actorId: viewer.id,
    action: "report.revision_proposed",
    subjectType: "report",
    subjectId: reportId,
    details: { revision: number, kind, changeNote },
  });
  await queueSubmissionMail(tx, { reportId, revision: { id: revision.id, number, kind, changeNote } });
  return { number };
}

/** Publishes every scheduled revision whose time has come; the worker calls this every minute. */
export async function publishDueRevisions({ now = new Date() }: { now?: Date } = {}) {
  return db.transaction(async (tx) => {
    const due = await lockDueScheduledRevisions(tx, { now });
    for (const revision of due) {
      await updateOpenRevision(tx, { id: revision.id, values: { status: "published", publishedAt: now } });
      await setPublishedRevision(tx, { reportId: revision.reportId, revisionId: revision.id, at: now });
      await recordAudit(tx, {
        actorId: null,
        action: "report.published",
        subjectType: "report",
        subjectId: revision.reportId,
        details: { revision: revision.number, kind: revision.kind, scheduled: true },
      });
    }
    return due.map((revision) => revision.slug);
  });
}

/**
 * Tells every editor that something waits on the desk: a submission (keyed by its submission time, so a resubmission
 * after a send-back is news again) or a proposed revision.
 */
export async function queueSubmissionMail(
  tx: Transaction,
  { reportId, revision = null }: { reportId: string; revision?: { id: string; number: number; kind: RevisionKind; changeNote: string } | null },
) {
  const [report, text, editors] = await Promise.all([lockOrRefuse(tx, reportId), getReportText(tx, { reportId }), listEditors(tx)]);
  const event = revision ? `revision:${revision.id}` : `report:${reportId}:${report.submittedAt?.getTime() ?? 0}`;
  for (const editor of editors) {
    const mail = submissionMail({ origin: serverEnv().APP_ORIGIN, editorName: editor.name, reportId, title: text.title, authorName: text.authorName, revision });
    await enqueueMail(tx, { dedupeKey: `submission:${event}:${editor.id}`, topic: "submission", recipientId: editor.id, toAddress: editor.email, ...mail });
  }
}

async function queueDecisionMail(
  tx: Transaction,
  {
    decisionId,
    report,
    decision,
    notes,
    revisionNumber,
    publishAt,
  }: { decisionId: string; report: LockedReport; decision: DecisionKind; notes: string; revisionNumber: number | null; publishAt: Date | null },
) {
  const author = await getAccountAddress(tx, { id: report.authorId });
  if (!author) return;
  const mail = decisionMail({
    origin: serverEnv().APP_ORIGIN,
    authorName: author.name,
    reportId: report.id,
    slug: report.slug,
    title: report.title,
    decision,
    notes,
    revisionNumber,
    publishAt,
  });
  await enqueueMail(tx, { dedupeKey: `decision:${decisionId}`, topic: "decision", recipientId: author.id, toAddress: author.email, ...mail });
}
