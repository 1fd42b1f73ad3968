"use client";

import { useState } from "react";
import { FormStatus, SelectField, SubmitButton, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import type { MeasurementKind } from "@/db/schema";
import { measurementKindInfo, measurementKinds } from "@/lib/measurement-kinds";
import { manualReadingSchema } from "@/lib/validations/runs";
import { DecisionRuleSelect } from "../../_components/decision-rule-select";
import { addManualReading } from "../../actions";
import { formKey } from "../../_components/form-key";
import { narrowFields } from "../../_components/narrow-fields";

export function ManualReadingForm({
  runId,
  instruments,
  requiredKinds,
  repeats,
}: {
  runId: string;
  instruments: { id: string; label: string }[];
  requiredKinds: MeasurementKind[];
  repeats: number;
}) {
  const [state, formAction, pending] = useCheckedAction(addManualReading, manualReadingSchema);
  const [kind, setKind] = useState<MeasurementKind>(requiredKinds[0] ?? "airflow");
  const errors = state.fieldErrors;
  // After a reading is recorded the form starts afresh; after a refusal it keeps what was typed.
  const values = state.status === "ok" ? undefined : state.values;
  return (
    <form key={formKey(state)} action={formAction} className={`grid gap-4 rounded border border-rule bg-paper-raised p-4 sm:grid-cols-2 ${narrowFields}`} noValidate>
      <input type="hidden" name="runId" value={runId} />
      <SelectField label="What was measured" name="kind" errors={errors} value={kind} onChange={(event) => setKind(event.target.value as MeasurementKind)}>
        {measurementKinds.map((option) => (
          <option key={option} value={option}>
            {measurementKindInfo[option].label}
            {requiredKinds.includes(option) ? " (protocol)" : ""}
          </option>
        ))}
      </SelectField>
      <TextField
        label={`Readings (${measurementKindInfo[kind].unit})`}
        name="values"
        errors={errors}
        values={values}
        inputMode="decimal"
        autoComplete="off"
        hint={`One value per repeat, separated by commas or spaces; the protocol asks for ${repeats}.`}
      />
      <SelectField label="Instrument" name="instrumentId" errors={errors} defaultValue={values?.instrumentId ?? ""}>
        <option value="">None of the run&apos;s instruments (no Type B term)</option>
        {instruments.map((instrument) => (
          <option key={instrument.id} value={instrument.id}>
            {instrument.label}
          </option>
        ))}
      </SelectField>
      <DecisionRuleSelect errors={errors} defaultValue={values?.rule} />
      <div className="sm:col-span-2">
        <TextField label="Note" name="note" errors={errors} values={values} hint="How and where it was read, if it matters." />
      </div>
      <div className="flex flex-wrap items-center gap-4 sm:col-span-2">
        <SubmitButton pending={pending}>Record readings</SubmitButton>
        <FormStatus status={state.status} message={state.message} />
      </div>
    </form>
  );
}
