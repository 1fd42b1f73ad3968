"use client";

import { markRequestMeasured } from "@/app/(public)/actions";
import { FormStatus, SelectField, SubmitButton } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { requestFulfilmentSchema } from "@/lib/validations/measurement-requests";

/** Links the report that answers a request; used by reviewers on the request's page and by editors at the desk. */
export function RequestFulfilForm({
  requestId,
  reports,
}: {
  requestId: string;
  reports: { id: string; title: string; status: string }[];
}) {
  const [state, formAction, pending] = useCheckedAction(markRequestMeasured, requestFulfilmentSchema);
  if (reports.length === 0) {
    return <p className="text-sm text-ink-soft">No published report, and none of yours submitted for review, can be linked yet.</p>;
  }
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <input type="hidden" name="requestId" value={requestId} />
      <SelectField label="Report that answers it" name="reportId" errors={state.fieldErrors} defaultValue={state.values?.reportId ?? ""}>
        <option value="">Choose a report…</option>
        {reports.map((report) => (
          <option key={report.id} value={report.id}>
            {report.title}
            {report.status === "published" ? "" : " (submitted, not yet published)"}
          </option>
        ))}
      </SelectField>
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Mark measured</SubmitButton>
      </div>
    </form>
  );
}
