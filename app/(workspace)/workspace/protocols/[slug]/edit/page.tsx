import type { Metadata } from "next";
import { BackLink } from "@/components/back-link";
import { forbidden, notFound } from "next/navigation";
import { getProtocolVersion } from "@/db/queries/protocols";
import { requirePagePermission } from "@/lib/session";
import { protocolFormDefaults } from "../../_components/protocol-form-defaults";
import { ProtocolForm } from "../../_components/protocol-form";

export const metadata: Metadata = { title: "Revise protocol" };

export default async function ReviseProtocolPage({ params }: PageProps<"/workspace/protocols/[slug]/edit">) {
  const { slug } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/protocols/${slug}/edit`);
  const latest = await getProtocolVersion({ slug, user });
  if (!latest) notFound();
  if (!latest.revisable) forbidden();
  return (
    <section className="max-w-3xl space-y-6">
      <BackLink href={`/workspace/protocols/${slug}`}>{latest.name}</BackLink>
      <h1 className="font-serif text-3xl">Revise {latest.name}</h1>
      <p className="text-sm text-ink-soft">
        Starts from version {latest.version}. Saving adds version {latest.version + 1}; version {latest.version} and the runs made
        under it stay exactly as they are.
      </p>
      <ProtocolForm defaults={protocolFormDefaults(latest)} slug={slug} />
    </section>
  );
}
