"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";

export type ProtocolRow = { slug: string; name: string; supply: string; version: number; revisedOn: string; revisedBy: string; revisable: boolean };

const column = createColumnHelper<ProtocolRow>();

const columns = [
  column.accessor("name", {
    header: "Protocol",
    meta: { rowHeader: true },
    cell: ({ row, getValue }) => (
      <Link href={`/workspace/protocols/${row.original.slug}`} className="hover:text-copper">
        {getValue()}
      </Link>
    ),
  }),
  column.accessor("supply", { header: "Supply", meta: { numeric: true } }),
  column.accessor("version", { header: "Latest version", meta: { numeric: true }, cell: ({ getValue }) => `v${getValue()}` }),
  column.accessor("revisedOn", { header: "Revised on", meta: { numeric: true } }),
  column.accessor("revisedBy", { header: "By" }),
  column.display({
    id: "revise",
    header: () => <span className="sr-only">Revise</span>,
    cell: ({ row }) =>
      row.original.revisable ? (
        <Link href={`/workspace/protocols/${row.original.slug}/edit`} className="text-verdigris-deep hover:text-copper">
          Revise<span className="sr-only"> {row.original.name}</span>
        </Link>
      ) : null,
  }),
];

export function ProtocolsTable({ protocols }: { protocols: ProtocolRow[] }) {
  return (
    <DataTable
      caption="Test protocols"
      columns={columns}
      data={protocols}
      filterLabel="Filter protocols"
      filterPlaceholder="Name, supply, author…"
      emptyMessage="No protocols yet."
      initialSorting={[{ id: "name", desc: false }]}
      minWidth="44rem"
      newItem={{ href: "/workspace/protocols/new", label: "New protocol" }}
    />
  );
}
