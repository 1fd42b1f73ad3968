"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";
import type { ReportStatus } from "@/db/schema";
import { reportStatusLabels } from "./report-status";

export type ReportRow = { id: string; title: string; status: ReportStatus; tools: string; authorName: string; citations: number; updatedOn: string };

const columns: ColumnDef<ReportRow, string | number>[] = [
  {
    accessorKey: "title",
    header: "Report",
    meta: { rowHeader: true },
    cell: ({ row }) => (
      <Link href={`/workspace/reports/${row.original.id}`} className="font-semibold hover:text-copper">
        {row.original.title}
      </Link>
    ),
  },
  { accessorKey: "tools", header: "Tools" },
  { accessorFn: (row) => reportStatusLabels[row.status], id: "status", header: "State" },
  { accessorKey: "authorName", header: "Byline" },
  { accessorKey: "citations", header: "Analyses cited", meta: { numeric: true } },
  { accessorKey: "updatedOn", header: "Last change" },
];

export function ReportsTable({ reports }: { reports: ReportRow[] }) {
  return (
    <DataTable
      caption="Reports"
      columns={columns}
      data={reports}
      filterLabel="Filter reports"
      filterPlaceholder="Title, tool or state"
      emptyMessage="No reports yet."
      initialSorting={[{ id: "updatedOn", desc: true }]}
      actions={
        <Link href="/workspace/reports/new" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
          New report
        </Link>
      }
    />
  );
}
