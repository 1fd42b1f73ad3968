import type { Metadata } from "next";
import { listToolChoices } from "@/db/queries/reports";
import { requirePagePermission } from "@/lib/session";
import { NewReportForm } from "../_components/new-report-form";

export const metadata: Metadata = { title: "New report" };

export default async function NewReportPage() {
  await requirePagePermission("workspace:use", "/workspace/reports/new");
  const tools = await listToolChoices();
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">New report</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        A report covers one tool, or two side by side. Next you cite the analyses it stands on, write the body and add pictures.
      </p>
      <NewReportForm tools={tools} />
    </section>
  );
}
