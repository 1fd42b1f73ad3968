import type { ReportStatus } from "@/db/schema";

export const reportStatusLabels: Record<ReportStatus, string> = {
  draft: "Draft",
  submitted: "Submitted for review",
  changes_requested: "Changes requested",
  published: "Published",
  retracted: "Retracted",
};
