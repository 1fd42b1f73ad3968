import { createColumnHelper } from "@tanstack/react-table";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { DataTable } from "@/components/data-table";

type Row = { name: string; watts: number };
const column = createColumnHelper<Row>();
const columns = [
  column.accessor("name", { header: "Tool", meta: { rowHeader: true } }),
  column.accessor("watts", { header: "Rated power", meta: { numeric: true } }),
];
const rows: Row[] = Array.from({ length: 25 }, (_, index) => ({ name: `Station ${String(index + 1).padStart(2, "0")}`, watts: 100 + index }));

function render(props: Partial<Parameters<typeof DataTable<Row>>[0]> = {}) {
  return renderToStaticMarkup(createElement(DataTable<Row>, { caption: "Stations", columns, data: rows, filterLabel: "Filter stations", ...props }));
}

describe("DataTable", () => {
  it("is a captioned table with column headers, row headers and a labelled filter", () => {
    const html = render();
    expect(html).toContain('<caption class="sr-only">Stations</caption>');
    expect(html.match(/<th scope="col"/g)).toHaveLength(2);
    expect(html.match(/<th scope="row"/g)).toHaveLength(20);
    const filterId = /<label for="([^"]+)"[^>]*>Filter stations<\/label>/.exec(html)?.[1];
    expect(filterId).toBeDefined();
    expect(html).toContain(`id="${filterId}" type="search"`);
  });

  it("marks sortable headers with aria-sort and shows the first page in the initial order", () => {
    const html = render({ initialSorting: [{ id: "watts", desc: true }] });
    expect(html).toMatch(/<th scope="col" colSpan="1" aria-sort="none"[^>]*><button/);
    expect(html).toMatch(/<th scope="col" colSpan="1" aria-sort="descending"/);
    expect(html.indexOf("Station 25")).toBeLessThan(html.indexOf("Station 24"));
    expect(html).not.toContain("Station 05");
    expect(html).toContain("Page 1 of 2 · 25 rows");
  });

  it("says so when there is nothing to show", () => {
    expect(render({ data: [], emptyMessage: "No stations yet." })).toContain("No stations yet.");
  });
});
