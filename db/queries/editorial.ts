import "server-only";
import { toolName } from "@/db/queries/catalogue";
import { and, asc, desc, eq, inArray, lte, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import {
  editorialDecisions,
  labs,
  makerReplies,
  makers,
  protocols,
  protocolVersions,
  reportRevisions,
  reports,
  reportTools,
  runInstruments,
  testRuns,
  tools,
  users,
  type FrozenRun,
  type ReportStatus,
} from "@/db/schema";

// The editorial desk's reads and writes: the queue, decisions, revisions and what readers see of them.


/** Every tool a report covers, in order, as one line ("A vs B"). */
const reportToolNames = sql<string>`coalesce((select string_agg(${makers.name} || ' ' || ${tools.model}, ' vs ' order by ${reportTools.position})
  from ${reportTools} join ${tools} on ${tools.id} = ${reportTools.toolId} join ${makers} on ${makers.id} = ${tools.makerId}
  where ${reportTools.reportId} = ${reports.id}), '')`;

/** A revision the desk has not finished with: waiting for a decision, or approved for a later time. */
const openRevisionStatuses = ["pending", "scheduled"] as const;

/**
 * The desk's queue: reports submitted for review (first publication, or again after being sent back) and published
 * reports with a revision waiting or scheduled. Oldest first: whoever waited longest is served first.
 */
export async function listDeskQueue() {
  const rows = await db
    .select({
      id: reports.id,
      slug: reports.slug,
      title: reports.title,
      status: reports.status,
      submittedAt: reports.submittedAt,
      authorName: users.name,
      tools: reportToolNames,
      revisionId: reportRevisions.id,
      revisionNumber: reportRevisions.number,
      revisionKind: reportRevisions.kind,
      revisionStatus: reportRevisions.status,
      revisionCreatedAt: reportRevisions.createdAt,
      scheduledFor: reportRevisions.scheduledFor,
      changeNote: reportRevisions.changeNote,
    })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .leftJoin(reportRevisions, and(eq(reportRevisions.reportId, reports.id), inArray(reportRevisions.status, [...openRevisionStatuses])))
    .where(sql`${reports.status} = 'submitted' or (${reports.status} = 'published' and ${reportRevisions.id} is not null)`)
    .orderBy(asc(sql`coalesce(${reportRevisions.createdAt}, ${reports.submittedAt})`));
  return rows.map(({ revisionId, revisionNumber, revisionKind, revisionStatus, revisionCreatedAt, scheduledFor, changeNote, ...report }) => ({
    ...report,
    openRevision:
      revisionId === null
        ? null
        : { id: revisionId, number: revisionNumber!, kind: revisionKind!, status: revisionStatus!, createdAt: revisionCreatedAt!, scheduledFor, changeNote: changeNote! },
  }));
}

export type DeskQueueItem = Awaited<ReturnType<typeof listDeskQueue>>[number];

/** The report as the desk sees it, whatever its state; null when there is none. */
export async function getDeskReport({ id }: { id: string }) {
  const [report] = await db
    .select({
      id: reports.id,
      slug: reports.slug,
      title: reports.title,
      status: reports.status,
      bodyMdx: reports.bodyMdx,
      submittedAt: reports.submittedAt,
      firstPublishedAt: reports.firstPublishedAt,
      publishedRevisionId: reports.publishedRevisionId,
      retractedAt: reports.retractedAt,
      retractionReason: reports.retractionReason,
      authorId: reports.authorId,
      authorName: users.name,
      tools: reportToolNames,
    })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .where(eq(reports.id, id))
    .limit(1);
  return report ?? null;
}

export type DeskReport = NonNullable<Awaited<ReturnType<typeof getDeskReport>>>;

/** Every decision on a report, oldest first, with the editor's name (null once their account is gone). */
export async function listDecisions({ reportId }: { reportId: string }) {
  return db
    .select({
      id: editorialDecisions.id,
      decision: editorialDecisions.decision,
      notes: editorialDecisions.notes,
      createdAt: editorialDecisions.createdAt,
      editorName: users.name,
      revisionNumber: reportRevisions.number,
      scheduledFor: reportRevisions.scheduledFor,
    })
    .from(editorialDecisions)
    .leftJoin(users, eq(users.id, editorialDecisions.editorId))
    .leftJoin(reportRevisions, eq(reportRevisions.id, editorialDecisions.revisionId))
    .where(eq(editorialDecisions.reportId, reportId))
    .orderBy(asc(editorialDecisions.createdAt));
}

export type DecisionEntry = Awaited<ReturnType<typeof listDecisions>>[number];

/** Every revision of a report, whatever its state, for the desk. */
export async function listRevisionsForDesk({ reportId }: { reportId: string }) {
  return db
    .select({
      id: reportRevisions.id,
      number: reportRevisions.number,
      kind: reportRevisions.kind,
      status: reportRevisions.status,
      changeNote: reportRevisions.changeNote,
      scheduledFor: reportRevisions.scheduledFor,
      publishedAt: reportRevisions.publishedAt,
      createdAt: reportRevisions.createdAt,
      proposedByName: users.name,
    })
    .from(reportRevisions)
    .leftJoin(users, eq(users.id, reportRevisions.proposedById))
    .where(eq(reportRevisions.reportId, reportId))
    .orderBy(asc(reportRevisions.number));
}

/** Locks the report for a decision; the desk may act on any report, so only the id narrows it. */
export async function lockReportForDecision(tx: Transaction, { id }: { id: string }) {
  const [row] = await tx
    .select({
      id: reports.id,
      slug: reports.slug,
      title: reports.title,
      status: reports.status,
      authorId: reports.authorId,
      submittedAt: reports.submittedAt,
    })
    .from(reports)
    .where(eq(reports.id, id))
    .for("update");
  return row ?? null;
}

export type LockedReport = NonNullable<Awaited<ReturnType<typeof lockReportForDecision>>>;

export async function findOpenRevision(tx: Transaction, { reportId }: { reportId: string }) {
  const [row] = await tx
    .select({ id: reportRevisions.id, number: reportRevisions.number, kind: reportRevisions.kind, status: reportRevisions.status })
    .from(reportRevisions)
    .where(and(eq(reportRevisions.reportId, reportId), inArray(reportRevisions.status, [...openRevisionStatuses])))
    .for("update")
    .limit(1);
  return row ?? null;
}

export async function nextRevisionNumber(tx: Transaction, { reportId }: { reportId: string }) {
  const [row] = await tx
    .select({ value: sql<number>`coalesce(max(${reportRevisions.number}), 0)::int + 1` })
    .from(reportRevisions)
    .where(eq(reportRevisions.reportId, reportId));
  return row?.value ?? 1;
}

export async function insertRevision(tx: Transaction, values: typeof reportRevisions.$inferInsert) {
  const [row] = await tx.insert(reportRevisions).values(values).returning({ id: reportRevisions.id, number: reportRevisions.number });
  if (!row) throw new Error("revision not inserted");
  return row;
}

/** Only an open revision changes: a published or rejected one is history. */
export async function updateOpenRevision(
  tx: Transaction,
  { id, values }: { id: string; values: Partial<Pick<typeof reportRevisions.$inferInsert, "status" | "content" | "bodyMdx" | "compiledMdx" | "scheduledFor" | "publishedAt" | "approvedById">> },
) {
  await tx
    .update(reportRevisions)
    .set(values)
    .where(and(eq(reportRevisions.id, id), inArray(reportRevisions.status, [...openRevisionStatuses])));
}

/** A first publication the desk scheduled and then took back was never public: it leaves no revision behind. */
export async function deleteScheduledOriginal(tx: Transaction, { id }: { id: string }) {
  await tx.delete(reportRevisions).where(and(eq(reportRevisions.id, id), eq(reportRevisions.kind, "original"), eq(reportRevisions.status, "scheduled")));
}

/** Makes the revision the one readers see; the first publication also dates the report. */
export async function setPublishedRevision(tx: Transaction, { reportId, revisionId, at }: { reportId: string; revisionId: string; at: Date }) {
  await tx
    .update(reports)
    .set({ status: "published", publishedRevisionId: revisionId, firstPublishedAt: sql`coalesce(${reports.firstPublishedAt}, ${at.toISOString()}::timestamptz)` })
    .where(eq(reports.id, reportId));
}

export async function setReportStatus(tx: Transaction, { id, status }: { id: string; status: Extract<ReportStatus, "changes_requested"> }) {
  await tx.update(reports).set({ status }).where(eq(reports.id, id));
}

export async function setReportRetracted(tx: Transaction, { id, reason, at }: { id: string; reason: string; at: Date }) {
  await tx.update(reports).set({ status: "retracted", retractedAt: at, retractionReason: reason }).where(and(eq(reports.id, id), eq(reports.status, "published")));
}

export async function insertDecision(tx: Transaction, values: typeof editorialDecisions.$inferInsert) {
  const [row] = await tx.insert(editorialDecisions).values(values).returning({ id: editorialDecisions.id });
  if (!row) throw new Error("decision not inserted");
  return row;
}

export async function insertMakerReply(tx: Transaction, values: typeof makerReplies.$inferInsert) {
  const [row] = await tx.insert(makerReplies).values(values).returning({ id: makerReplies.id });
  if (!row) throw new Error("maker's reply not inserted");
  return row;
}

/** The report's text as it stands (the working copy a revision is made from) and its author's name. */
export async function getReportText(tx: Transaction, { reportId }: { reportId: string }) {
  const [row] = await tx
    .select({ title: reports.title, disclosure: reports.disclosure, bodyMdx: reports.bodyMdx, authorId: reports.authorId, authorName: users.name })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .where(eq(reports.id, reportId));
  if (!row) throw new Error(`report ${reportId} missing`);
  return row;
}

/** What the report page says about each cited run: protocol version, conditions, the unit and the instrument snapshots. */
export async function listRunContexts(tx: Transaction, { runIds }: { runIds: readonly string[] }): Promise<FrozenRun[]> {
  if (runIds.length === 0) return [];
  const [runs, instrumentRows] = await Promise.all([
    tx
      .select({
        id: testRuns.id,
        testedOn: testRuns.testedOn,
        labName: labs.name,
        toolName,
        protocolName: protocols.name,
        protocolVersion: protocolVersions.version,
        protocolSummary: protocolVersions.summary,
        safetyCautions: protocolVersions.safetyCautions,
        conditions: testRuns.conditions,
        unit: testRuns.unit,
      })
      .from(testRuns)
      .innerJoin(labs, eq(labs.id, testRuns.labId))
      .innerJoin(tools, eq(tools.id, testRuns.toolId))
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .innerJoin(protocolVersions, eq(protocolVersions.id, testRuns.protocolVersionId))
      .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
      .where(inArray(testRuns.id, [...runIds]))
      .orderBy(asc(testRuns.testedOn), asc(testRuns.id)),
    tx
      .select({ runId: runInstruments.runId, snapshot: runInstruments.snapshot })
      .from(runInstruments)
      .where(inArray(runInstruments.runId, [...runIds]))
      .orderBy(asc(runInstruments.createdAt), asc(runInstruments.instrumentId)),
  ]);
  return runs.map(({ protocolName, protocolVersion, protocolSummary, safetyCautions, ...run }) => ({
    ...run,
    protocol: { name: protocolName, version: protocolVersion, summary: protocolSummary, safetyCautions },
    instruments: instrumentRows.filter((row) => row.runId === run.id).map((row) => row.snapshot),
  }));
}

/** Revisions approved for a time that has come, locked so two workers never publish the same one. */
export async function lockDueScheduledRevisions(tx: Transaction, { now }: { now: Date }) {
  return tx
    .select({ id: reportRevisions.id, reportId: reportRevisions.reportId, number: reportRevisions.number, kind: reportRevisions.kind, slug: reports.slug })
    .from(reportRevisions)
    .innerJoin(reports, eq(reports.id, reportRevisions.reportId))
    .where(and(eq(reportRevisions.status, "scheduled"), lte(reportRevisions.scheduledFor, now)))
    .orderBy(asc(reportRevisions.scheduledFor))
    .for("update", { of: reportRevisions, skipLocked: true });
}

/** The working copy a revision is proposed on: only a published report, by its author or (with `anyAuthor`) anyone's. */
export async function lockPublishedReportForRevision(tx: Transaction, { id, authorId }: { id: string; authorId: string | null }) {
  const [row] = await tx
    .select({ id: reports.id, slug: reports.slug, title: reports.title, authorId: reports.authorId })
    .from(reports)
    .where(and(eq(reports.id, id), eq(reports.status, "published"), authorId === null ? undefined : eq(reports.authorId, authorId)))
    .for("update");
  return row ?? null;
}

export async function updateWorkingCopy(tx: Transaction, { id, fields }: { id: string; fields: { title: string; disclosure: string; bodyMdx: string } }) {
  await tx.update(reports).set(fields).where(and(eq(reports.id, id), eq(reports.status, "published")));
}

/** The latest decision with notes on a report, for the reviewer's workspace. */
export async function getLatestDecisionNotes({ reportId }: { reportId: string }) {
  const [row] = await db
    .select({ decision: editorialDecisions.decision, notes: editorialDecisions.notes, createdAt: editorialDecisions.createdAt, revisionNumber: reportRevisions.number })
    .from(editorialDecisions)
    .leftJoin(reportRevisions, eq(reportRevisions.id, editorialDecisions.revisionId))
    .where(eq(editorialDecisions.reportId, reportId))
    .orderBy(desc(editorialDecisions.createdAt))
    .limit(1);
  return row ?? null;
}

export async function getOpenRevisionSummary({ reportId }: { reportId: string }) {
  const [row] = await db
    .select({ number: reportRevisions.number, kind: reportRevisions.kind, status: reportRevisions.status, scheduledFor: reportRevisions.scheduledFor })
    .from(reportRevisions)
    .where(and(eq(reportRevisions.reportId, reportId), inArray(reportRevisions.status, [...openRevisionStatuses])))
    .limit(1);
  return row ?? null;
}

export async function listEditors(tx: Transaction) {
  return tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.role, "editor")).orderBy(asc(users.email));
}

