import type { Metadata } from "next";
import Link from "next/link";
import { Pager } from "@/components/pager";
import { RequestStatusBadge } from "@/components/request-status-badge";
import { SelectFilter } from "@/components/select-filter";
import { EmptyTableRow } from "@/components/ui/empty-table-row";
import { countMeasurementRequestsByStatus, listMeasurementRequests } from "@/db/queries/measurement-requests";
import { formatDate } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";
import { requestStatuses, requestStatusLabels } from "@/lib/request-statuses";
import { parseRequestListQuery } from "@/lib/validations/measurement-requests";

export const metadata: Metadata = { title: "Request triage" };

const perPage = 50;

export default async function RequestTriagePage({ searchParams }: PageProps<"/desk/requests">) {
  await requirePagePermission("requests:triage", "/desk/requests");
  const { query, problem, hrefFor } = parseRequestListQuery(await searchParams);
  const [{ requests, total }, counts] = await Promise.all([
    listMeasurementRequests({ ...query, perPage, viewerId: null }),
    countMeasurementRequestsByStatus(),
  ]);

  return (
    <section className="space-y-5">
      <h1 className="font-serif text-3xl">Measurement requests: triage</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        Plan what readers want most, decline with a reason, merge duplicates (their votes move, nobody counts twice) and link the
        report that answers a request. Requesters and voters are told of every change by e-mail.
      </p>
      <SelectFilter
        name="status"
        label="Status"
        value={query.status}
        submitLabel="Show"
        problem={problem}
        options={[
          { value: "wanted", label: `Open and planned (${counts.open + counts.planned})` },
          ...requestStatuses.map((status) => ({ value: status, label: `${requestStatusLabels[status]} (${counts[status]})` })),
        ]}
      />

      <div className="overflow-x-auto rounded border border-rule bg-paper-raised">
        <table className="w-full min-w-[44rem] text-left text-sm">
          <caption className="sr-only">Measurement requests, most votes first</caption>
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2 text-right">Votes</th>
              <th scope="col" className="px-3 py-2">Tool</th>
              <th scope="col" className="px-3 py-2">What to measure</th>
              <th scope="col" className="px-3 py-2">Status</th>
              <th scope="col" className="px-3 py-2">Asked</th>
            </tr>
          </thead>
          <tbody>
            {requests.map((request) => (
              <tr key={request.id} className="border-t border-rule align-top">
                <td className="figure px-3 py-2 text-right">{request.voteCount}</td>
                <th scope="row" className="px-3 py-2 font-semibold">
                  <Link href={`/desk/requests/${request.id}`} className="text-copper hover:underline">
                    {request.toolName}
                  </Link>
                </th>
                <td className="max-w-md px-3 py-2">
                  <span className="line-clamp-2">{request.whatToMeasure}</span>
                </td>
                <td className="px-3 py-2">
                  <RequestStatusBadge status={request.status} merged={request.mergedIntoId !== null} />
                </td>
                <td className="figure whitespace-nowrap px-3 py-2">{formatDate(request.createdAt)}</td>
              </tr>
            ))}
            {requests.length === 0 ? (
              <EmptyTableRow columns={5}>No request has this status.</EmptyTableRow>
            ) : null}
          </tbody>
        </table>
      </div>
      <Pager page={query.page} perPage={perPage} total={total} noun={["request", "requests"]} hrefFor={hrefFor} />
    </section>
  );
}
