import Link from "next/link";
import type { RevisionKind } from "@/db/schema";
import { formatDate } from "@/lib/format";

/** A retracted report stays readable; this says so first, with the desk's reason. */
export function RetractionBanner({ retractedAt, reason }: { retractedAt: Date | null; reason: string | null }) {
  return (
    <div role="alert" className="max-w-3xl border-l-4 border-verdict-above bg-copper-wash px-4 py-3">
      <p className="font-semibold text-copper-deep">Retracted{retractedAt ? ` on ${formatDate(retractedAt)}` : ""}</p>
      <p className="mt-1 whitespace-pre-line text-ink">{reason}</p>
      <p className="mt-1 text-sm text-ink-soft">The report stays here as it was published, so what was said and why it was withdrawn can both be read.</p>
    </div>
  );
}

/** A correction changed a finding and is said so plainly; an amendment gets a quieter note. */
export function RevisionNotice({
  slug,
  revision,
}: {
  slug: string;
  revision: { number: number; kind: RevisionKind; changeNote: string; publishedAt: string };
}) {
  if (revision.kind === "original") return null;
  const correction = revision.kind === "correction";
  return (
    <div
      role="note"
      aria-label={correction ? "Correction" : "Amendment"}
      className={`max-w-3xl px-4 py-3 ${correction ? "border-l-4 border-verdict-inconclusive bg-paper-sunk" : "border border-rule bg-paper-raised text-sm"}`}
    >
      <p className="font-semibold">
        {correction ? "Correction" : "Amended"} on {formatDate(new Date(revision.publishedAt))} (revision {revision.number})
      </p>
      <p className="mt-1 whitespace-pre-line">{revision.changeNote}</p>
      <p className="mt-1 text-sm">
        <Link href={`/reports/${slug}/diff?from=${revision.number - 1}&to=${revision.number}`} className="text-copper underline">
          See what changed
        </Link>
      </p>
    </div>
  );
}
