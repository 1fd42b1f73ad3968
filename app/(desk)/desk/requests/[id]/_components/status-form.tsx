"use client";

import { useState } from "react";
import { changeRequestStatus } from "@/app/(desk)/actions";
import { FormStatus, SelectField, SubmitButton, TextAreaField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { requestStatusLabels } from "@/lib/request-statuses";
import { requestStatusChangeSchema } from "@/lib/validations/measurement-requests";

const choices = ["planned", "declined", "open"] as const;

export function StatusForm({ requestId, current }: { requestId: string; current: string }) {
  const [state, formAction, pending] = useCheckedAction(changeRequestStatus, requestStatusChangeSchema);
  const [status, setStatus] = useState<string>(state.values?.status ?? choices.find((choice) => choice !== current) ?? "planned");
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <input type="hidden" name="requestId" value={requestId} />
      <SelectField label="New status" name="status" errors={state.fieldErrors} value={status} onChange={(event) => setStatus(event.target.value)}>
        {choices.map((choice) => (
          <option key={choice} value={choice} disabled={choice === current}>
            {choice === "open" ? "Open (reopen)" : requestStatusLabels[choice]}
          </option>
        ))}
      </SelectField>
      {status === "declined" ? (
        <TextAreaField
          label="Reason for declining"
          name="declineReason"
          errors={state.fieldErrors}
          values={state.values}
          rows={3}
          maxLength={500}
          hint="The requester and voters read this in their e-mail and on the request's page."
        />
      ) : null}
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Change status</SubmitButton>
      </div>
    </form>
  );
}
