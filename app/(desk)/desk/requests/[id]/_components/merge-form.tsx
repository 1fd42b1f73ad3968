"use client";

import { mergeMeasurementRequests } from "@/app/(desk)/actions";
import { FormStatus, SelectField, SubmitButton } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { requestMergeSchema } from "@/lib/validations/measurement-requests";

export function MergeForm({
  duplicateId,
  targets,
}: {
  duplicateId: string;
  targets: { id: string; label: string }[];
}) {
  const [state, formAction, pending] = useCheckedAction(mergeMeasurementRequests, requestMergeSchema);
  if (targets.length === 0) return <p className="text-sm text-ink-soft">No other open, planned or measured request to merge into.</p>;
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <input type="hidden" name="duplicateId" value={duplicateId} />
      <SelectField label="Duplicates this request" name="targetId" errors={state.fieldErrors} defaultValue={state.values?.targetId ?? ""}>
        <option value="">Choose the request to keep…</option>
        {targets.map((target) => (
          <option key={target.id} value={target.id}>
            {target.label}
          </option>
        ))}
      </SelectField>
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Merge into it</SubmitButton>
      </div>
    </form>
  );
}