export async function getAccountAddress(tx: Transaction, { id }: { id: string }) {
  const [row] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, id));
  return row ?? null;
}

// Readers' side. Only published and retracted reports exist for readers; a retraction keeps the page with its reason.

export const readableStatuses = ["published", "retracted"] as const;

/** A revision's verdict results alone, so a list never loads the analyses and chart series that make up most of it. */
export const frozenVerdictResults = sql<unknown[]>`jsonb_path_query_array(${reportRevisions.content}, '$.measurements[*].verdict.result')`;

/** The few columns that change after publication; never cached, so a retraction or a new revision shows at once. */
export async function getReadableReport({ slug }: { slug: string }) {
  const [row] = await db
    .select({
      id: reports.id,
      slug: reports.slug,
      status: reports.status,
      authorId: reports.authorId,
      publishedRevisionId: reports.publishedRevisionId,
      firstPublishedAt: reports.firstPublishedAt,
      retractedAt: reports.retractedAt,
      retractionReason: reports.retractionReason,
    })
    .from(reports)
    .where(and(eq(reports.slug, slug), inArray(reports.status, [...readableStatuses])))
    .limit(1);
  return row?.publishedRevisionId ? { ...row, publishedRevisionId: row.publishedRevisionId } : null;
}

export type ReadableReport = NonNullable<Awaited<ReturnType<typeof getReadableReport>>>;

