import type { Metadata } from "next";
import { listToolsForEditing } from "@/db/queries/tools";
import { formatRatedVoltage } from "@/lib/format";
import { requirePagePermission } from "@/lib/session";
import { toolCategoryLabels } from "@/lib/validations/catalogue";
import { ToolsTable } from "./_components/tools-table";

export const metadata: Metadata = { title: "Tools catalogue" };

export default async function WorkspaceToolsPage() {
  await requirePagePermission("catalogue:edit", "/workspace/tools");
  const tools = await listToolsForEditing();
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Tools catalogue</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        Each tool with its ratings as the maker states them. Runs judge what was measured against these figures, so copy them
        from the rating plate and the datasheet.
      </p>
      <ToolsTable
        tools={tools.map((tool) => ({
          slug: tool.slug,
          name: `${tool.maker} ${tool.model}`,
          kind: toolCategoryLabels[tool.category],
          ratedPowerW: tool.ratedPowerW,
          ratedVoltage: formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax),
          photoCount: tool.photoCount,
        }))}
      />
    </section>
  );
}
