import "server-only";
import type { Transaction } from "@/db";
import {
  countCommentsSince,
  findCommentableReport,
  findReplyableComment,
  insertComment,
  isTrustedCommenter,
  lockCommenter,
  setCommentStatus,
  setTrustedCommenter,
} from "@/db/queries/comments";
import { listEditors } from "@/db/queries/editorial";
import type { CommentStatus } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { pendingCommentMail } from "@/lib/editorial-mail";
import { serverEnv } from "@/lib/env";
import { UserFacingError } from "@/lib/errors";
import { enqueueMail } from "@/lib/outbox";
import { commentLimits } from "@/lib/validations/editorial";

/**
 * A comment on a published report. A trusted reader's comment, and the report author's reply, appear at once; anyone
 * else's waits for an editor, and every editor is told (one message per comment each).
 */
export async function postComment(
  tx: Transaction,
  { author, reportId, parentId, body }: { author: { id: string; name: string }; reportId: string; parentId: string | null; body: string },
) {
  await lockCommenter(tx, { userId: author.id });
  const since = new Date(Date.now() - commentLimits.windowMinutes * 60_000);
  if ((await countCommentsSince(tx, { authorId: author.id, since })) >= commentLimits.perWindow) {
    const message = `You have posted ${commentLimits.perWindow} comments in the last ${commentLimits.windowMinutes} minutes; please wait a few minutes before the next.`;
    throw new UserFacingError(message, 429, { body: [message] });
  }
  const report = await findCommentableReport(tx, { reportId });
  if (!report) throw new UserFacingError("This report is not open for comments.", 404);
  const isReportAuthor = report.authorId === author.id;
  if (parentId) {
    if (!isReportAuthor) throw new UserFacingError("Only the report's author can reply to a comment.", 403);
    if (!(await findReplyableComment(tx, { id: parentId, reportId }))) throw new UserFacingError("That comment cannot be replied to.", 404);
  }
  const trusted = (parentId !== null && isReportAuthor) || (await isTrustedCommenter(tx, { userId: author.id }));
  const status: CommentStatus = trusted ? "approved" : "pending";
  const comment = await insertComment(tx, { reportId, authorId: author.id, parentId, body, status, ...(trusted ? { moderatedAt: new Date() } : {}) });
  if (status === "pending") {
    for (const editor of await listEditors(tx)) {
      const mail = pendingCommentMail({ origin: serverEnv().APP_ORIGIN, editorName: editor.name, reportTitle: report.title, commenterName: author.name, body });
      await enqueueMail(tx, { dedupeKey: `moderation:${comment.id}:${editor.id}`, topic: "moderation", recipientId: editor.id, toAddress: editor.email, ...mail });
    }
  }
  return { status, slug: report.slug };
}

export async function moderateComment(tx: Transaction, { commentId, status, moderatorId }: { commentId: string; status: Exclude<CommentStatus, "pending">; moderatorId: string }) {
  const before = await setCommentStatus(tx, { id: commentId, status, moderatorId, at: new Date() });
  if (!before) throw new UserFacingError("That comment no longer exists.", 404);
  await recordAudit(tx, { actorId: moderatorId, action: "comment.moderated", subjectType: "comment", subjectId: commentId, details: { from: before.status, to: status } });
  return { slug: before.slug };
}

export async function changeCommenterTrust(tx: Transaction, { userId, trusted, editorId }: { userId: string; trusted: boolean; editorId: string }) {
  const before = await setTrustedCommenter(tx, { userId, trusted });
  if (before === null) throw new UserFacingError("That account no longer exists.", 404);
  await recordAudit(tx, { actorId: editorId, action: "user.commenter_trust_changed", subjectType: "user", subjectId: userId, details: { from: before, to: trusted } });
}
