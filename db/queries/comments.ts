import "server-only";
import { and, asc, count, desc, eq, gt, isNull, or, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { comments, reports, users, type CommentStatus } from "@/db/schema";

/** Serialises one person's comments, so the rate limit cannot be beaten by sending several at once. */
export async function lockCommenter(tx: Transaction, { userId }: { userId: string }) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('benchplate:comments:' || ${userId}))`);
}

export async function countCommentsSince(tx: Transaction, { authorId, since }: { authorId: string; since: Date }) {
  const [row] = await tx
    .select({ value: count() })
    .from(comments)
    .where(and(eq(comments.authorId, authorId), gt(comments.createdAt, since)));
  return row?.value ?? 0;
}

/** A report open for comments: published (not retracted), with its author. */
export async function findCommentableReport(tx: Transaction, { reportId }: { reportId: string }) {
  const [row] = await tx
    .select({ id: reports.id, slug: reports.slug, title: reports.title, authorId: reports.authorId })
    .from(reports)
    .where(and(eq(reports.id, reportId), eq(reports.status, "published")))
    .limit(1);
  return row ?? null;
}

/** Replies go under a visible top-level comment of the same report. */
export async function findReplyableComment(tx: Transaction, { id, reportId }: { id: string; reportId: string }) {
  const [row] = await tx
    .select({ id: comments.id })
    .from(comments)
    .where(and(eq(comments.id, id), eq(comments.reportId, reportId), isNull(comments.parentId), eq(comments.status, "approved")))
    .limit(1);
  return row ?? null;
}

export async function isTrustedCommenter(tx: Transaction, { userId }: { userId: string }) {
  const [row] = await tx.select({ trusted: users.trustedCommenter }).from(users).where(eq(users.id, userId));
  return row?.trusted ?? false;
}

export async function insertComment(
  tx: Transaction,
  values: { reportId: string; authorId: string; parentId: string | null; body: string; status: CommentStatus; moderatedAt?: Date },
) {
  const [row] = await tx.insert(comments).values(values).returning({ id: comments.id, status: comments.status });
  if (!row) throw new Error("comment not inserted");
  return row;
}

/**
 * The comments a reader sees on a report: every approved one, and the viewer's own that still wait, so they know it
 * arrived. The author's name only; null once the account is deleted.
 */
export async function listReportComments({ reportId, viewerId }: { reportId: string; viewerId: string | null }) {
  const rows = await db
    .select({
      id: comments.id,
      parentId: comments.parentId,
      body: comments.body,
      status: comments.status,
      createdAt: comments.createdAt,
      authorId: comments.authorId,
      authorName: users.name,
      byReportAuthor: sql<boolean>`${comments.authorId} is not null and ${comments.authorId} = ${reports.authorId}`,
    })
    .from(comments)
    .innerJoin(reports, eq(reports.id, comments.reportId))
    .leftJoin(users, eq(users.id, comments.authorId))
    .where(
      and(
        eq(comments.reportId, reportId),
        viewerId ? or(eq(comments.status, "approved"), and(eq(comments.status, "pending"), eq(comments.authorId, viewerId))) : eq(comments.status, "approved"),
      ),
    )
    .orderBy(asc(comments.createdAt));
  return rows.map((row) => ({ ...row, createdAt: row.createdAt.toISOString() }));
}

export type ReportComment = Awaited<ReturnType<typeof listReportComments>>[number];

/** The moderation list for one state, newest first, with the report and the commenter's standing. */
export async function listCommentsForModeration({ status, limit }: { status: CommentStatus; limit: number }) {
  const [rows, counts] = await Promise.all([
    db
      .select({
        id: comments.id,
        body: comments.body,
        status: comments.status,
        parentId: comments.parentId,
        createdAt: comments.createdAt,
        moderatedAt: comments.moderatedAt,
        reportTitle: reports.title,
        reportSlug: reports.slug,
        authorId: comments.authorId,
        authorName: users.name,
        authorRole: users.role,
        authorTrusted: users.trustedCommenter,
      })
      .from(comments)
      .innerJoin(reports, eq(reports.id, comments.reportId))
      .leftJoin(users, eq(users.id, comments.authorId))
      .where(eq(comments.status, status))
      .orderBy(desc(comments.createdAt))
      .limit(limit),
    db.select({ status: comments.status, value: count() }).from(comments).groupBy(comments.status),
  ]);
  const tally: Record<CommentStatus, number> = { pending: 0, approved: 0, rejected: 0, spam: 0 };
  for (const row of counts) tally[row.status] = row.value;
  return { comments: rows, tally };
}

export type ModerationComment = Awaited<ReturnType<typeof listCommentsForModeration>>["comments"][number];

/** Returns the state before, for the audit log; null when there is no such comment. */
export async function setCommentStatus(tx: Transaction, { id, status, moderatorId, at }: { id: string; status: CommentStatus; moderatorId: string; at: Date }) {
  const [before] = await tx
    .select({ status: comments.status, reportId: comments.reportId, slug: reports.slug })
    .from(comments)
    .innerJoin(reports, eq(reports.id, comments.reportId))
    .where(eq(comments.id, id))
    .for("update", { of: comments });
  if (!before) return null;
  await tx.update(comments).set({ status, moderatedById: moderatorId, moderatedAt: at }).where(eq(comments.id, id));
  return before;
}

/** Returns whether the account was trusted before; null when it does not exist. */
export async function setTrustedCommenter(tx: Transaction, { userId, trusted }: { userId: string; trusted: boolean }) {
  const [before] = await tx.select({ trusted: users.trustedCommenter }).from(users).where(eq(users.id, userId)).for("update");
  if (!before) return null;
  await tx.update(users).set({ trustedCommenter: trusted }).where(eq(users.id, userId));
  return before.trusted;
}
