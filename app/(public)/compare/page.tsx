import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { listTools } from "@/db/queries/catalogue";
import { loadToolBySlug } from "@/lib/catalogue-listing";
import { compareRunConditions } from "@/lib/comparability";
import { loadComparisonSide } from "@/lib/comparison-data";
import { pairQuantities, type ComparisonSide } from "@/lib/comparison";
import { compareHref, compareQuerySchema, compareSides, type CompareQuery, type CompareSide } from "@/lib/validations/compare";
import { CatalogueSideBySide, type CatalogueTool } from "./_components/catalogue-side-by-side";
import { ComparabilityWarnings } from "./_components/comparability-warnings";
import { CompareForm, sideLabels } from "./_components/compare-form";
import { HeatUpComparison } from "./_components/heat-up-comparison";
import { PowerNormalisation } from "./_components/power-normalisation";
import { QuantityComparison } from "./_components/quantity-comparison";
import { SupplyEffects } from "./_components/supply-effects";

const nameOf = (tool: CatalogueTool) => `${tool.maker} ${tool.model}`;

function firstValue(value: string | string[] | undefined): string | undefined {
  const text = Array.isArray(value) ? value[0] : value;
  return text === undefined || text.trim() === "" ? undefined : text;
}

async function readQuery(searchParams: PageProps<"/compare">["searchParams"]) {
  const raw = await searchParams;
  const candidate = { a: firstValue(raw.a), b: firstValue(raw.b), qa: firstValue(raw.qa), qb: firstValue(raw.qb) };
  const parsed = compareQuerySchema.safeParse(candidate);
  if (parsed.success) return { query: parsed.data, problems: [] as string[] };
  // A malformed side is dropped and named; the other side still shows.
  const bad = new Set(parsed.error.issues.map((issue) => String(issue.path[0])));
  const kept = Object.fromEntries(Object.entries(candidate).filter(([key]) => !bad.has(key)));
  return { query: compareQuerySchema.parse(kept), problems: parsed.error.issues.map((issue) => `${sideLabels[String(issue.path[0]).slice(-1) as CompareSide]}: ${issue.message}`) };
}

/** Text typed into a picker without JavaScript: one match is taken, several are offered, none is said. */
async function resolveTypedText(text: string | undefined) {
  if (text === undefined) return null;
  const { tools, total } = await listTools({ q: text, page: 1, perPage: 8 });
  return { text, tools, total };
}

export async function generateMetadata({ searchParams }: PageProps<"/compare">): Promise<Metadata> {
  const { query } = await readQuery(searchParams);
  const [a, b] = await Promise.all([query.a ? loadToolBySlug(query.a) : null, query.b ? loadToolBySlug(query.b) : null]);
  return { title: a && b ? `${nameOf(a)} compared with ${nameOf(b)}` : "Compare two tools" };
}

export default async function ComparePage({ searchParams }: PageProps<"/compare">) {
  const { query, problems } = await readQuery(searchParams);
  const [typedA, typedB] = await Promise.all([resolveTypedText(query.qa), resolveTypedText(query.qb)]);
  const typed = { a: typedA, b: typedB };
  // Typed text that names exactly one tool stands for that tool; once every typed side does, the address becomes the
  // shareable one.
  const slugOf = (side: CompareSide) => {
    const found = typed[side];
    return found ? (found.total === 1 ? found.tools[0]?.slug : undefined) : query[side];
  };
  const slugs: Record<CompareSide, string | undefined> = { a: slugOf("a"), b: slugOf("b") };
  if ((typed.a || typed.b) && compareSides.every((side) => !typed[side] || typed[side].total === 1)) redirect(compareHref(slugs));
  const [toolA, toolB] = await Promise.all(compareSides.map((side) => (slugs[side] ? loadToolBySlug(slugs[side]) : null)));
  const tools: Record<CompareSide, CatalogueTool | null> = { a: toolA ?? null, b: toolB ?? null };

  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <h1 className="font-serif text-4xl">Compare two tools</h1>
        <p className="max-w-2xl font-serif text-lg text-ink-soft">
          Rated against measured, side by side, from published reports only. Where the two were not tested under the same conditions, the page says so above the
          figures.
        </p>
      </header>
      <CompareForm picked={{ a: tools.a ? { slug: tools.a.slug, name: nameOf(tools.a) } : null, b: tools.b ? { slug: tools.b.slug, name: nameOf(tools.b) } : null }} />
      <SideNotes query={query} slugs={slugs} tools={tools} typed={typed} problems={problems} />
      {tools.a && tools.b ? <Comparison a={tools.a} b={tools.b} /> : null}
    </div>
  );
}

function SideNotes({
  query,
  slugs,
  tools,
  typed,
  problems,
}: {
  query: CompareQuery;
  slugs: Record<CompareSide, string | undefined>;
  tools: Record<CompareSide, CatalogueTool | null>;
  typed: Record<CompareSide, Awaited<ReturnType<typeof resolveTypedText>>>;
  problems: string[];
}) {
  const notes = compareSides.flatMap((side) => {
    const other = side === "a" ? "b" : "a";
    const found = typed[side];
    if (found && found.total !== 1) {
      if (found.total === 0) return [<p key={side}>{sideLabels[side]}: no tool matches “{found.text}”.</p>];
      return [
        <div key={side}>
          <p>
            {sideLabels[side]}: {found.total} tools match “{found.text}”{found.total > found.tools.length ? `; the first ${found.tools.length} are listed` : ""}. Choose one:
          </p>
          <ul className="mt-1 list-disc pl-6">
            {found.tools.map((tool) => (
              <li key={tool.slug}>
                <Link href={compareHref({ [side]: tool.slug, [other]: slugs[other] ?? query[other] })} className="underline hover:text-copper">
                  {nameOf(tool)}
                </Link>
              </li>
            ))}
          </ul>
        </div>,
      ];
    }
    if (slugs[side] && !tools[side]) return [<p key={side}>{sideLabels[side]}: there is no tool at “{slugs[side]}” in the catalogue.</p>];
    return [];
  });
  const all = [...problems.map((problem) => <p key={problem}>{problem}</p>), ...notes];
  if (!tools.a !== !tools.b && all.length === 0) all.push(<p key="one">Choose a second tool to compare with.</p>);
  if (all.length === 0) return null;
  return (
    <div role="status" className="space-y-2 rounded border border-rule bg-paper-sunk p-4 text-sm">
      {all}
    </div>
  );
}