const revisionColumns = {
  id: reportRevisions.id,
  number: reportRevisions.number,
  kind: reportRevisions.kind,
  changeNote: reportRevisions.changeNote,
  bodyMdx: reportRevisions.bodyMdx,
  content: reportRevisions.content,
  compiledMdx: reportRevisions.compiledMdx,
  publishedAt: reportRevisions.publishedAt,
};

function readableRevision<T extends { publishedAt: Date | null }>(row: T) {
  // Dates as text: the page caches this row, and a cache hands back JSON.
  return { ...row, publishedAt: (row.publishedAt ?? new Date(0)).toISOString() };
}

/** A published revision by id: immutable once published, so pages may cache it for good. */
export async function getPublishedRevision({ reportId, revisionId }: { reportId: string; revisionId: string }) {
  const [row] = await db
    .select(revisionColumns)
    .from(reportRevisions)
    .where(and(eq(reportRevisions.id, revisionId), eq(reportRevisions.reportId, reportId), eq(reportRevisions.status, "published")))
    .limit(1);
  return row ? readableRevision(row) : null;
}

export type PublishedRevision = NonNullable<Awaited<ReturnType<typeof getPublishedRevision>>>;

export async function listPublishedRevisions({ reportId }: { reportId: string }) {
  return db
    .select({
      id: reportRevisions.id,
      number: reportRevisions.number,
      kind: reportRevisions.kind,
      changeNote: reportRevisions.changeNote,
      publishedAt: reportRevisions.publishedAt,
    })
    .from(reportRevisions)
    .where(and(eq(reportRevisions.reportId, reportId), eq(reportRevisions.status, "published")))
    .orderBy(asc(reportRevisions.number));
}

