import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RequestFulfilForm } from "@/components/request-fulfil-form";
import { RequestStatusBadge } from "@/components/request-status-badge";
import {
  getMeasurementRequest,
  listAnswerableReports,
  listMergedDuplicates,
  listRequestHistory,
} from "@/db/queries/measurement-requests";
import { can } from "@/lib/authz";
import { formatDate } from "@/lib/format";
import { getCurrentUser } from "@/lib/session";
import { requestStatusLabels, type RequestStatusName } from "@/lib/request-statuses";
import { VoteTally } from "../_components/vote-tally";

export async function generateMetadata({ params }: PageProps<"/requests/[id]">): Promise<Metadata> {
  const request = await getMeasurementRequest({ id: (await params).id, viewerId: null });
  return { title: request ? `Request: ${request.toolName}` : "Request not found" };
}

// The audit log holds each change; readers see what happened and when, not who on the desk did it.
function describeHistoryEntry(action: string, details: Record<string, unknown>): string {
  if (action === "request.merged") return "Merged into another request, with its votes";
  const to = details.to as RequestStatusName | undefined;
  const reason = typeof details.reason === "string" ? `: ${details.reason}` : "";
  return to ? `${requestStatusLabels[to]}${to === "declined" ? reason : ""}` : "Status changed";
}

export default async function RequestPage({ params }: PageProps<"/requests/[id]">) {
  const { id } = await params;
  const user = await getCurrentUser();
  const request = await getMeasurementRequest({ id, viewerId: user?.id ?? null });
  if (!request) notFound();
  const mayFulfil = can(user?.role, "requests:fulfil") && request.mergedIntoId === null && request.status !== "declined";
  const [merged, history, mergedInto, answerable] = await Promise.all([
    listMergedDuplicates({ targetId: request.id }),
    listRequestHistory({ requestId: request.id }),
    request.mergedIntoId ? getMeasurementRequest({ id: request.mergedIntoId, viewerId: null }) : null,
    user && mayFulfil ? listAnswerableReports({ viewerId: user.id, anyAuthor: can(user.role, "workspace:edit-any") }) : [],
  ]);

  return (
    <article className="max-w-3xl space-y-8">
      <p className="text-sm">
        <Link href="/requests" className="text-copper hover:underline">
          ← All measurement requests
        </Link>
      </p>
      <header className="flex gap-4">
        <VoteTally request={request} signedIn={Boolean(user)} />
        <div className="space-y-2">
          <p className="text-sm font-semibold uppercase tracking-widest text-copper">Measurement request</p>
          <h1 className="font-serif text-3xl sm:text-4xl">
            {request.toolSlug ? (
              <Link href={`/tools/${request.toolSlug}`} className="hover:text-copper">
                {request.toolName}
              </Link>
            ) : (
              request.toolName
            )}
          </h1>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
            <RequestStatusBadge status={request.status} merged={request.mergedIntoId !== null} />
            <span>
              Asked by {request.requesterName ?? "a former reader"} on {formatDate(request.createdAt)}
              {request.toolSlug ? "" : " · not in the catalogue yet"}
            </span>
          </p>
        </div>
      </header>

      {mergedInto ? (
        <p className="border-l-4 border-verdigris bg-verdigris-wash px-4 py-3 text-sm">
          This request asked for the same as another, so it was merged into{" "}
          <Link href={`/requests/${mergedInto.id}`} className="font-semibold text-verdigris-deep underline">
            the request for {mergedInto.toolName}
          </Link>
          . Its votes count there now.
        </p>
      ) : null}
      {request.status === "declined" && !mergedInto && request.declineReason ? (
        <p className="border-l-4 border-rule bg-paper-sunk px-4 py-3 text-sm">
          <strong className="font-semibold">Declined.</strong> {request.declineReason}
        </p>
      ) : null}
      {request.status === "measured" && request.report ? (
        <p className="border-l-4 border-verdict-meets bg-paper-raised px-4 py-3 text-sm">
          <strong className="font-semibold">Measured.</strong>{" "}
          {request.report.status === "published" ? (
            <>
              The answer is in{" "}
              <Link href={`/reports/${request.report.slug}`} className="font-semibold text-copper underline">
                {request.report.title}
              </Link>
              .
            </>
          ) : (
            "The report that answers it is with the editors and is linked here once published."
          )}
        </p>
      ) : null}

      <dl className="space-y-4">
        <div>
          <dt className="text-sm font-semibold uppercase tracking-wide text-ink-faint">What to measure</dt>
          <dd className="whitespace-pre-line font-serif text-lg">{request.whatToMeasure}</dd>
        </div>
        <div>
          <dt className="text-sm font-semibold uppercase tracking-wide text-ink-faint">Why it matters</dt>
          <dd className="whitespace-pre-line font-serif text-lg">{request.why}</dd>
        </div>
      </dl>

      {merged.length ? (
        <section aria-labelledby="merged-heading" className="space-y-2">
          <h2 id="merged-heading" className="font-serif text-2xl">
            Merged into this one
          </h2>
          <ul className="divide-y divide-rule rounded border border-rule bg-paper-raised">
            {merged.map((duplicate) => (
              <li key={duplicate.id} className="px-4 py-2 text-sm">
                <Link href={`/requests/${duplicate.id}`} className="font-semibold hover:text-copper">
                  {duplicate.toolName}
                </Link>{" "}
                <span className="text-ink-soft">— {duplicate.whatToMeasure}</span>{" "}
                <span className="text-xs text-ink-faint">(asked {formatDate(duplicate.createdAt)})</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="history-heading" className="space-y-2">
        <h2 id="history-heading" className="font-serif text-2xl">
          History
        </h2>
        <ol className="space-y-1 border-l-2 border-rule pl-4 text-sm">
          <li>
            <span className="figure text-ink-faint">{formatDate(request.createdAt)}</span> Asked
          </li>
          {history.map((entry) => (
            <li key={entry.id}>
              <span className="figure text-ink-faint">{formatDate(entry.createdAt)}</span> {describeHistoryEntry(entry.action, entry.details)}
            </li>
          ))}
        </ol>
      </section>

      {user && mayFulfil ? (
        <section aria-labelledby="fulfil-heading" className="space-y-3 rounded border border-rule bg-paper-raised p-4">
          <h2 id="fulfil-heading" className="font-serif text-xl">
            Answered by a report?
          </h2>
          <p className="text-sm text-ink-soft">
            Link the report that measures what was asked. The request becomes measured, and its requester and voters are told by
            e-mail.
          </p>
          <RequestFulfilForm requestId={request.id} reports={answerable} />
        </section>
      ) : null}
    </article>
  );
}
