import type { Metadata } from "next";
import Link from "next/link";
import { Pager } from "@/components/pager";
import { SelectFilter } from "@/components/select-filter";
import { EmptyTableRow } from "@/components/ui/empty-table-row";
import { listAuditEntries } from "@/db/queries/audit";
import { auditActionLabels, auditLogQuerySchema, auditSubjectLabels } from "@/lib/audit";
import { formatDateTime } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Audit log" };

const perPage = 50;

const subjectPages: Partial<Record<string, (id: string) => string>> = {
  measurement_request: (id) => `/desk/requests/${id}`,
  report: (id) => `/desk/reports/${id}`,
  comment: () => "/desk/comments",
};

function labelOf<T extends Record<string, string>>(labels: T, key: string): string {
  return Object.hasOwn(labels, key) ? labels[key as keyof T]! : key;
}

function describeDetail(value: unknown): string {
  if (value === null || value === undefined) return "—";
  return typeof value === "object" ? JSON.stringify(value) : String(value);
}

export default async function AuditLogPage({ searchParams }: PageProps<"/desk/audit">) {
  await requirePagePermission("audit:read", "/desk/audit");
  const raw = await searchParams;
  const parsed = auditLogQuerySchema.safeParse({
    action: typeof raw.action === "string" && raw.action !== "" ? raw.action : undefined,
    page: typeof raw.page === "string" ? raw.page : undefined,
  });
  const query = parsed.success ? parsed.data : auditLogQuerySchema.parse({});
  const { entries, total } = await listAuditEntries({ ...query, perPage });

  return (
    <section className="space-y-5">
      <h1 className="font-serif text-3xl">Audit log</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        Every editorial, moderation and account action, newest first. Each entry was written in the same transaction as the change it
        records.
      </p>
      <SelectFilter
        name="action"
        label="Action"
        value={query.action ?? ""}
        problem={parsed.success ? null : parsed.error.issues[0]?.message}
        options={[{ value: "", label: "Every action" }, ...Object.entries(auditActionLabels).map(([value, label]) => ({ value, label }))]}
      />

      <div className="overflow-x-auto rounded border border-rule bg-paper-raised">
        <table className="w-full min-w-[52rem] text-left text-sm">
          <caption className="sr-only">Audit log entries, newest first</caption>
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">When</th>
              <th scope="col" className="px-3 py-2">Who</th>
              <th scope="col" className="px-3 py-2">Action</th>
              <th scope="col" className="px-3 py-2">Subject</th>
              <th scope="col" className="px-3 py-2">Details</th>
            </tr>
          </thead>
          <tbody>
            {entries.map((entry) => {
              const subjectPage = entry.subjectId ? subjectPages[entry.subjectType]?.(entry.subjectId) : undefined;
              const subjectLabel = [labelOf(auditSubjectLabels, entry.subjectType), entry.subjectAccountName].filter(Boolean).join(": ");
              return (
                <tr key={entry.id} className="border-t border-rule align-top">
                  <td className="figure whitespace-nowrap px-3 py-2">{formatDateTime(entry.createdAt)}</td>
                  <td className="px-3 py-2">
                    {entry.actorName ? (
                      <>
                        {entry.actorName} <span className="text-ink-faint">· {entry.actorRole}</span>
                      </>
                    ) : (
                      <span className="text-ink-faint">a deleted account</span>
                    )}
                  </td>
                  <th scope="row" className="px-3 py-2 font-semibold">
                    {labelOf(auditActionLabels, entry.action)}
                  </th>
                  <td className="px-3 py-2">
                    {subjectPage ? (
                      <Link href={subjectPage} className="text-copper underline">
                        {subjectLabel}
                      </Link>
                    ) : (
                      subjectLabel
                    )}
                  </td>
                  <td className="px-3 py-2">
                    <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-xs">
                      {Object.entries(entry.details).map(([key, value]) => (
                        <div key={key} className="contents">
                          <dt className="text-ink-faint">{key}</dt>
                          <dd className="figure wrap-anywhere">{describeDetail(value)}</dd>
                        </div>
                      ))}
                    </dl>
                  </td>
                </tr>
              );
            })}
            {entries.length === 0 ? (
              <EmptyTableRow columns={5}>Nothing recorded{query.action ? " for this action" : ""} yet.</EmptyTableRow>
            ) : null}
          </tbody>
        </table>
      </div>
      <Pager
        page={query.page}
        perPage={perPage}
        total={total}
        noun={["entry", "entries"]}
        hrefFor={(page) => ({ query: { ...(query.action ? { action: query.action } : {}), page } })}
      />
    </section>
  );
}
