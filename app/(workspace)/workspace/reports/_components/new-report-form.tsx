"use client";

import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { createReportSchema } from "@/lib/validations/reports";
import { createReport } from "../actions";
import { ToolFields } from "./tool-fields";

export function NewReportForm({ tools }: { tools: { id: string; name: string }[] }) {
  const [state, formAction, pending] = useCheckedAction(createReport, createReportSchema);
  return (
    <form action={formAction} className="flex max-w-2xl flex-col gap-4" noValidate>
      <TextField label="Title" name="title" errors={state.fieldErrors} values={state.values} required maxLength={160} />
      <ToolFields tools={tools} errors={state.fieldErrors} toolId={state.values?.toolId} secondToolId={state.values?.secondToolId} />
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Start the draft</SubmitButton>
      </div>
    </form>
  );
}
