"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { postComment as savePostedComment } from "@/lib/comments";
import { guardedAction } from "@/lib/guarded-action";
import { wakeMailSender } from "@/lib/outbox";
import { postCommentSchema } from "@/lib/validations/editorial";

export const postComment = guardedAction("(public)/reports/actions.ts#postComment", postCommentSchema, async (data, user) => {
  const { status, slug } = await db.transaction((tx) =>
    savePostedComment(tx, { author: user, reportId: data.reportId, parentId: data.parentId ?? null, body: data.body }),
  );
  if (status === "pending") await wakeMailSender();
  revalidatePath(`/reports/${slug}`);
  return {
    status: "ok",
    message: status === "approved" ? "Posted." : "Thanks: your comment is waiting for an editor and shows here once approved.",
  };
});
