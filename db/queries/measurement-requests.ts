import "server-only";
import { and, asc, count, desc, eq, gt, inArray, isNull, ne, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import { db, type Transaction } from "@/db";
import { toolName as catalogueToolName } from "@/db/queries/catalogue";
import { auditLog, makers, measurementRequests, reports, requestVotes, tools, users, type RequestStatus } from "@/db/schema";
import type { RequestListQuery } from "@/lib/validations/measurement-requests";

// A catalogued tool by maker and model, else the name the reader typed.
const requestedToolName = sql<string>`coalesce(${catalogueToolName}, ${measurementRequests.proposedToolName}, 'an unnamed tool')`;

function votedBy(viewerId: string | null) {
  if (!viewerId) return sql<boolean>`false`;
  return sql<boolean>`exists (select 1 from ${requestVotes} where ${requestVotes.requestId} = ${measurementRequests.id} and ${requestVotes.userId} = ${viewerId})`;
}

const summaryColumns = (viewerId: string | null) => ({
  id: measurementRequests.id,
  toolName: requestedToolName,
  toolSlug: tools.slug,
  whatToMeasure: measurementRequests.whatToMeasure,
  status: measurementRequests.status,
  mergedIntoId: measurementRequests.mergedIntoId,
  voteCount: measurementRequests.voteCount,
  createdAt: measurementRequests.createdAt,
  viewerVoted: votedBy(viewerId),
});

export type MeasurementRequestSummary = Awaited<ReturnType<typeof listMeasurementRequests>>["requests"][number];

function statusFilter(status: RequestListQuery["status"]): SQL {
  return status === "wanted" ? inArray(measurementRequests.status, ["open", "planned"]) : eq(measurementRequests.status, status);
}

/** Most wanted first: by votes, then the newest. */
export async function listMeasurementRequests({
  status,
  page,
  perPage,
  viewerId,
}: RequestListQuery & { perPage: number; viewerId: string | null }) {
  const [rows, [total]] = await Promise.all([
    db
      .select(summaryColumns(viewerId))
      .from(measurementRequests)
      .leftJoin(tools, eq(tools.id, measurementRequests.toolId))
      .leftJoin(makers, eq(makers.id, tools.makerId))
      .where(statusFilter(status))
      .orderBy(desc(measurementRequests.voteCount), desc(measurementRequests.createdAt))
      .limit(perPage)
      .offset((page - 1) * perPage),
    db.select({ value: count() }).from(measurementRequests).where(statusFilter(status)),
  ]);
  return { requests: rows, total: total?.value ?? 0 };
}

export async function countMeasurementRequestsByStatus() {
  const rows = await db
    .select({ status: measurementRequests.status, value: count() })
    .from(measurementRequests)
    .groupBy(measurementRequests.status);
  const counts: Record<RequestStatus, number> = { open: 0, planned: 0, measured: 0, declined: 0 };
  for (const row of rows) counts[row.status] = row.value;
  return counts;
}

const requester = alias(users, "requester");

/** Null for an id that does not exist, or that is not even an id (as a URL may hold). */
export async function getMeasurementRequest({ id, viewerId }: { id: string; viewerId: string | null }) {
  if (!z.uuid().safeParse(id).success) return null;
  const [row] = await db
    .select({
      ...summaryColumns(viewerId),
      proposedToolName: measurementRequests.proposedToolName,
      why: measurementRequests.why,
      declineReason: measurementRequests.declineReason,
      requesterId: measurementRequests.requesterId,
      requesterName: requester.name,
      report: { id: reports.id, title: reports.title, slug: reports.slug, status: reports.status },
    })
    .from(measurementRequests)
    .leftJoin(tools, eq(tools.id, measurementRequests.toolId))
    .leftJoin(makers, eq(makers.id, tools.makerId))
    .leftJoin(requester, eq(requester.id, measurementRequests.requesterId))
    .leftJoin(reports, eq(reports.id, measurementRequests.answeredByReportId))
    .where(eq(measurementRequests.id, id))
    .limit(1);
  return row ?? null;
}

export type MeasurementRequestDetail = NonNullable<Awaited<ReturnType<typeof getMeasurementRequest>>>;

export async function listMergedDuplicates({ targetId }: { targetId: string }) {
  return db
    .select({ id: measurementRequests.id, toolName: requestedToolName, whatToMeasure: measurementRequests.whatToMeasure, createdAt: measurementRequests.createdAt })
    .from(measurementRequests)
    .leftJoin(tools, eq(tools.id, measurementRequests.toolId))
    .leftJoin(makers, eq(makers.id, tools.makerId))
    .where(eq(measurementRequests.mergedIntoId, targetId))
    .orderBy(asc(measurementRequests.createdAt));
}

/** Requests another may be merged into: not merged themselves and not declined. */
export async function listMergeTargets({ excludeId }: { excludeId: string }) {
  return db
    .select({ id: measurementRequests.id, toolName: requestedToolName, whatToMeasure: measurementRequests.whatToMeasure, status: measurementRequests.status, voteCount: measurementRequests.voteCount })
    .from(measurementRequests)
    .leftJoin(tools, eq(tools.id, measurementRequests.toolId))
    .leftJoin(makers, eq(makers.id, tools.makerId))
    .where(and(ne(measurementRequests.id, excludeId), isNull(measurementRequests.mergedIntoId), ne(measurementRequests.status, "declined")))
    .orderBy(asc(requestedToolName), desc(measurementRequests.voteCount));
}

/** The request's public history: status changes and merges from the audit log, without who made them. */
export async function listRequestHistory({ requestId }: { requestId: string }) {
  return db
    .select({ id: auditLog.id, action: auditLog.action, details: auditLog.details, createdAt: auditLog.createdAt })
    .from(auditLog)
    .where(
      and(
        eq(auditLog.subjectType, "measurement_request"),
        eq(auditLog.subjectId, requestId),
        inArray(auditLog.action, ["request.status_changed", "request.merged"]),
      ),
    )
    .orderBy(asc(auditLog.createdAt));
}

export async function listRequestableTools() {
  return db
    .select({ id: tools.id, maker: makers.name, model: tools.model })
    .from(tools)
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .orderBy(asc(makers.name), asc(tools.model));
}

export async function toolExists(tx: Transaction, { toolId }: { toolId: string }) {
  const [row] = await tx.select({ id: tools.id }).from(tools).where(eq(tools.id, toolId)).limit(1);
  return Boolean(row);
}

/**
 * Reports that may answer a request. Published reports are the real answer; submitted ones are accepted too, so a
 * reviewer can link their report while the desk reviews it (the request page names it only once published). Reviewers
 * see their own submitted reports, editors everyone's.
 */
function answerableReports({ viewerId, anyAuthor }: { viewerId: string; anyAuthor: boolean }) {
  return or(
    eq(reports.status, "published"),
    and(eq(reports.status, "submitted"), anyAuthor ? undefined : eq(reports.authorId, viewerId)),
  );
}

export async function listAnswerableReports(viewer: { viewerId: string; anyAuthor: boolean }) {
  return db
    .select({ id: reports.id, title: reports.title, status: reports.status })
    .from(reports)
    .where(answerableReports(viewer))
    .orderBy(asc(reports.title));
}

export async function findAnswerableReport(
  tx: Transaction,
  { reportId, ...viewer }: { reportId: string; viewerId: string; anyAuthor: boolean },
) {
  const [row] = await tx
    .select({ id: reports.id, title: reports.title, status: reports.status })
    .from(reports)
    .where(and(eq(reports.id, reportId), answerableReports(viewer)))
    .limit(1);
  return row ?? null;
}

/** Serialises one person's posts, so two quick submissions cannot both slip under the daily limit. */
export async function lockRequestQuota(tx: Transaction, { requesterId }: { requesterId: string }) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`benchplate:request-quota:${requesterId}`}))`);
}

export async function countRequestsSince(tx: Transaction, { requesterId, since }: { requesterId: string; since: Date }) {
  const [row] = await tx
    .select({ value: count() })
    .from(measurementRequests)
    .where(and(eq(measurementRequests.requesterId, requesterId), gt(measurementRequests.createdAt, since)));
  return row?.value ?? 0;
}

/** The requester's own vote comes with the request. */
export async function insertMeasurementRequest(
  tx: Transaction,
  values: { toolId: string | null; proposedToolName: string | null; whatToMeasure: string; why: string; requesterId: string },
) {
  const [row] = await tx.insert(measurementRequests).values({ ...values, voteCount: 1 }).returning({ id: measurementRequests.id });
  if (!row) throw new Error("measurement request not inserted");
  await tx.insert(requestVotes).values({ requestId: row.id, userId: values.requesterId });
  return row;
}

/** Locks the rows in id order, so two merges over the same pair cannot deadlock. */
export async function lockMeasurementRequests(tx: Transaction, { ids }: { ids: string[] }) {
  const rows = await tx
    .select({
      id: measurementRequests.id,
      status: measurementRequests.status,
      mergedIntoId: measurementRequests.mergedIntoId,
      answeredByReportId: measurementRequests.answeredByReportId,
      whatToMeasure: measurementRequests.whatToMeasure,
      toolName: requestedToolName,
    })
    .from(measurementRequests)
    .leftJoin(tools, eq(tools.id, measurementRequests.toolId))
    .leftJoin(makers, eq(makers.id, tools.makerId))
    .where(inArray(measurementRequests.id, ids))
    .orderBy(asc(measurementRequests.id))
    .for("update", { of: measurementRequests });
  return new Map(rows.map((row) => [row.id, row]));
}

export type LockedRequest = NonNullable<ReturnType<Awaited<ReturnType<typeof lockMeasurementRequests>>["get"]>>;

/** Adds or removes the vote and moves the count by the same step in one transaction; returns whether the person now votes. */
export async function toggleVote(tx: Transaction, { requestId, userId }: { requestId: string; userId: string }) {
  const removed = await tx
    .delete(requestVotes)
    .where(and(eq(requestVotes.requestId, requestId), eq(requestVotes.userId, userId)))
    .returning({ userId: requestVotes.userId });
  if (removed.length === 0) await tx.insert(requestVotes).values({ requestId, userId });
  const delta = removed.length === 0 ? 1 : -1;
  await tx
    .update(measurementRequests)
    .set({ voteCount: sql`${measurementRequests.voteCount} + ${delta}` })
    .where(eq(measurementRequests.id, requestId));
  return delta > 0;
}

export async function updateRequestStatus(
  tx: Transaction,
  { id, status, declineReason, answeredByReportId }: { id: string; status: RequestStatus; declineReason: string | null; answeredByReportId: string | null },
) {
  await tx.update(measurementRequests).set({ status, declineReason, answeredByReportId }).where(eq(measurementRequests.id, id));
}

/**
 * Moves the duplicate's votes to the target; someone who voted for both keeps the one vote they already had there.
 * Returns how many votes the target gained.
 */
export async function moveRequestVotes(tx: Transaction, { fromId, toId }: { fromId: string; toId: string }) {
  const moved = await tx
    .insert(requestVotes)
    .select(
      tx
        .select({ requestId: sql<string>`${toId}::uuid`.as("request_id"), userId: requestVotes.userId, createdAt: requestVotes.createdAt })
        .from(requestVotes)
        .where(eq(requestVotes.requestId, fromId)),
    )
    .onConflictDoNothing()
    .returning({ userId: requestVotes.userId });
  await tx.delete(requestVotes).where(eq(requestVotes.requestId, fromId));
  await tx
    .update(measurementRequests)
    .set({ voteCount: sql`${measurementRequests.voteCount} + ${moved.length}` })
    .where(eq(measurementRequests.id, toId));
  return moved.length;
}

/** A merged request is declined, points at its target, and hands any requests merged into it on to the target. */
export async function markRequestMerged(tx: Transaction, { duplicateId, targetId, reason }: { duplicateId: string; targetId: string; reason: string }) {
  await tx
    .update(measurementRequests)
    .set({ status: "declined", declineReason: reason, mergedIntoId: targetId, voteCount: 0 })
    .where(eq(measurementRequests.id, duplicateId));
  await tx.update(measurementRequests).set({ mergedIntoId: targetId }).where(eq(measurementRequests.mergedIntoId, duplicateId));
}

/** Who hears about a request: its requester and everyone who votes for it, each once. */
export async function listRequestAudience(tx: Transaction, { requestId }: { requestId: string }) {
  return tx
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(
      or(
        inArray(users.id, tx.select({ id: measurementRequests.requesterId }).from(measurementRequests).where(eq(measurementRequests.id, requestId))),
        inArray(users.id, tx.select({ id: requestVotes.userId }).from(requestVotes).where(eq(requestVotes.requestId, requestId))),
      ),
    )
    .orderBy(asc(users.email));
}

/** Before an account goes: its votes leave the counts, so no request keeps a vote nobody cast. */
export async function withdrawAllVotes(tx: Transaction, { userId }: { userId: string }) {
  const removed = await tx.delete(requestVotes).where(eq(requestVotes.userId, userId)).returning({ requestId: requestVotes.requestId });
  if (removed.length === 0) return 0;
  await tx
    .update(measurementRequests)
    .set({ voteCount: sql`${measurementRequests.voteCount} - 1` })
    .where(inArray(measurementRequests.id, removed.map((row) => row.requestId)));
  return removed.length;
}
