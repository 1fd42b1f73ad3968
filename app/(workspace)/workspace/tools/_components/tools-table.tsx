"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";

export type ToolRow = { slug: string; name: string; kind: string; ratedPowerW: number; ratedVoltage: string; photoCount: number };

const column = createColumnHelper<ToolRow>();

const columns = [
  column.accessor("name", {
    header: "Tool",
    meta: { rowHeader: true },
    cell: ({ row, getValue }) => (
      <Link href={`/workspace/tools/${row.original.slug}/edit`} className="hover:text-copper">
        {getValue()}
      </Link>
    ),
  }),
  column.accessor("kind", { header: "Kind" }),
  column.accessor("ratedPowerW", { header: "Rated power", meta: { numeric: true }, cell: ({ getValue }) => `${getValue()} W` }),
  column.accessor("ratedVoltage", { header: "Rated voltage", meta: { numeric: true } }),
  column.accessor("photoCount", { header: "Photos", meta: { numeric: true }, enableGlobalFilter: false }),
  column.display({
    id: "public-page",
    header: () => <span className="sr-only">Public page</span>,
    cell: ({ row }) => (
      <Link href={`/tools/${row.original.slug}`} className="text-verdigris-deep hover:text-copper">
        Public page<span className="sr-only"> of {row.original.name}</span>
      </Link>
    ),
  }),
];

export function ToolsTable({ tools }: { tools: ToolRow[] }) {
  return (
    <DataTable
      caption="Tools in the catalogue"
      columns={columns}
      data={tools}
      filterLabel="Filter tools"
      filterPlaceholder="Maker, model, kind…"
      emptyMessage="No tools yet."
      initialSorting={[{ id: "name", desc: false }]}
      minWidth="44rem"
      newItem={{ href: "/workspace/tools/new", label: "New tool" }}
    />
  );
}
