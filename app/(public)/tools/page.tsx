import type { Metadata } from "next";
import Link from "next/link";
import { loadCatalogueMakers, loadCataloguePage } from "@/lib/catalogue-listing";
import { catalogueQuerySchema, catalogueSearchParams } from "@/lib/validations/catalogue";
import { CatalogueBrowser } from "./_components/catalogue-browser";

export const metadata: Metadata = { title: "Tools" };

/** The query string as zod reads it: one value per name (a repeated name keeps its first). */
function firstValues(raw: Record<string, string | string[] | undefined>): Record<string, string> {
  return Object.fromEntries(Object.entries(raw).flatMap(([name, value]) => (Array.isArray(value) ? (value[0] === undefined ? [] : [[name, value[0]]]) : value === undefined ? [] : [[name, value]])));
}

/**
 * The first page is rendered here from the database; the browser then fetches GET /api/tools as the reader changes
 * filters, sort or page, and keeps them in the address. A query string that does not parse shows the whole
 * catalogue, with the reasons beside the filters.
 */
export default async function ToolsPage({ searchParams }: PageProps<"/tools">) {
  const parsed = catalogueQuerySchema.safeParse(firstValues(await searchParams));
  const query = parsed.success ? parsed.data : catalogueQuerySchema.parse({});
  const [result, makers] = await Promise.all([loadCataloguePage(query), loadCatalogueMakers()]);
  return (
    <div className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-4xl">Tools</h1>
        <p className="font-serif text-lg text-ink-soft">
          Every tool in the catalogue with its ratings as the maker states them, and how many current reports have measured it. Retracted reports are not
          counted. Looking for what a report says? <Link href="/search" className="text-copper underline underline-offset-4">Search the reports</Link>.
        </p>
      </header>
      <CatalogueBrowser initial={{ key: catalogueSearchParams(query).toString(), result }} makers={makers} />
    </div>
  );
}
