"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { guardedAction } from "@/lib/guarded-action";
import { applyRequestStatus, lockOpenRequest, mergeDuplicateRequest, peopleTold } from "@/lib/measurement-requests";
import { wakeMailSender } from "@/lib/outbox";
import { requestStatusLabels } from "@/lib/request-statuses";
import { requestMergeSchema, requestStatusChangeSchema } from "@/lib/validations/measurement-requests";

function revalidateRequestPages(...ids: string[]) {
  revalidatePath("/requests");
  revalidatePath("/desk/requests");
  for (const id of ids) {
    revalidatePath(`/requests/${id}`);
    revalidatePath(`/desk/requests/${id}`);
  }
}

export const changeRequestStatus = guardedAction(
  "(desk)/actions.ts#changeRequestStatus",
  requestStatusChangeSchema,
  async ({ requestId, status, declineReason }, user) => {
    const notified = await db.transaction(async (tx) => {
      const request = await lockOpenRequest(tx, { id: requestId });
      const change = status === "declined" ? { status, reason: declineReason ?? "" } : { status };
      return applyRequestStatus(tx, { request, actorId: user.id, change });
    });
    await wakeMailSender();
    revalidateRequestPages(requestId);
    return { status: "ok", message: `Now ${requestStatusLabels[status].toLowerCase()}; ${peopleTold(notified)}.` };
  },
);

export const mergeMeasurementRequests = guardedAction(
  "(desk)/actions.ts#mergeMeasurementRequests",
  requestMergeSchema,
  async ({ duplicateId, targetId }, user) => {
    const { votesGained, notified } = await db.transaction((tx) => mergeDuplicateRequest(tx, { duplicateId, targetId, actorId: user.id }));
    await wakeMailSender();
    revalidateRequestPages(duplicateId, targetId);
    // The duplicate is closed now; triage carries on at the request it joined, which says what the merge did.
    redirect(`/desk/requests/${targetId}?merged=${duplicateId}&gained=${votesGained}&told=${notified}`);
  },
);
