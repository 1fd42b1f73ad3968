import type { Metadata } from "next";
import Link from "next/link";
import { CommentText } from "@/components/comment-text";
import { listCommentsForModeration } from "@/db/queries/comments";
import type { CommentStatus } from "@/db/schema";
import { formatDateTime } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";
import { commentStatusLabels } from "@/lib/validations/editorial";
import { ModerationButtons, TrustButton } from "./_components/moderation-controls";

export const metadata: Metadata = { title: "Comment moderation" };

const statuses = ["pending", "approved", "rejected", "spam"] as const satisfies readonly CommentStatus[];

export default async function CommentModerationPage({ searchParams }: PageProps<"/desk/comments">) {
  await requirePagePermission("desk:use", "/desk/comments");
  const requested = (await searchParams).status;
  const status = statuses.find((candidate) => candidate === requested) ?? "pending";
  const { comments, tally } = await listCommentsForModeration({ status, limit: 100 });
  return (
    <section className="space-y-5">
      <header className="max-w-3xl space-y-2">
        <p className="text-sm">
          <Link href="/desk" className="text-copper underline">
            Editor&apos;s desk
          </Link>
        </p>
        <h1 className="font-serif text-3xl">Comments</h1>
        <p className="text-ink-soft">
          Readers&apos; comments wait here until approved, unless the reader is trusted. Every decision is in the audit log; rejected comments and spam stay
          hidden from readers.
        </p>
      </header>
      <nav aria-label="Comment states">
        <ul className="flex flex-wrap gap-2 text-sm">
          {statuses.map((candidate) => (
            <li key={candidate}>
              <Link
                href={`/desk/comments?status=${candidate}`}
                aria-current={candidate === status ? "page" : undefined}
                className={`inline-block rounded border px-3 py-1 ${candidate === status ? "border-ink bg-ink text-paper-raised" : "border-rule bg-paper-raised hover:border-copper"}`}
              >
                {commentStatusLabels[candidate]} <span className="figure">({tally[candidate]})</span>
              </Link>
            </li>
          ))}
        </ul>
      </nav>
      {comments.length === 0 ? <p className="text-ink-soft">No comment is {commentStatusLabels[status].toLowerCase()}.</p> : null}
      <ol className="space-y-3">
        {comments.map((comment) => (
          <li key={comment.id} className="space-y-2 rounded border border-rule bg-paper-raised p-4">
            <p className="text-sm text-ink-faint">
              <span className="font-semibold text-ink">{comment.authorName ?? "a former reader"}</span>
              {comment.authorRole ? ` · ${comment.authorRole}` : ""}
              {comment.authorTrusted ? " · trusted" : ""} · {formatDateTime(comment.createdAt)} · on{" "}
              <Link href={`/reports/${comment.reportSlug}`} className="text-copper underline">
                {comment.reportTitle}
              </Link>
              {comment.parentId ? " · a reply" : ""}
            </p>
            <div className="max-w-3xl">
              <CommentText body={comment.body} />
            </div>
            <ModerationButtons commentId={comment.id} status={comment.status} />
            {comment.authorId && comment.authorName ? <TrustButton userId={comment.authorId} trusted={comment.authorTrusted ?? false} name={comment.authorName} /> : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
