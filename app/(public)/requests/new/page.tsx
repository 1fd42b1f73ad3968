import type { Metadata } from "next";
import Link from "next/link";
import { listRequestableTools } from "@/db/queries/measurement-requests";
import { requirePagePermission } from "@/lib/session";
import { requestLimits } from "@/lib/validations/measurement-requests";
import { RequestForm } from "./_components/request-form";

export const metadata: Metadata = { title: "Ask for a measurement" };

export default async function NewRequestPage() {
  await requirePagePermission("requests:ask", "/requests/new");
  const tools = await listRequestableTools();
  return (
    <section className="max-w-2xl space-y-6">
      <p className="text-sm">
        <Link href="/requests" className="text-copper hover:underline">
          ← All measurement requests
        </Link>
      </p>
      <h1 className="font-serif text-3xl">Ask for a measurement</h1>
      <p className="text-ink-soft">
        Name the tool, say what you would like measured and why it matters to you. Your request starts with your own vote; other
        readers can add theirs. Check the{" "}
        <Link href="/requests" className="text-copper underline">
          open requests
        </Link>{" "}
        first: voting for an existing one counts for more than asking again. You can post up to {requestLimits.perDay} requests a day.
      </p>
      <RequestForm tools={tools.map((tool) => ({ id: tool.id, label: `${tool.maker} ${tool.model}` }))} />
    </section>
  );
}
