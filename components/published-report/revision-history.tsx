import Link from "next/link";
import type { RevisionHistoryEntry } from "@/db/queries/editorial";
import { formatDate } from "@/lib/format";
import { revisionKindLabels } from "@/lib/validations/editorial";

/** Every published revision, each at its own address with its own numbers, and what each changed. */
export function RevisionHistory({ slug, revisions, current }: { slug: string; revisions: RevisionHistoryEntry[]; current: number }) {
  return (
    <section aria-labelledby="history-heading" className="max-w-3xl space-y-2">
      <h2 id="history-heading" className="font-serif text-2xl">
        Revision history
      </h2>
      <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
        {revisions.map((revision, index) => (
          <li key={revision.number} className="flex flex-col gap-1 px-4 py-3 sm:flex-row sm:items-baseline sm:gap-4">
            <span className="figure shrink-0 text-ink-faint">{revision.publishedAt ? formatDate(revision.publishedAt) : "—"}</span>
            <span className="flex-1">
              <Link href={`/reports/${slug}/revisions/${revision.number}`} className="font-semibold underline hover:text-copper">
                Revision {revision.number}: {revisionKindLabels[revision.kind]}
              </Link>
              {revision.number === current ? <span className="ml-2 text-xs uppercase tracking-wide text-verdigris-deep">shown</span> : null}
              <span className="block text-ink-soft">{revision.changeNote}</span>
            </span>
            {index > 0 ? (
              <Link href={`/reports/${slug}/diff?from=${revisions[index - 1]!.number}&to=${revision.number}`} className="shrink-0 text-copper underline">
                Changes from revision {revisions[index - 1]!.number}
              </Link>
            ) : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
