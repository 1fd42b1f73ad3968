"use client";

import { createColumnHelper, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useEffect, useMemo, useState, type FormEvent } from "react";
import { DataTable } from "@/components/data-table";
import { SelectField, TextField } from "@/components/ui/form-controls";
import type { ToolSpec } from "@/db/queries/catalogue";
import { formatDate, formatPrice, formatRatedVoltage } from "@/lib/format";
import { fieldErrorsOf } from "@/lib/form-data";
import {
  catalogueQuerySchema,
  catalogueSearchParams,
  catalogueSorts,
  defaultSortOrder,
  publishedResultChoices,
  publishedResultLabels,
  toolCategories,
  toolCategoryLabels,
  voltageBandLabels,
  voltageBands,
  type CatalogueQuery,
  type CatalogueSort,
} from "@/lib/validations/catalogue";

export type CataloguePage = { tools: ToolSpec[]; total: number; page: number; perPage: number };
type Maker = { slug: string; name: string };
type FieldErrors = Record<string, string[]>;

/** The filter form's fields as typed: text until applied, so a half-typed number is not thrown away. */
type FilterDraft = Record<"q" | "category" | "maker" | "minPowerW" | "maxPowerW" | "voltage" | "published", string>;

function draftOf(query: CatalogueQuery): FilterDraft {
  return {
    q: query.q ?? "",
    category: query.category ?? "",
    maker: query.maker ?? "",
    minPowerW: query.minPowerW === null ? "" : String(query.minPowerW),
    maxPowerW: query.maxPowerW === null ? "" : String(query.maxPowerW),
    voltage: query.voltage ?? "",
    published: query.published ?? "",
  };
}

const filterNames = ["q", "category", "maker", "minPowerW", "maxPowerW", "voltage", "published"] as const satisfies (keyof FilterDraft)[];

/**
 * The address's query, or the whole catalogue when the address does not parse: then the form shows what the address
 * said, with the reasons beside the fields (and above them for sort and page, which have no field).
 */
function readAddress(params: URLSearchParams): { query: CatalogueQuery; draft: FilterDraft; problems: FieldErrors } {
  const parsed = catalogueQuerySchema.safeParse(Object.fromEntries(params.entries()));
  if (parsed.success) return { query: parsed.data, draft: draftOf(parsed.data), problems: {} };
  const draft = Object.fromEntries(filterNames.map((name) => [name, params.get(name) ?? ""])) as FilterDraft;
  return { query: catalogueQuerySchema.parse({}), draft, problems: fieldErrorsOf(parsed.error) };
}

function isSort(id: string): id is CatalogueSort {
  return (catalogueSorts as readonly string[]).includes(id);
}

const powerFields = [
  ["minPowerW", "Rated power from (W)"],
  ["maxPowerW", "Rated power up to (W)"],
] as const satisfies [keyof FilterDraft, string][];

const column = createColumnHelper<ToolSpec>();

const columns = [
  column.accessor((tool) => `${tool.maker} ${tool.model}`, {
    id: "name" satisfies CatalogueSort,
    header: "Tool",
    meta: { rowHeader: true },
    cell: ({ row, getValue }) => (
      <Link href={`/tools/${row.original.slug}`} className="hover:text-copper">
        {getValue()}
      </Link>
    ),
  }),
  column.accessor("category", { header: "Kind", enableSorting: false, cell: ({ getValue }) => toolCategoryLabels[getValue()] }),
  column.accessor("ratedPowerW", {
    id: "ratedPower" satisfies CatalogueSort,
    header: "Rated power",
    meta: { numeric: true },
    cell: ({ getValue }) => `${getValue()} W`,
  }),
  column.accessor((tool) => formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax), {
    id: "ratedVoltage",
    header: "Rated voltage",
    meta: { numeric: true },
    enableSorting: false,
  }),
  column.accessor("priceMinor", {
    id: "price" satisfies CatalogueSort,
    header: "Price",
    meta: { numeric: true },
    cell: ({ row }) => formatPrice(row.original.priceMinor, row.original.currency),
  }),
  column.accessor("publishedReports", { header: "Reports", meta: { numeric: true }, enableSorting: false }),
  column.accessor("newestResultAt", {
    id: "newestResult" satisfies CatalogueSort,
    header: "Newest result",
    meta: { numeric: true },
    sortDescFirst: true,
    cell: ({ getValue }) => {
      const at = getValue();
      return at ? <time dateTime={at}>{formatDate(new Date(at))}</time> : <span className="text-ink-faint">none yet</span>;
    },
  }),
];

