import Link from "next/link";
import { listTools } from "@/db/queries/catalogue";
import { formatRatedVoltage } from "@/lib/format";
import { toolCategoryLabels } from "@/lib/validations/catalogue";

export default async function HomePage() {
  const { tools, total } = await listTools({ page: 1, perPage: 6 });
  return (
    <div className="space-y-10">
      <section className="max-w-3xl space-y-4">
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">Bench-tested, with the numbers shown</p>
        <h1 className="font-serif text-4xl sm:text-display">What the rating plate says, and what the bench measured</h1>
        <p className="font-serif text-lg text-ink-soft">
          Reviewers test hot-air rework stations, soldering stations and heat guns under a written protocol, capture current and
          voltage on the bench, and publish true RMS current, real power, burst-fire patterns, harmonics and the flicker a tool can
          cause on a shared supply, each judged against its rating with the measurement uncertainty stated.
        </p>
      </section>

      <section aria-labelledby="catalogue-heading" className="space-y-4">
        <div className="flex items-baseline justify-between">
          <h2 id="catalogue-heading" className="font-serif text-2xl">
            On the bench
          </h2>
          <Link href="/tools" className="text-sm font-semibold text-copper underline-offset-4 hover:underline">
            All {total} tools
          </Link>
        </div>
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {tools.map((tool) => (
            <li key={tool.slug} className="rounded border border-rule bg-paper-raised p-4">
              <p className="text-xs uppercase tracking-wide text-ink-faint">{toolCategoryLabels[tool.category]}</p>
              <h3 className="mt-1 font-serif text-lg">
                <Link href={`/tools/${tool.slug}`} className="hover:text-copper">
                  {tool.maker} {tool.model}
                </Link>
              </h3>
              <p className="figure mt-2 text-sm text-ink-soft">
                {tool.ratedPowerW} W · {formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax)}
              </p>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
