"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import {
  countRequestsSince,
  findAnswerableReport,
  insertMeasurementRequest,
  lockRequestQuota,
  toggleVote,
  toolExists,
} from "@/db/queries/measurement-requests";
import { can } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { applyRequestStatus, lockOpenRequest, peopleTold } from "@/lib/measurement-requests";
import { wakeMailSender } from "@/lib/outbox";
import { requestStatusLabels } from "@/lib/request-statuses";
import { newMeasurementRequestSchema, requestFulfilmentSchema, requestLimits, requestVoteSchema } from "@/lib/validations/measurement-requests";

export const createMeasurementRequest = guardedAction(
  "(public)/actions.ts#createMeasurementRequest",
  newMeasurementRequestSchema,
  async ({ toolId, proposedToolName, whatToMeasure, why }, user) => {
    const created = await db.transaction(async (tx) => {
      if (toolId && !(await toolExists(tx, { toolId }))) {
        throw new UserFacingError("That tool is no longer in the catalogue.", 404, {
          toolId: ["That tool is no longer in the catalogue: choose another, or name it below."],
        });
      }
      await lockRequestQuota(tx, { requesterId: user.id });
      const recent = await countRequestsSince(tx, { requesterId: user.id, since: new Date(Date.now() - 24 * 3600_000) });
      if (recent >= requestLimits.perDay) {
        throw new UserFacingError(
          `You posted ${requestLimits.perDay} requests in the last 24 hours, as many as we take in a day. Vote for other requests meanwhile, or post this one tomorrow.`,
          429,
        );
      }
      return insertMeasurementRequest(tx, { toolId: toolId ?? null, proposedToolName: toolId ? null : proposedToolName, whatToMeasure, why, requesterId: user.id });
    });
    revalidatePath("/requests");
    redirect(`/requests/${created.id}`);
  },
);

export const toggleRequestVote = guardedAction("(public)/actions.ts#toggleRequestVote", requestVoteSchema, async ({ requestId }, user) => {
  const voted = await db.transaction(async (tx) => {
    const request = await lockOpenRequest(tx, { id: requestId });
    if (request.status !== "open" && request.status !== "planned") {
      throw new UserFacingError(`Voting has closed: this request is ${requestStatusLabels[request.status].toLowerCase()}.`, 409);
    }
    return toggleVote(tx, { requestId, userId: user.id });
  });
  revalidatePath("/requests");
  revalidatePath(`/requests/${requestId}`);
  return { status: "ok", message: voted ? "Your vote counts." : "Vote withdrawn." };
});

export const markRequestMeasured = guardedAction(
  "(public)/actions.ts#markRequestMeasured",
  requestFulfilmentSchema,
  async ({ requestId, reportId }, user) => {
    const notified = await db.transaction(async (tx) => {
      const request = await lockOpenRequest(tx, { id: requestId });
      const report = await findAnswerableReport(tx, { reportId, viewerId: user.id, anyAuthor: can(user.role, "workspace:edit-any") });
      if (!report) {
        throw new UserFacingError("That report cannot answer a request.", 404, {
          reportId: ["Choose a published report, or one of yours that is submitted for review."],
        });
      }
      return applyRequestStatus(tx, { request, actorId: user.id, change: { status: "measured", report } });
    });
    await wakeMailSender();
    revalidatePath("/requests");
    revalidatePath(`/requests/${requestId}`);
    revalidatePath("/desk/requests");
    return { status: "ok", message: `Marked measured; ${peopleTold(notified)}.` };
  },
);
