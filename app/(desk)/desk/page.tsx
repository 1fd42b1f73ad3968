import type { Metadata } from "next";
import Link from "next/link";
import { listCommentsForModeration } from "@/db/queries/comments";
import { listDeskQueue } from "@/db/queries/editorial";
import { loadReportEmbeds } from "@/db/queries/reports";
import { listCalibrationWarnings } from "@/db/queries/runs";
import { formatDateTime } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";
import { revisionKindLabels } from "@/lib/validations/editorial";
import { KeyFigures } from "./_components/key-figures";

export const metadata: Metadata = { title: "Editor's desk" };

export default async function DeskPage() {
  await requirePagePermission("desk:use", "/desk");
  const [queue, moderation] = await Promise.all([listDeskQueue(), listCommentsForModeration({ status: "pending", limit: 1 })]);
  const details = await Promise.all(
    queue.map(async (item) => {
      const embeds = await loadReportEmbeds({ reportId: item.id });
      const analyses = Object.values(embeds.analyses);
      const warnings = await listCalibrationWarnings({ runIds: [...new Set(analyses.map((analysis) => analysis.run.id))] });
      return { analyses, warnings };
    }),
  );

  return (
    <div className="space-y-8">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-3xl">Editor&apos;s desk</h1>
        <p className="text-ink-soft">
          Reports submitted for review and revisions of published ones, oldest first. Open one to read it as readers would, then publish it, schedule it or
          send it back with notes.
        </p>
      </header>

      <nav aria-label="Desk" className="max-w-4xl">
        <ul className="grid gap-3 sm:grid-cols-3">
          <li>
            <Link href="/desk/comments" className="block h-full rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-lg">Comments</span>
              <span className="block text-sm text-ink-soft">{moderation.tally.pending} waiting for moderation; trusted readers.</span>
            </Link>
          </li>
          <li>
            <Link href="/desk/requests" className="block h-full rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-lg">Measurement requests</span>
              <span className="block text-sm text-ink-soft">Plan, decline, merge duplicates, link the answering report.</span>
            </Link>
          </li>
          <li>
            <Link href="/desk/audit" className="block h-full rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-lg">Audit log</span>
              <span className="block text-sm text-ink-soft">Every editorial, moderation and account action.</span>
            </Link>
          </li>
        </ul>
      </nav>

      <section aria-labelledby="queue-heading" className="space-y-3">
        <h2 id="queue-heading" className="font-serif text-2xl">
          Waiting for a decision <span className="figure text-base text-ink-faint">({queue.length})</span>
        </h2>
        {queue.length === 0 ? <p className="text-ink-soft">Nothing waits on the desk.</p> : null}
        <ol className="space-y-3">
          {queue.map((item, index) => {
            const { analyses, warnings } = details[index]!;
            const revision = item.openRevision;
            return (
              <li key={item.id} className="rounded border border-rule bg-paper-raised p-4">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <h3 className="font-serif text-xl">
                    <Link href={`/desk/reports/${item.id}`} className="hover:text-copper">
                      {item.title}
                    </Link>
                  </h3>
                  <p className="text-xs font-semibold uppercase tracking-wide text-verdigris-deep">
                    {revision?.status === "scheduled"
                      ? `Scheduled for ${revision.scheduledFor ? formatDateTime(revision.scheduledFor) : "later"}`
                      : revision && revision.kind !== "original"
                        ? `${revisionKindLabels[revision.kind]} proposed (revision ${revision.number})`
                        : "Submitted for first publication"}
                  </p>
                </div>
                <p className="text-sm text-ink-soft">
                  {item.tools} · by {item.authorName} · {revision ? `since ${formatDateTime(revision.createdAt)}` : item.submittedAt ? `submitted ${formatDateTime(item.submittedAt)}` : ""}
                </p>
                {revision && revision.kind !== "original" ? <p className="mt-1 text-sm">Change note: {revision.changeNote}</p> : null}
                <div className="mt-2">
                  <KeyFigures analyses={analyses} />
                </div>
                {warnings.length ? (
                  <p className="mt-2 text-sm font-semibold text-verdict-inconclusive">
                    Calibration overdue on a cited run: {warnings.map((warning) => `${warning.maker} ${warning.model} (due ${warning.calibrationDueOn})`).join(", ")}
                  </p>
                ) : null}
              </li>
            );
          })}
        </ol>
      </section>

    </div>
  );
}
