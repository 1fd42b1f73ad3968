"use client";

import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import type { AccuracyChoice } from "@/lib/analysis-options";
import { heatUpMappingSchema } from "@/lib/validations/runs";
import { startHeatUpAnalysis } from "../../../../actions";
import { DecisionRuleSelect } from "../../../../_components/decision-rule-select";
import { AccuracySelect, ColumnSelect } from "./mapping-fields";
import { formKey } from "../../../../_components/form-key";
import { narrowFields } from "../../../../_components/narrow-fields";

export function HeatUpMappingForm({
  captureId,
  columns,
  defaults,
  temperatureChoices,
}: {
  captureId: string;
  columns: string[];
  defaults: Record<string, string>;
  temperatureChoices: AccuracyChoice[];
}) {
  const [state, formAction, pending] = useCheckedAction(startHeatUpAnalysis, heatUpMappingSchema);
  const errors = state.fieldErrors;
  const values = state.values ?? defaults;
  return (
    <form key={formKey(state)} action={formAction} className={`space-y-6 ${narrowFields}`} noValidate>
      <input type="hidden" name="captureId" value={captureId} />
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Columns and scales</legend>
        <ColumnSelect label="Temperature column" name="temperatureColumn" columns={columns} defaultValue={values.temperatureColumn} errors={errors} />
        <TextField label="Temperature scale (°C per unit of the column)" name="temperatureScale" errors={errors} values={values} inputMode="decimal" hint="1 when the column is in °C." />
        <ColumnSelect label="Time column" name="timeColumn" columns={columns} defaultValue={values.timeColumn} errors={errors} none="No time column (give the sample interval)" />
        <TextField label="Sample interval (s)" name="sampleIntervalSeconds" errors={errors} values={values} inputMode="decimal" hint="Only without a time column." />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Setpoint, band and verdict</legend>
        <TextField label="Setpoint (°C)" name="setpointC" errors={errors} values={values} inputMode="decimal" />
        <TextField label="Band around the setpoint (± °C)" name="bandC" errors={errors} values={values} inputMode="decimal" hint="Heat-up time is when the temperature enters this band for good." />
        <AccuracySelect label="Thermometer accuracy" name="temperatureAccuracy" choices={temperatureChoices} defaultValue={values.temperatureAccuracy} errors={errors} />
        <DecisionRuleSelect errors={errors} defaultValue={values.rule} />
      </fieldset>
      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton pending={pending}>Start analysis</SubmitButton>
        <FormStatus status={state.status} message={state.message} />
      </div>
    </form>
  );
}
