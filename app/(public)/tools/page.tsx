import type { Metadata } from "next";
import Link from "next/link";
import { listTools } from "@/db/queries/catalogue";
import { formatPrice, formatRatedVoltage, formatRange } from "@/lib/format";
import { catalogueQuerySchema, toolCategories, toolCategoryLabels } from "@/lib/validations/catalogue";

export const metadata: Metadata = { title: "Tools" };

export default async function ToolsPage({ searchParams }: PageProps<"/tools">) {
  const raw = await searchParams;
  const parsed = catalogueQuerySchema.safeParse({
    q: typeof raw.q === "string" && raw.q !== "" ? raw.q : undefined,
    category: typeof raw.category === "string" && raw.category !== "" ? raw.category : undefined,
    page: typeof raw.page === "string" ? raw.page : undefined,
  });
  const query = parsed.success ? parsed.data : catalogueQuerySchema.parse({});
  const { tools, total, page, perPage } = await listTools(query);
  const lastPage = Math.max(1, Math.ceil(total / perPage));

  return (
    <div className="space-y-6">
      <h1 className="font-serif text-3xl">Tools</h1>
      <form className="flex flex-wrap items-end gap-3" role="search">
        <div className="flex flex-col gap-1">
          <label htmlFor="q" className="text-sm font-semibold">
            Maker or model
          </label>
          <input id="q" name="q" defaultValue={query.q ?? ""} className="rounded border border-rule bg-paper-raised px-3 py-2" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="category" className="text-sm font-semibold">
            Kind of tool
          </label>
          <select id="category" name="category" defaultValue={query.category ?? ""} className="rounded border border-rule bg-paper-raised px-3 py-2">
            <option value="">Any</option>
            {toolCategories.map((category) => (
              <option key={category} value={category}>
                {toolCategoryLabels[category]}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised">
          Filter
        </button>
        {!parsed.success ? <p className="text-sm text-copper-deep">{parsed.error.issues[0]?.message}</p> : null}
      </form>

      <div className="overflow-x-auto rounded border border-rule bg-paper-raised">
        <table className="w-full min-w-[44rem] text-left text-sm">
          <caption className="sr-only">Tools with their rated specifications</caption>
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">Tool</th>
              <th scope="col" className="px-3 py-2">Kind</th>
              <th scope="col" className="px-3 py-2 text-right">Rated power</th>
              <th scope="col" className="px-3 py-2">Rated voltage</th>
              <th scope="col" className="px-3 py-2">Temperature</th>
              <th scope="col" className="px-3 py-2 text-right">Price</th>
            </tr>
          </thead>
          <tbody>
            {tools.map((tool) => (
              <tr key={tool.slug} className="border-t border-rule">
                <th scope="row" className="px-3 py-2 font-semibold">
                  <Link href={`/tools/${tool.slug}`} className="hover:text-copper">
                    {tool.maker} {tool.model}
                  </Link>
                </th>
                <td className="px-3 py-2">{toolCategoryLabels[tool.category]}</td>
                <td className="figure px-3 py-2 text-right">{tool.ratedPowerW} W</td>
                <td className="figure px-3 py-2">{formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax)}</td>
                <td className="figure px-3 py-2">{formatRange(tool.temperatureMinC, tool.temperatureMaxC, "°C")}</td>
                <td className="figure px-3 py-2 text-right">{formatPrice(tool.priceMinor, tool.currency)}</td>
              </tr>
            ))}
            {tools.length === 0 ? (
              <tr>
                <td colSpan={6} className="px-3 py-6 text-center text-ink-soft">
                  No tool matches that search.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="flex items-center gap-4 text-sm">
        {page > 1 ? <Link href={{ query: { ...query, page: page - 1 } }}>← Previous</Link> : null}
        <span className="text-ink-faint">
          Page {page} of {lastPage} · {total} tools
        </span>
        {page < lastPage ? <Link href={{ query: { ...query, page: page + 1 } }}>Next →</Link> : null}
      </nav>
    </div>
  );
}