/**
 * The catalogue's filters and table. The address is the state: filtering, sorting and paging push a new address
 * (so it can be shared, and Back undoes it), and whenever the address asks for other rows than those shown, they are
 * fetched from GET /api/tools.
 */
export function CatalogueBrowser({ initial, makers }: { initial: { key: string; result: CataloguePage }; makers: Maker[] }) {
  const searchParams = useSearchParams();
  const address = useMemo(() => readAddress(new URLSearchParams(searchParams.toString())), [searchParams]);
  const { query } = address;
  const wantedKey = catalogueSearchParams(query).toString();

  const [loaded, setLoaded] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [serverProblems, setServerProblems] = useState<FieldErrors>({});
  const [draft, setDraft] = useState(address.draft);
  const [draftProblems, setDraftProblems] = useState<FieldErrors>({});
  const [draftKey, setDraftKey] = useState(wantedKey);
  // Back and Forward change the address under the form: show what that address asks for.
  if (draftKey !== wantedKey) {
    setDraftKey(wantedKey);
    setDraft(address.draft);
    setDraftProblems({});
  }

  useEffect(() => {
    if (wantedKey === loaded.key) return;
    const controller = new AbortController();
    setBusy(true);
    (async () => {
      try {
        const response = await fetch(`/api/tools?${wantedKey}`, { signal: controller.signal, headers: { Accept: "application/json" } });
        if (response.status === 422) {
          const body = (await response.json()) as { error?: { fieldErrors?: FieldErrors } };
          setServerProblems(body.error?.fieldErrors ?? {});
          setFailure("Some filters were refused; see the notes beside them.");
          return;
        }
        if (!response.ok) throw new Error(`GET /api/tools answered ${response.status}`);
        const tools = (await response.json()) as ToolSpec[];
        const header = (name: string, fallback: number) => Number(response.headers.get(name) ?? fallback);
        setLoaded({
          key: wantedKey,
          result: { tools, total: header("X-Total-Count", tools.length), page: header("X-Page", query.page), perPage: header("X-Per-Page", query.perPage) },
        });
        setServerProblems({});
        setFailure(null);
      } catch (error) {
        if (controller.signal.aborted) return;
        console.error(error);
        setFailure("The catalogue could not be loaded. Check the connection and try again.");
      } finally {
        if (!controller.signal.aborted) setBusy(false);
      }
    })();
    return () => controller.abort();
  }, [wantedKey, loaded.key, query.page, query.perPage]);

  function go(next: CatalogueQuery) {
    const params = catalogueSearchParams(next).toString();
    window.history.pushState(null, "", params ? `/tools?${params}` : "/tools");
  }

  function applyFilters(values: FilterDraft) {
    const parsed = catalogueQuerySchema.safeParse({ ...values, sort: query.sort, order: query.order, perPage: query.perPage });
    if (!parsed.success) {
      setDraftProblems(fieldErrorsOf(parsed.error));
      return;
    }
    setDraftProblems({});
    go({ ...parsed.data, page: 1 });
  }

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    applyFilters(draft);
  }

  /** A choice from a list applies at once; typed text and numbers wait for the button or Enter. */
  function choose(name: keyof FilterDraft, value: string) {
    const next = { ...draft, [name]: value };
    setDraft(next);
    applyFilters(next);
  }

  function type(name: keyof FilterDraft, value: string) {
    setDraft({ ...draft, [name]: value });
  }

  function sortBy(sorting: SortingState) {
    const chosen = sorting[0];
    if (!chosen || !isSort(chosen.id)) return;
    const order = chosen.desc ? "desc" : "asc";
    go({ ...query, sort: chosen.id, order: order === defaultSortOrder(chosen.id) ? undefined : order, page: 1 });
  }

  const problems = { ...address.problems, ...serverProblems, ...draftProblems };
  const addressProblems = Object.entries(address.problems)
    .filter(([name]) => !(filterNames as readonly string[]).includes(name))
    .flatMap(([, messages]) => messages);
  const order = query.order ?? defaultSortOrder(query.sort);
  const { result } = loaded;
  const filtered = Object.values(draftOf(query)).some(Boolean);

  return (
    <div className="space-y-4">
      {addressProblems.length ? (
        <p className="rounded border border-copper bg-copper-wash px-3 py-2 text-sm text-copper-deep">
          Part of this address could not be read, so the whole catalogue is shown: {addressProblems.join(" ")}
        </p>
      ) : null}
      <form role="search" aria-label="Filter the catalogue" action="/tools" method="get" onSubmit={onSubmit} className="space-y-3 rounded border border-rule bg-paper-sunk p-4">
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <TextField label="Maker or model" name="q" type="search" value={draft.q} onChange={(event) => type("q", event.target.value)} errors={problems} />
          <SelectField label="Kind of tool" name="category" value={draft.category} onChange={(event) => choose("category", event.target.value)} errors={problems}>
            <option value="">Any kind</option>
            {toolCategories.map((category) => (
              <option key={category} value={category}>
                {toolCategoryLabels[category]}
              </option>
            ))}
          </SelectField>
          <SelectField label="Maker" name="maker" value={draft.maker} onChange={(event) => choose("maker", event.target.value)} errors={problems}>
            <option value="">Any maker</option>
            {makers.map((maker) => (
              <option key={maker.slug} value={maker.slug}>
                {maker.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Rated for" name="voltage" value={draft.voltage} onChange={(event) => choose("voltage", event.target.value)} errors={problems}>
            <option value="">Any supply</option>
            {(Object.keys(voltageBands) as (keyof typeof voltageBands)[]).map((band) => (
              <option key={band} value={band}>
                {voltageBandLabels[band]}
              </option>
            ))}
          </SelectField>
          <div className="grid grid-cols-2 gap-3 sm:col-span-2">
            {powerFields.map(([name, label]) => (
              <TextField key={name} label={label} name={name} inputMode="numeric" value={draft[name]} onChange={(event) => type(name, event.target.value)} errors={problems} />
            ))}
          </div>
          <SelectField label="Published results" name="published" value={draft.published} onChange={(event) => choose("published", event.target.value)} errors={problems}>
            <option value="">Tested or not</option>
            {publishedResultChoices.map((choice) => (
              <option key={choice} value={choice}>
                {publishedResultLabels[choice]}
              </option>
            ))}
          </SelectField>
          {/* Without JavaScript the form still works as a plain GET, keeping the chosen order. */}
          {query.sort !== "name" ? <input type="hidden" name="sort" value={query.sort} /> : null}
          {query.order ? <input type="hidden" name="order" value={query.order} /> : null}
          <div className="flex items-end gap-3">
            <button type="submit" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
              Apply filters
            </button>
            {filtered ? (
              <Link
                href="/tools"
                onClick={(event) => {
                  event.preventDefault();
                  go(catalogueQuerySchema.parse({}));
                }}
                className="py-2 text-sm font-semibold text-copper underline underline-offset-4"
              >
                Clear filters
              </Link>
            ) : null}
          </div>
        </div>
      </form>

      <p role="status" className="min-h-5 text-sm text-copper-deep">
        {busy ? <span className="text-ink-soft">Loading tools…</span> : failure}
      </p>

      <DataTable
        caption={`Tools in the catalogue, sorted by ${sortLabels[query.sort]}, ${order === "asc" ? "ascending" : "descending"}`}
        columns={columns}
        data={result.tools}
        getRowId={(tool) => tool.slug}
        emptyMessage="No tool matches these filters."
        minWidth="50rem"
        rowNoun={["tool", "tools"]}
        serverSide={{
          sorting: [{ id: query.sort, desc: order === "desc" }],
          onSortingChange: sortBy,
          pageIndex: result.page - 1,
          pageSize: result.perPage,
          rowCount: result.total,
          onPageChange: (pageIndex) => go({ ...query, page: pageIndex + 1 }),
          busy,
        }}
      />
      <p className="text-xs text-ink-faint">Prices are as the maker lists them, in their own currency; sorting by price orders them within each currency.</p>
    </div>
  );
}

const sortLabels: Record<CatalogueSort, string> = { name: "name", ratedPower: "rated power", price: "price", newestResult: "newest result" };
