import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getReport } from "@/db/queries/reports";
import { requirePagePermission } from "@/lib/session";
import { ReportView } from "../../_components/report-view";

export const metadata: Metadata = { title: "Report as saved" };

export default async function ReportViewPage({ params }: PageProps<"/workspace/reports/[id]/view">) {
  const { id } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/reports/${id}/view`);
  const report = /^[0-9a-f-]{36}$/i.test(id) ? await getReport({ id, viewer: user }) : null;
  if (!report) notFound();
  return <ReportView report={report} />;
}
