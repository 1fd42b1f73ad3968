"use client";

import { createMeasurementRequest } from "@/app/(public)/actions";
import { FormStatus, SelectField, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { newMeasurementRequestSchema } from "@/lib/validations/measurement-requests";

export function RequestForm({ tools }: { tools: { id: string; label: string }[] }) {
  const [state, formAction, pending] = useCheckedAction(createMeasurementRequest, newMeasurementRequestSchema);
  const errors = state.fieldErrors;
  return (
    <form action={formAction} className="flex flex-col gap-5" noValidate>
      <fieldset className="flex flex-col gap-3 rounded border border-rule p-4">
        <legend className="px-1 text-sm font-semibold">Which tool?</legend>
        <SelectField label="A tool in the catalogue" name="toolId" errors={errors} defaultValue={state.values?.toolId ?? ""}>
          <option value="">Not in the catalogue: I name it below</option>
          {tools.map((tool) => (
            <option key={tool.id} value={tool.id}>
              {tool.label}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Or a tool not in the catalogue"
          name="proposedToolName"
          errors={errors}
          values={state.values}
          maxLength={120}
          hint="Maker and model, as on the rating plate, e.g. “Corvell HX-850 hot-air station”."
        />
      </fieldset>
      <TextAreaField
        label="What to measure"
        name="whatToMeasure"
        errors={errors}
        values={state.values}
        rows={4}
        maxLength={1000}
        hint="E.g. real power at full heat on 120 V, the burst-fire pattern at 350 °C, the airflow at the widest nozzle."
      />
      <TextAreaField label="Why it matters to you" name="why" errors={errors} values={state.values} rows={4} maxLength={2000} />
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Post the request</SubmitButton>
      </div>
    </form>
  );
}
