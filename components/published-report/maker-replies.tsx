import type { MakerReplyEntry } from "@/db/queries/editorial";

/** What the maker answered, as plain text: it is their words, not ours, and never markup. */
export function MakerReplies({ replies }: { replies: MakerReplyEntry[] }) {
  if (replies.length === 0) return null;
  return (
    <section aria-labelledby="maker-reply-heading" className="max-w-3xl space-y-3">
      <h2 id="maker-reply-heading" className="font-serif text-2xl">
        The maker&apos;s reply
      </h2>
      {replies.map((reply) => (
        <blockquote key={reply.id} className="rounded border border-rule bg-paper-raised px-4 py-3">
          <p className="text-sm text-ink-faint">
            From {reply.makerName}, received <span className="figure">{reply.receivedOn}</span>
          </p>
          <p className="mt-2 whitespace-pre-line font-serif">{reply.body}</p>
        </blockquote>
      ))}
    </section>
  );
}