export type RevisionHistoryEntry = Awaited<ReturnType<typeof listPublishedRevisions>>[number];

export async function listMakerReplies({ reportId }: { reportId: string }) {
  return db
    .select({ id: makerReplies.id, makerName: makerReplies.makerName, body: makerReplies.body, receivedOn: makerReplies.receivedOn, createdAt: makerReplies.createdAt })
    .from(makerReplies)
    .where(eq(makerReplies.reportId, reportId))
    .orderBy(asc(makerReplies.createdAt));
}

export type MakerReplyEntry = Awaited<ReturnType<typeof listMakerReplies>>[number];

/** Published and retracted reports, newest first, with what their current revision says on the list. */
export async function listReadableReports({ toolSlug, limit }: { toolSlug?: string; limit?: number } = {}) {
  const query = db
    .select({
      slug: reports.slug,
      title: sql<string>`${reportRevisions.content}->>'title'`,
      status: reports.status,
      authorName: users.name,
      tools: reportToolNames,
      firstPublishedAt: reports.firstPublishedAt,
      revisionNumber: reportRevisions.number,
      revisionKind: reportRevisions.kind,
      revisedAt: reportRevisions.publishedAt,
      verdictResults: frozenVerdictResults,
    })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(
      and(
        inArray(reports.status, [...readableStatuses]),
        toolSlug === undefined
          ? undefined
          : sql`exists (select 1 from ${reportTools} join ${tools} on ${tools.id} = ${reportTools.toolId} where ${reportTools.reportId} = ${reports.id} and ${tools.slug} = ${toolSlug})`,
      ),
    )
    .orderBy(desc(reports.firstPublishedAt), reports.slug);
  return limit === undefined ? query : query.limit(limit);
}

export type ReadableReportSummary = Awaited<ReturnType<typeof listReadableReports>>[number];
