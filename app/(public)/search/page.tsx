import type { Metadata } from "next";
import Link from "next/link";
import { Pager } from "@/components/pager";
import { TextField } from "@/components/ui/form-controls";
import { loadReportSearch } from "@/lib/catalogue-listing";
import { formatDate } from "@/lib/format";
import { fieldErrorsOf } from "@/lib/form-data";
import { revisionKindLabels } from "@/lib/validations/editorial";
import { reportSearchSchema } from "@/lib/validations/search";
import { MarkedText } from "./_components/marked-text";

export async function generateMetadata({ searchParams }: PageProps<"/search">): Promise<Metadata> {
  const { q } = await searchParams;
  return { title: typeof q === "string" && q.trim() ? `Search: ${q.trim().slice(0, 60)}` : "Search the reports" };
}

/** Full-text search over what readers can read: each published report's current revision, never a draft. */
export default async function SearchPage({ searchParams }: PageProps<"/search">) {
  const raw = await searchParams;
  const parsed = reportSearchSchema.safeParse({ q: typeof raw.q === "string" ? raw.q : undefined, page: typeof raw.page === "string" ? raw.page : undefined });
  const search = parsed.success ? parsed.data : reportSearchSchema.parse({});
  const problems = parsed.success ? undefined : fieldErrorsOf(parsed.error, "q");
  const { hits, total, page, perPage } = await loadReportSearch(search);
  const typed = typeof raw.q === "string" ? raw.q : "";

  return (
    <div className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-4xl">Search the reports</h1>
        <p className="font-serif text-lg text-ink-soft">
          Looks through the title, the tools and the text of every published report as it reads now, corrections included. Retracted reports still show, marked.
        </p>
      </header>

      <form role="search" action="/search" method="get" className="flex flex-wrap items-start gap-3">
        <div className="w-full max-w-xl">
          <TextField
            label="Words to look for"
            name="q"
            type="search"
            defaultValue={typed}
            maxLength={200}
            errors={problems}
            hint={<>Words match their other forms (measure, measured). Put a phrase in &quot;quotes&quot;, write or between alternatives, and a minus before a word to leave it out.</>}
          />
        </div>
        <button type="submit" className="mt-7 rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
          Search
        </button>
      </form>

      {search.q ? (
        <section aria-labelledby="results-heading" className="space-y-4">
          <h2 id="results-heading" className="font-serif text-2xl">
            {total === 0 ? "No report matches" : `${total} ${total === 1 ? "report matches" : "reports match"}`} “{search.q}”
          </h2>
          {total === 0 ? (
            <p className="text-ink-soft">
              Try fewer or other words, or browse <Link href="/reports" className="text-copper underline underline-offset-4">every report</Link>.
            </p>
          ) : (
            <ol className="space-y-4">
              {hits.map((hit) => (
                <li key={hit.slug} className="space-y-2 rounded border border-rule bg-paper-raised p-4">
                  <p className="text-xs uppercase tracking-wide text-ink-faint">{hit.toolNames.join(" vs ")}</p>
                  <h3 className="font-serif text-xl">
                    <Link href={`/reports/${hit.slug}`} className="hover:text-copper">
                      <MarkedText text={hit.markedTitle} />
                    </Link>
                  </h3>
                  <p className="text-sm text-ink-soft">
                    By {hit.authorName}
                    {hit.firstPublishedAt ? ` · published ${formatDate(new Date(hit.firstPublishedAt))}` : ""}
                  </p>
                  {hit.status === "retracted" || hit.revisionKind !== "original" ? (
                    <p className="flex flex-wrap gap-2 text-xs">
                      {hit.status === "retracted" ? (
                        <span className="rounded bg-verdict-above px-2 py-0.5 font-semibold text-white">Retracted: its results no longer stand</span>
                      ) : null}
                      {hit.revisionKind !== "original" ? (
                        <span className="rounded border border-rule px-2 py-0.5">
                          {revisionKindLabels[hit.revisionKind]} (revision {hit.revisionNumber})
                          {hit.revisedAt ? `, ${formatDate(new Date(hit.revisedAt))}` : ""}
                        </span>
                      ) : null}
                    </p>
                  ) : null}
                  <p className="font-serif text-ink-soft">
                    <MarkedText text={hit.snippet} />
                  </p>
                </li>
              ))}
            </ol>
          )}
          {total > perPage ? (
            <Pager page={page} perPage={perPage} total={total} noun={["report", "reports"]} hrefFor={(target) => ({ pathname: "/search", query: { q: search.q, page: target } })} />
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
