import Link from "next/link";
import type { ReactNode } from "react";
import { CommentText } from "@/components/comment-text";
import { listReportComments, type ReportComment } from "@/db/queries/comments";
import type { ReadableReport } from "@/db/queries/editorial";
import { can } from "@/lib/authz";
import { formatDateTime } from "@/lib/format";
import { getCurrentUser } from "@/lib/session";
import { CommentForm } from "./comment-form";

function CommentCard({ comment, children }: { comment: ReportComment; children?: ReactNode }) {
  return (
    <article className={`rounded border px-4 py-3 ${comment.byReportAuthor ? "border-verdigris bg-verdigris-wash/40" : "border-rule bg-paper-raised"}`}>
      <p className="text-sm text-ink-faint">
        <span className="font-semibold text-ink">{comment.authorName ?? "a former reader"}</span>
        {comment.byReportAuthor ? <span className="ml-1 text-verdigris-deep">· the report&apos;s author</span> : null} ·{" "}
        <time dateTime={comment.createdAt}>{formatDateTime(new Date(comment.createdAt))}</time>
        {comment.status === "pending" ? <span className="ml-2 rounded bg-paper-sunk px-2 py-0.5 text-xs">waiting for an editor; only you see it</span> : null}
      </p>
      <div className="mt-2">
        <CommentText body={comment.body} />
      </div>
      {children}
    </article>
  );
}

/** Approved comments with the author's replies beneath them; signed-in readers may add theirs. */
export async function CommentsSection({ report }: { report: ReadableReport }) {
  const viewer = await getCurrentUser();
  const comments = await listReportComments({ reportId: report.id, viewerId: viewer?.id ?? null });
  const topLevel = comments.filter((comment) => comment.parentId === null);
  const repliesTo = (id: string) => comments.filter((comment) => comment.parentId === id);
  const open = report.status === "published";
  const isAuthor = viewer?.id === report.authorId;
  return (
    <section aria-labelledby="comments-heading" className="max-w-3xl space-y-4">
      <h2 id="comments-heading" className="font-serif text-2xl">
        Comments
      </h2>
      {topLevel.length === 0 ? <p className="text-ink-soft">No comments yet.</p> : null}
      <ol className="space-y-4">
        {topLevel.map((comment) => (
          <li key={comment.id}>
            <CommentCard comment={comment}>
              {repliesTo(comment.id).length ? (
                <ol className="mt-3 space-y-3 border-l-2 border-rule pl-4">
                  {repliesTo(comment.id).map((reply) => (
                    <li key={reply.id}>
                      <CommentCard comment={reply} />
                    </li>
                  ))}
                </ol>
              ) : null}
              {open && isAuthor && comment.status === "approved" ? (
                <details className="mt-3">
                  <summary className="cursor-pointer text-sm font-semibold text-copper">Reply as the author</summary>
                  <div className="mt-2">
                    <CommentForm reportId={report.id} parentId={comment.id} label={`Your reply to ${comment.authorName ?? "a former reader"}`} />
                  </div>
                </details>
              ) : null}
            </CommentCard>
          </li>
        ))}
      </ol>
      {!open ? (
        <p className="text-ink-soft">Comments are closed on a retracted report.</p>
      ) : viewer && can(viewer.role, "comments:post") ? (
        <CommentForm reportId={report.id} label="Your comment" />
      ) : (
        <p className="text-ink-soft">
          <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/reports/${report.slug}`)}`} className="font-semibold text-copper underline">
            Sign in
          </Link>{" "}
          to comment.
        </p>
      )}
    </section>
  );
}
