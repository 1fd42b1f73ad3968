import type { Metadata } from "next";
import { ReportCards } from "@/components/published-report/report-cards";
import { listReadableReports } from "@/db/queries/editorial";

export const metadata: Metadata = { title: "Reports" };

export default async function ReportsPage() {
  const reports = await listReadableReports();
  return (
    <section className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-4xl">Reports</h1>
        <p className="font-serif text-lg text-ink-soft">
          Every published bench report, newest first. A corrected report says so at the top and keeps each earlier revision; a retracted one stays readable
          with the reason.
        </p>
      </header>
      <ReportCards reports={reports} />
      {reports.length === 0 ? <p className="text-ink-soft">Nothing is published yet.</p> : null}
    </section>
  );
}
