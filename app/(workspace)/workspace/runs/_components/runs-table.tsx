"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";

export type RunRow = {
  id: string;
  testedOn: string;
  toolName: string;
  labName: string;
  protocol: string;
  reviewerName: string;
  serialNumber: string;
  calibrationOverdue: boolean;
};

const column = createColumnHelper<RunRow>();

const columns = [
  column.accessor("toolName", {
    header: "Tool",
    meta: { rowHeader: true },
    cell: ({ row, getValue }) => (
      <Link href={`/workspace/runs/${row.original.id}`} className="hover:text-copper">
        {getValue()}
      </Link>
    ),
  }),
  column.accessor("testedOn", { header: "Tested on", cell: ({ getValue }) => <span className="figure whitespace-nowrap">{getValue()}</span> }),
  column.accessor("serialNumber", { header: "Unit serial" }),
  column.accessor("labName", { header: "Lab" }),
  column.accessor("protocol", { header: "Protocol" }),
  column.accessor("reviewerName", { header: "Reviewer" }),
  column.accessor("calibrationOverdue", {
    header: "Calibration",
    cell: ({ getValue }) =>
      getValue() ? <span className="font-semibold text-copper-deep">Overdue instrument</span> : <span className="text-ink-faint">In date</span>,
    enableGlobalFilter: false,
  }),
];

export function RunsTable({ runs }: { runs: RunRow[] }) {
  return (
    <DataTable
      caption="Test runs"
      columns={columns}
      data={runs}
      filterLabel="Filter runs"
      filterPlaceholder="Tool, lab, serial…"
      emptyMessage="No runs yet: start one with a tool on the bench."
      initialSorting={[{ id: "testedOn", desc: true }]}
      minWidth="52rem"
      actions={
        <Link href="/workspace/runs/new" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
          New run
        </Link>
      }
    />
  );
}