function RetractedNote({ name, side }: { name: string; side: ComparisonSide }) {
  if (side.retracted.length === 0) return null;
  return (
    <li>
      {name}: results from {side.retracted.length === 1 ? "a retracted report are" : `${side.retracted.length} retracted reports are`} left out:{" "}
      {side.retracted.map(({ report, results }, index) => (
        <span key={report.slug}>
          {index > 0 ? "; " : ""}
          <Link href={`/reports/${report.slug}`} className="underline hover:text-copper">
            {report.title}
          </Link>{" "}
          ({results} {results === 1 ? "result" : "results"}
          {report.retractionReason ? `; retracted: ${report.retractionReason}` : ""})
        </span>
      ))}
      .
    </li>
  );
}

async function Comparison({ a, b }: { a: CatalogueTool; b: CatalogueTool }) {
  const [sideA, sideB] = await Promise.all([loadComparisonSide(a.slug), loadComparisonSide(b.slug)]);
  const names = { a: nameOf(a), b: nameOf(b) };
  const warnings = compareRunConditions(sideA.runs, sideB.runs);
  const bothMeasured = sideA.runs.length > 0 && sideB.runs.length > 0;
  const power = (side: ComparisonSide) => side.results.find((result) => result.kind === "power_input_full_demand") ?? null;

  return (
    <article aria-labelledby="comparison-heading" className="space-y-10">
      <h2 id="comparison-heading" className="font-serif text-3xl">
        <Link href={`/tools/${a.slug}`} className="text-copper-deep hover:underline">
          {names.a}
        </Link>{" "}
        <span className="text-ink-faint">and</span>{" "}
        <Link href={`/tools/${b.slug}`} className="text-verdigris-deep hover:underline">
          {names.b}
        </Link>
      </h2>
      {a.slug === b.slug ? <p className="text-sm text-ink-soft">Both sides show the same tool; choose another to compare with.</p> : null}

      <ComparabilityWarnings warnings={warnings} names={names} compared={bothMeasured} />
      {!bothMeasured || sideA.retracted.length || sideB.retracted.length ? (
        <ul role="note" className="list-disc space-y-1 rounded border border-rule bg-paper-sunk p-4 pl-8 text-sm">
          {sideA.runs.length === 0 ? <li>{names.a} has no published results yet, so the conditions cannot be compared.</li> : null}
          {sideB.runs.length === 0 ? <li>{names.b} has no published results yet, so the conditions cannot be compared.</li> : null}
          <RetractedNote name={names.a} side={sideA} />
          <RetractedNote name={names.b} side={sideB} />
        </ul>
      ) : null}
      <p className="text-sm text-ink-soft">
        Each quantity shows the tool&apos;s most recent published result; the line under each figure links the report revision and the run it came from.
      </p>

      <section aria-labelledby="quantities-heading" className="space-y-4">
        <h2 id="quantities-heading" className="font-serif text-2xl">
          Rated against measured
        </h2>
        <QuantityComparison pairs={pairQuantities(sideA.results, sideB.results)} names={names} />
      </section>

      <section aria-labelledby="power-heading" className="space-y-4">
        <h2 id="power-heading" className="font-serif text-2xl">
          Power input, each at its own rated voltage
        </h2>
        <p className="max-w-3xl text-sm text-ink-soft">
          A heater&apos;s power rises with the square of the voltage, so each tool is judged at the voltage it is rated for, not at the other&apos;s supply.
        </p>
        <PowerNormalisation a={{ name: names.a, tool: a, result: power(sideA), waveform: sideA.waveform }} b={{ name: names.b, tool: b, result: power(sideB), waveform: sideB.waveform }} />
      </section>

      <section aria-labelledby="heat-up-heading" className="space-y-4">
        <h2 id="heat-up-heading" className="font-serif text-2xl">
          Heat-up
        </h2>
        <HeatUpComparison a={{ name: names.a, heatUp: sideA.heatUp, claimedSeconds: a.claimedHeatUpSeconds }} b={{ name: names.b, heatUp: sideB.heatUp, claimedSeconds: b.claimedHeatUpSeconds }} />
      </section>

      <section aria-labelledby="supply-heading" className="space-y-4">
        <h2 id="supply-heading" className="font-serif text-2xl">
          What each does to the supply
        </h2>
        <SupplyEffects a={{ name: names.a, waveform: sideA.waveform }} b={{ name: names.b, waveform: sideB.waveform }} />
      </section>

      <section aria-labelledby="catalogue-heading" className="space-y-4">
        <h2 id="catalogue-heading" className="font-serif text-2xl">
          Ratings, price and what comes in the box
        </h2>
        <CatalogueSideBySide a={a} b={b} />
      </section>
    </article>
  );
}
