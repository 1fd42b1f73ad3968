import type { Metadata } from "next";
import { listCalibrationWarnings, listRuns } from "@/db/queries/runs";
import { can } from "@/lib/authz";
import { requirePagePermission } from "@/lib/session";
import { RunsTable } from "./_components/runs-table";

export const metadata: Metadata = { title: "Test runs" };

export default async function RunsPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/runs");
  const runs = await listRuns({ viewer: user });
  const overdue = new Set((await listCalibrationWarnings({ runIds: runs.map((run) => run.id) })).map((warning) => warning.runId));
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Test runs</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        {can(user.role, "workspace:edit-any")
          ? "Every reviewer's runs: as an editor you may open and change any of them."
          : "Your runs: one tool tested under one protocol version, with the instruments, conditions, readings and captures that belong to it."}
      </p>
      <RunsTable
        runs={runs.map((run) => ({
          id: run.id,
          testedOn: run.testedOn,
          toolName: run.toolName,
          labName: run.labName,
          protocol: `${run.protocolName} v${run.protocolVersion}`,
          reviewerName: run.reviewerName,
          serialNumber: run.serialNumber,
          calibrationOverdue: overdue.has(run.id),
        }))}
      />
    </section>
  );
}
