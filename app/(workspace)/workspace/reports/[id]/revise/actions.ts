"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { proposeRevision as saveProposal } from "@/lib/editorial";
import { guardedAction } from "@/lib/guarded-action";
import { wakeMailSender } from "@/lib/outbox";
import { proposeRevisionSchema } from "@/lib/validations/editorial";

export const proposeRevision = guardedAction("(workspace)/workspace/reports/[id]/revise/actions.ts#proposeRevision", proposeRevisionSchema, async (data, user) => {
  const { number } = await db.transaction((tx) => saveProposal(tx, { viewer: user, ...data }));
  await wakeMailSender();
  revalidatePath(`/workspace/reports/${data.reportId}`);
  revalidatePath(`/workspace/reports/${data.reportId}/revise`);
  revalidatePath("/desk");
  return { status: "ok", message: `Revision ${number} is with the desk. Readers see the published version until an editor approves it.` };
});
