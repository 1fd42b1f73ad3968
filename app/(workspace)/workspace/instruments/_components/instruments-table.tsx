"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";

export type InstrumentRow = {
  id: string;
  name: string;
  kind: string;
  serialNumber: string;
  lab: string;
  accuracy: string;
  calibrationDueOn: string;
  overdue: boolean;
  editable: boolean;
};

const column = createColumnHelper<InstrumentRow>();

const columns = [
  column.accessor("name", {
    header: "Instrument",
    meta: { rowHeader: true },
    cell: ({ row, getValue }) =>
      row.original.editable ? (
        <Link href={`/workspace/instruments/${row.original.id}/edit`} className="hover:text-copper">
          {getValue()}
        </Link>
      ) : (
        getValue()
      ),
  }),
  column.accessor("kind", { header: "Kind" }),
  column.accessor("serialNumber", { header: "Serial", cell: ({ getValue }) => <span className="figure">{getValue()}</span> }),
  column.accessor("lab", { header: "Lab" }),
  column.accessor("accuracy", { header: "Accuracy", enableSorting: false, cell: ({ getValue }) => <span className="figure whitespace-pre-line text-xs">{getValue()}</span> }),
  column.accessor("calibrationDueOn", {
    header: "Calibration due",
    cell: ({ row, getValue }) => (
      <span className="flex flex-wrap items-center gap-2">
        <span className="figure">{getValue()}</span>
        {row.original.overdue ? (
          <span className="rounded border border-copper bg-copper-wash px-1.5 py-0.5 text-xs font-semibold text-copper-deep">Calibration overdue</span>
        ) : null}
      </span>
    ),
  }),
];

export function InstrumentsTable({ instruments }: { instruments: InstrumentRow[] }) {
  return (
    <DataTable
      caption="Instruments register"
      columns={columns}
      data={instruments}
      filterLabel="Filter instruments"
      filterPlaceholder="Kind, maker, serial, lab…"
      emptyMessage="No instruments registered yet."
      initialSorting={[{ id: "calibrationDueOn", desc: false }]}
      minWidth="56rem"
      newItem={{ href: "/workspace/instruments/new", label: "New instrument" }}
    />
  );
}
