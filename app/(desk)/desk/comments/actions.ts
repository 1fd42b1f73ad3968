"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { changeCommenterTrust, moderateComment as saveModeration } from "@/lib/comments";
import { guardedAction } from "@/lib/guarded-action";
import { commentStatusLabels, commenterTrustSchema, moderateCommentSchema } from "@/lib/validations/editorial";

export const moderateComment = guardedAction("(desk)/desk/comments/actions.ts#moderateComment", moderateCommentSchema, async (data, user) => {
  const { slug } = await db.transaction((tx) => saveModeration(tx, { commentId: data.commentId, status: data.status, moderatorId: user.id }));
  revalidatePath("/desk/comments");
  revalidatePath(`/reports/${slug}`);
  return { status: "ok", message: `${commentStatusLabels[data.status]}.` };
});

export const setCommenterTrust = guardedAction("(desk)/desk/comments/actions.ts#setCommenterTrust", commenterTrustSchema, async (data, user) => {
  await db.transaction((tx) => changeCommenterTrust(tx, { userId: data.userId, trusted: data.trusted, editorId: user.id }));
  revalidatePath("/desk/comments");
  return { status: "ok", message: data.trusted ? "Trusted: their comments now appear without moderation." : "No longer trusted: their comments wait for moderation." };
});
