import type { Metadata } from "next";
import Link from "next/link";
import { BackLink } from "@/components/back-link";
import { notFound } from "next/navigation";
import { getProtocolVersion, listProtocolVersions } from "@/db/queries/protocols";
import { isoDateOf } from "@/lib/calibration";
import { requirePagePermission } from "@/lib/session";
import { ProtocolVersionView } from "../_components/protocol-version-view";

export const metadata: Metadata = { title: "Test protocol" };

export default async function ProtocolPage({ params, searchParams }: PageProps<"/workspace/protocols/[slug]">) {
  const { slug } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/protocols/${slug}`);
  const requested = (await searchParams).version;
  const version = typeof requested === "string" && /^\d{1,6}$/.test(requested) ? Number(requested) : undefined;
  const [shown, history] = await Promise.all([getProtocolVersion({ slug, version, user }), listProtocolVersions({ slug })]);
  if (!shown) notFound();
  const latest = history[0]?.version ?? shown.version;
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <BackLink href="/workspace/protocols">Test protocols</BackLink>
        <h1 className="font-serif text-3xl">{shown.name}</h1>
        <p className="text-sm text-ink-soft">
          Version <span className="figure font-semibold text-ink">{shown.version}</span> of {latest}, written{" "}
          <span className="figure">{isoDateOf(shown.createdAt)}</span> by {shown.author ?? "a former member"}.
          {shown.version !== latest ? (
            <>
              {" "}
              <strong className="text-copper-deep">An older version:</strong>{" "}
              <Link href={`/workspace/protocols/${slug}`} className="text-verdigris-deep hover:text-copper">
                see the latest
              </Link>
              .
            </>
          ) : null}
        </p>
        {shown.revisable ? (
          <Link href={`/workspace/protocols/${slug}/edit`} className="inline-block rounded bg-ink px-4 py-2 text-sm font-semibold text-paper-raised hover:bg-ink-soft">
            Revise (adds version {latest + 1})
          </Link>
        ) : null}
      </header>

      <ProtocolVersionView version={shown} />

      <section aria-labelledby="history-heading" className="max-w-2xl">
        <h2 id="history-heading" className="mb-3 font-serif text-2xl">
          Version history
        </h2>
        <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised">
          {history.map((entry) => (
            <li key={entry.version} className="flex flex-wrap items-baseline gap-x-3 px-4 py-2 text-sm">
              {entry.version === shown.version ? (
                <span aria-current="page" className="figure font-semibold">
                  v{entry.version}
                </span>
              ) : (
                <Link href={`/workspace/protocols/${slug}?version=${entry.version}`} className="figure text-verdigris-deep hover:text-copper">
                  v{entry.version}
                </Link>
              )}
              <span className="figure text-ink-soft">{isoDateOf(entry.createdAt)}</span>
              <span>{entry.author ?? "a former member"}</span>
            </li>
          ))}
        </ol>
      </section>
    </article>
  );
}
