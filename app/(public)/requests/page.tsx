import type { Metadata } from "next";
import Link from "next/link";
import { Pager } from "@/components/pager";
import { RequestStatusBadge } from "@/components/request-status-badge";
import { countMeasurementRequestsByStatus, listMeasurementRequests } from "@/db/queries/measurement-requests";
import { can } from "@/lib/authz";
import { formatDate } from "@/lib/format";
import { getCurrentUser } from "@/lib/session";
import { requestStatuses, requestStatusLabels } from "@/lib/request-statuses";
import { requestLimits, parseRequestListQuery } from "@/lib/validations/measurement-requests";
import { VoteTally } from "./_components/vote-tally";

export const metadata: Metadata = { title: "Measurement requests" };

export default async function RequestsPage({ searchParams }: PageProps<"/requests">) {
  const { query, problem, hrefFor } = parseRequestListQuery(await searchParams);
  const user = await getCurrentUser();
  const perPage = requestLimits.listPageSize;
  const [{ requests, total }, counts] = await Promise.all([
    listMeasurementRequests({ ...query, perPage, viewerId: user?.id ?? null }),
    countMeasurementRequestsByStatus(),
  ]);
  const filters = [
    { status: "wanted", label: "Most wanted", count: counts.open + counts.planned },
    ...requestStatuses.map((status) => ({ status, label: requestStatusLabels[status], count: counts[status] })),
  ];

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-2xl space-y-2">
          <h1 className="font-serif text-3xl">Measurement requests</h1>
          <p className="text-ink-soft">
            What readers want put on the bench. Vote for the measurements you want to see; editors plan the most wanted, and the
            request links to the report that answers it.
          </p>
        </div>
        {can(user?.role, "requests:ask") ? (
          <Link href="/requests/new" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
            Ask for a measurement
          </Link>
        ) : (
          <Link href="/sign-in?callbackUrl=%2Frequests%2Fnew" className="rounded border border-ink px-4 py-2 font-semibold hover:bg-ink hover:text-paper-raised">
            Sign in to ask for a measurement
          </Link>
        )}
      </header>

      <nav aria-label="Requests by status">
        <ul className="flex flex-wrap gap-2 text-sm">
          {filters.map((filter) => {
            const current = filter.status === query.status;
            return (
              <li key={filter.status}>
                <Link
                  href={filter.status === "wanted" ? "/requests" : `/requests?status=${filter.status}`}
                  aria-current={current ? "page" : undefined}
                  className={`inline-block rounded-full border px-3 py-1 ${current ? "border-ink bg-ink text-paper-raised" : "border-rule bg-paper-raised hover:border-ink"}`}
                >
                  {filter.label} <span className="figure">{filter.count}</span>
                </Link>
              </li>
            );
          })}
        </ul>
        {problem ? <p className="mt-2 text-sm text-copper-deep">{problem}</p> : null}
      </nav>

      {requests.length === 0 ? (
        <p className="rounded border border-rule bg-paper-raised px-4 py-6 text-center text-ink-soft">No request has this status yet.</p>
      ) : (
        <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised">
          {requests.map((request) => (
            <li key={request.id} className="flex gap-4 px-4 py-3">
              <VoteTally request={request} signedIn={Boolean(user)} />
              <div className="min-w-0 flex-1 space-y-1">
                <div className="flex flex-wrap items-center gap-2">
                  <h2 className="font-serif text-lg">
                    <Link href={`/requests/${request.id}`} className="hover:text-copper">
                      {request.toolName}
                    </Link>
                  </h2>
                  <RequestStatusBadge status={request.status} merged={request.mergedIntoId !== null} />
                </div>
                <p className="line-clamp-2 text-sm text-ink-soft">{request.whatToMeasure}</p>
                <p className="text-xs text-ink-faint">Asked {formatDate(request.createdAt)}</p>
              </div>
            </li>
          ))}
        </ol>
      )}

      <Pager page={query.page} perPage={perPage} total={total} noun={["request", "requests"]} hrefFor={hrefFor} />
    </div>
  );
}
