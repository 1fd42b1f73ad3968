import type { Metadata } from "next";
import Link from "next/link";
import { BackLink } from "@/components/back-link";
import { notFound } from "next/navigation";
import { listToolPhotos } from "@/db/queries/tool-photos";
import { getToolForEditing, listMakers } from "@/db/queries/tools";
import { requirePagePermission } from "@/lib/session";
import { ToolForm } from "../../_components/tool-form";
import { toolFormDefaults } from "../../_components/tool-form-defaults";
import { ToolPhotosEditor } from "../../_components/tool-photos-editor";

export const metadata: Metadata = { title: "Edit tool" };

export default async function EditToolPage({ params, searchParams }: PageProps<"/workspace/tools/[slug]/edit">) {
  const { slug } = await params;
  await requirePagePermission("catalogue:edit", `/workspace/tools/${slug}/edit`);
  const [tool, makers, photos] = await Promise.all([getToolForEditing({ slug }), listMakers(), listToolPhotos({ toolSlug: slug })]);
  if (!tool) notFound();
  const created = (await searchParams).created === "1";
  return (
    <div className="max-w-4xl space-y-10">
      <header className="space-y-2">
        <BackLink href="/workspace/tools">Tools catalogue</BackLink>
        <h1 className="font-serif text-3xl">
          {tool.maker} {tool.model}
        </h1>
        <p className="text-sm text-ink-soft">
          Public page:{" "}
          <Link href={`/tools/${tool.slug}`} className="figure text-verdigris-deep hover:text-copper">
            /tools/{tool.slug}
          </Link>
        </p>
        {created ? (
          <p role="status" className="text-sm text-verdigris-deep">
            Tool added. Add its photos below.
          </p>
        ) : null}
      </header>
      <ToolPhotosEditor slug={tool.slug} photos={photos} />
      <section aria-labelledby="ratings-heading" className="space-y-4">
        <h2 id="ratings-heading" className="font-serif text-2xl">
          Ratings and details
        </h2>
        <ToolForm makers={makers} defaults={toolFormDefaults(tool)} slug={tool.slug} />
      </section>
    </div>
  );
}
