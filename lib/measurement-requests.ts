import "server-only";
import type { Transaction } from "@/db";
import {
  listRequestAudience,
  lockMeasurementRequests,
  markRequestMerged,
  moveRequestVotes,
  updateRequestStatus,
  type LockedRequest,
} from "@/db/queries/measurement-requests";
import type { ReportStatus } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { UserFacingError } from "@/lib/errors";
import { requestUpdateMail, type RequestChange } from "@/lib/mail-templates";
import { enqueueMail } from "@/lib/outbox";
import { requestStatusLabels } from "@/lib/request-statuses";

// The flows behind request triage, shared by the desk's actions and the reviewer's "answered by this report". Each runs
// inside the caller's transaction: the status, its audit entry (which is also the request's public history) and the
// mails to the requester and voters commit together or not at all.

/** Locks a request for a change; a merged request is closed, and its target is where things happen. */
export async function lockOpenRequest(tx: Transaction, { id }: { id: string }) {
  const request = (await lockMeasurementRequests(tx, { ids: [id] })).get(id);
  if (!request) throw new UserFacingError("That request no longer exists.", 404);
  if (request.mergedIntoId) throw new UserFacingError("This request was merged into another; act on that one instead.", 409);
  return request;
}

export type StatusChange =
  | { status: "open" | "planned" }
  | { status: "declined"; reason: string }
  | { status: "measured"; report: { id: string; title: string; status: ReportStatus } };

export async function applyRequestStatus(tx: Transaction, { request, actorId, change }: { request: LockedRequest; actorId: string; change: StatusChange }) {
  const sameReport = change.status !== "measured" || request.answeredByReportId === change.report.id;
  if (request.status === change.status && sameReport) {
    throw new UserFacingError(`This request is already ${requestStatusLabels[change.status].toLowerCase()}.`, 409);
  }
  const declineReason = change.status === "declined" ? change.reason : null;
  const reportId = change.status === "measured" ? change.report.id : null;
  await updateRequestStatus(tx, { id: request.id, status: change.status, declineReason, answeredByReportId: reportId });
  await recordAudit(tx, {
    actorId,
    action: "request.status_changed",
    subjectType: "measurement_request",
    subjectId: request.id,
    details: { from: request.status, to: change.status, ...(declineReason ? { reason: declineReason } : {}), ...(reportId ? { reportId } : {}) },
  });
  const mailChange: RequestChange =
    change.status === "measured"
      ? { kind: "measured", reportTitle: change.report.title, reportPublished: change.report.status === "published" }
      : change.status === "declined"
        ? { kind: "declined", reason: change.reason }
        : { kind: change.status };
  const audience = await listRequestAudience(tx, { requestId: request.id });
  return queueRequestMail(tx, { request, audience, change: mailChange });
}

/**
 * Merges a duplicate into its target: the votes move (someone who voted for both keeps one vote), the duplicate is
 * declined with a reason naming the target and points at it, and those who asked for or voted on the duplicate are told.
 */
export async function mergeDuplicateRequest(tx: Transaction, { duplicateId, targetId, actorId }: { duplicateId: string; targetId: string; actorId: string }) {
  const locked = await lockMeasurementRequests(tx, { ids: [duplicateId, targetId] });
  const duplicate = locked.get(duplicateId);
  const target = locked.get(targetId);
  if (!duplicate) throw new UserFacingError("That request no longer exists.", 404);
  if (duplicate.mergedIntoId) throw new UserFacingError("This request was already merged into another.", 409);
  if (duplicate.status !== "open" && duplicate.status !== "planned") {
    throw new UserFacingError("Only an open or planned request can be merged into another.", 409);
  }
  if (!target || target.mergedIntoId || target.status === "declined") {
    throw new UserFacingError("Choose a request that is neither declined nor merged.", 409, {
      targetId: ["Choose a request that is neither declined nor merged."],
    });
  }
  // Read before the votes move, or the duplicate's voters could no longer be found.
  const audience = await listRequestAudience(tx, { requestId: duplicateId });
  const votesGained = await moveRequestVotes(tx, { fromId: duplicateId, toId: targetId });
  await markRequestMerged(tx, { duplicateId, targetId, reason: `Merged into the request for ${target.toolName}.` });
  await recordAudit(tx, {
    actorId,
    action: "request.merged",
    subjectType: "measurement_request",
    subjectId: duplicateId,
    details: { from: duplicate.status, into: targetId, votesGained },
  });
  const notified = await queueRequestMail(tx, {
    request: duplicate,
    audience,
    change: { kind: "merged", targetId, targetToolName: target.toolName },
  });
  return { votesGained, notified };
}

/** One mail per person and event: the dedupe key holds the request, what happened to it and the recipient. */
async function queueRequestMail(
  tx: Transaction,
  {
    request,
    audience,
    change,
  }: { request: LockedRequest; audience: { id: string; email: string; name: string }[]; change: RequestChange },
) {
  for (const person of audience) {
    await enqueueMail(tx, {
      topic: "request_update",
      recipientId: person.id,
      toAddress: person.email,
      dedupeKey: `request:${request.id}:${change.kind}:${person.id}`,
      ...requestUpdateMail({ name: person.name, requestId: request.id, toolName: request.toolName, whatToMeasure: request.whatToMeasure, change }),
    });
  }
  return audience.length;
}

/** For the message after a change: how many were told. */
export function peopleTold(count: number): string {
  return count === 1 ? "1 person told by e-mail" : `${count} people told by e-mail`;
}
