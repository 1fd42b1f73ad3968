import type { Metadata } from "next";
import { listReports } from "@/db/queries/reports";
import { can } from "@/lib/authz";
import { requirePagePermission } from "@/lib/session";
import { ReportsTable } from "./_components/reports-table";

export const metadata: Metadata = { title: "Reports" };

export default async function ReportsPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/reports");
  const reports = await listReports({ viewer: user });
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Reports</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        {can(user.role, "workspace:edit-any")
          ? "Every reviewer's reports: as an editor you may open and change any draft."
          : "Your reports: write them in MDX beside a live preview, cite the analyses they stand on, and submit them to the editors."}
      </p>
      <ReportsTable
        reports={reports.map((report) => ({
          id: report.id,
          title: report.title,
          status: report.status,
          tools: report.tools,
          authorName: report.authorName,
          citations: report.citations,
          updatedOn: report.updatedAt.slice(0, 10),
        }))}
      />
    </section>
  );
}
