import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { RequestFulfilForm } from "@/components/request-fulfil-form";
import { RequestStatusBadge } from "@/components/request-status-badge";
import {
  getMeasurementRequest,
  listAnswerableReports,
  listMergedDuplicates,
  listMergeTargets,
} from "@/db/queries/measurement-requests";
import { formatDate } from "@/lib/format";
import { peopleTold } from "@/lib/measurement-requests";
import { requirePagePermission } from "@/lib/session";
import { requestStatusLabels } from "@/lib/request-statuses";
import { MergeForm } from "./_components/merge-form";
import { StatusForm } from "./_components/status-form";

export const metadata: Metadata = { title: "Triage a request" };

// Where a merge lands: the request that absorbed the duplicate, told what the merge did.
const mergeOutcomeSchema = z.object({ merged: z.uuid(), gained: z.coerce.number().int().min(0), told: z.coerce.number().int().min(0) });

export default async function TriageRequestPage({ params, searchParams }: PageProps<"/desk/requests/[id]">) {
  const { id } = await params;
  const mergeOutcome = mergeOutcomeSchema.safeParse(await searchParams);
  const editor = await requirePagePermission("requests:triage", `/desk/requests/${id}`);
  const request = await getMeasurementRequest({ id, viewerId: null });
  if (!request) notFound();
  const merged = request.mergedIntoId !== null;
  const [duplicates, targets, reports] = await Promise.all([
    listMergedDuplicates({ targetId: request.id }),
    merged ? [] : listMergeTargets({ excludeId: request.id }),
    merged ? [] : listAnswerableReports({ viewerId: editor.id, anyAuthor: true }),
  ]);
  const panel = "min-w-0 space-y-3 rounded border border-rule bg-paper-raised p-4";

  return (
    <section className="max-w-3xl space-y-6">
      <p className="text-sm">
        <Link href="/desk/requests" className="text-copper hover:underline">
          ← All requests
        </Link>
      </p>
      <header className="space-y-2">
        <h1 className="font-serif text-3xl">{request.toolName}</h1>
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
          <RequestStatusBadge status={request.status} merged={merged} />
          <span className="figure">
            {request.voteCount} {request.voteCount === 1 ? "vote" : "votes"}
          </span>
          <span>
            · asked by {request.requesterName ?? "a former reader"} on {formatDate(request.createdAt)} ·{" "}
            <Link href={`/requests/${request.id}`} className="text-copper underline">
              public page
            </Link>
          </span>
        </p>
      </header>
      {mergeOutcome.success && duplicates.some((duplicate) => duplicate.id === mergeOutcome.data.merged) ? (
        <p role="status" className="border-l-4 border-verdigris bg-verdigris-wash px-4 py-3 text-sm">
          Merged into this request: it gained {mergeOutcome.data.gained} {mergeOutcome.data.gained === 1 ? "vote" : "votes"};{" "}
          {peopleTold(mergeOutcome.data.told)}.
        </p>
      ) : null}
      <dl className="space-y-3">
        <div>
          <dt className="text-sm font-semibold text-ink-faint">What to measure</dt>
          <dd className="whitespace-pre-line">{request.whatToMeasure}</dd>
        </div>
        <div>
          <dt className="text-sm font-semibold text-ink-faint">Why</dt>
          <dd className="whitespace-pre-line">{request.why}</dd>
        </div>
        {request.declineReason ? (
          <div>
            <dt className="text-sm font-semibold text-ink-faint">Reason given</dt>
            <dd>{request.declineReason}</dd>
          </div>
        ) : null}
        {request.report ? (
          <div>
            <dt className="text-sm font-semibold text-ink-faint">Answered by</dt>
            <dd>
              {request.report.title} <span className="text-ink-faint">({request.report.status})</span>
            </dd>
          </div>
        ) : null}
        {duplicates.length ? (
          <div>
            <dt className="text-sm font-semibold text-ink-faint">Merged into this one</dt>
            <dd>
              <ul className="list-disc pl-5">
                {duplicates.map((duplicate) => (
                  <li key={duplicate.id}>
                    <Link href={`/desk/requests/${duplicate.id}`} className="text-copper underline">
                      {duplicate.toolName}
                    </Link>{" "}
                    — {duplicate.whatToMeasure}
                  </li>
                ))}
              </ul>
            </dd>
          </div>
        ) : null}
      </dl>

      {merged ? (
        <p className="border-l-4 border-verdigris bg-verdigris-wash px-4 py-3 text-sm">
          Merged into{" "}
          <Link href={`/desk/requests/${request.mergedIntoId}`} className="font-semibold underline">
            another request
          </Link>
          ; triage that one.
        </p>
      ) : (
        <div className="grid gap-4 md:grid-cols-2">
          <section aria-labelledby="status-heading" className={panel}>
            <h2 id="status-heading" className="font-serif text-xl">
              Status: {requestStatusLabels[request.status].toLowerCase()}
            </h2>
            <StatusForm requestId={request.id} current={request.status} />
          </section>
          <section aria-labelledby="fulfil-heading" className={panel}>
            <h2 id="fulfil-heading" className="font-serif text-xl">
              Answered by a report
            </h2>
            <RequestFulfilForm requestId={request.id} reports={reports} />
          </section>
          {request.status === "open" || request.status === "planned" ? (
            <section aria-labelledby="merge-heading" className={`${panel} md:col-span-2`}>
              <h2 id="merge-heading" className="font-serif text-xl">
                Merge a duplicate
              </h2>
              <p className="text-sm text-ink-soft">
                If this request asks for what another already asks, merge it into that one: its votes move there (a reader who voted
                for both keeps one vote), it is declined with a note naming the other, and its requester and voters are told.
              </p>
              <MergeForm
                duplicateId={request.id}
                targets={targets.map((target) => ({
                  id: target.id,
                  label: `${target.toolName} — ${truncate(target.whatToMeasure, 60)} (${requestStatusLabels[target.status].toLowerCase()}, ${target.voteCount} votes)`,
                }))}
              />
            </section>
          ) : null}
        </div>
      )}
    </section>
  );
}

function truncate(text: string, length: number): string {
  return text.length > length ? `${text.slice(0, length - 1)}…` : text;
}
