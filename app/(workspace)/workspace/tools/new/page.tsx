import type { Metadata } from "next";
import { BackLink } from "@/components/back-link";
import { listMakers } from "@/db/queries/tools";
import { requirePagePermission } from "@/lib/session";
import { ToolForm } from "../_components/tool-form";

export const metadata: Metadata = { title: "New tool" };

export default async function NewToolPage() {
  await requirePagePermission("catalogue:edit", "/workspace/tools/new");
  const makers = await listMakers();
  return (
    <section className="max-w-3xl space-y-6">
      <BackLink href="/workspace/tools">Tools catalogue</BackLink>
      <h1 className="font-serif text-3xl">New tool</h1>
      <p className="text-sm text-ink-soft">Photos can be added once the tool is saved.</p>
      <ToolForm makers={makers} defaults={{ applianceType: "heating" }} />
    </section>
  );
}
