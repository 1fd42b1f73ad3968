"use client";

import { FormStatus, SelectField, SubmitButton, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import type { AccuracyChoice } from "@/lib/analysis-options";
import { waveformMappingSchema } from "@/lib/validations/runs";
import { startWaveformAnalysis } from "../../../../actions";
import { DecisionRuleSelect } from "../../../../_components/decision-rule-select";
import { AccuracySelect, ColumnSelect } from "./mapping-fields";
import { formKey } from "../../../../_components/form-key";
import { narrowFields } from "../../../../_components/narrow-fields";

export function WaveformMappingForm({
  captureId,
  columns,
  defaults,
  currentChoices,
  voltageChoices,
  supply,
}: {
  captureId: string;
  columns: string[];
  defaults: Record<string, string>;
  currentChoices: AccuracyChoice[];
  voltageChoices: AccuracyChoice[];
  supply: { voltage: number; frequencyHz: number; referenceImpedance: boolean };
}) {
  const [state, formAction, pending] = useCheckedAction(startWaveformAnalysis, waveformMappingSchema);
  const errors = state.fieldErrors;
  const values = state.values ?? defaults;
  return (
    <form key={formKey(state)} action={formAction} className={`space-y-6 ${narrowFields}`} noValidate>
      <input type="hidden" name="captureId" value={captureId} />
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Columns and scales</legend>
        <ColumnSelect label="Current column" name="currentColumn" columns={columns} defaultValue={values.currentColumn} errors={errors} />
        <TextField
          label="Current scale (A per unit of the column)"
          name="currentScale"
          errors={errors}
          values={values}
          inputMode="decimal"
          hint="A clamp of 100 mV/A read in volts is 10; a column already in amperes is 1."
        />
        <ColumnSelect label="Voltage column" name="voltageColumn" columns={columns} defaultValue={values.voltageColumn} errors={errors} none="No voltage channel (power is then an estimate)" />
        <TextField
          label="Voltage scale (V per unit of the column)"
          name="voltageScale"
          errors={errors}
          values={values}
          inputMode="decimal"
          hint="A 100:1 probe read at the probe tip is 100; a column already in volts is 1."
        />
        <ColumnSelect label="Time column" name="timeColumn" columns={columns} defaultValue={values.timeColumn} errors={errors} none="No time column (give the sample interval)" />
        <TextField label="Sample interval (s)" name="sampleIntervalSeconds" errors={errors} values={values} inputMode="decimal" hint="Only without a time column, e.g. 0.0002 for 5 kS/s." />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Supply and limits</legend>
        <p className="text-sm text-ink-soft sm:col-span-2">
          Nominal supply {supply.voltage} V, {supply.frequencyHz} Hz, from the run&apos;s conditions.{" "}
          {supply.referenceImpedance
            ? "Flicker is estimated on the IEC 61000-3-3 reference impedance unless you give the supply's own."
            : "IEC 61000-3-3 defines no reference impedance for this supply: give the supply impedance to estimate flicker."}
        </p>
        <SelectField label="Harmonic class (IEC 61000-3-2)" name="harmonicClass" errors={errors} defaultValue={values.harmonicClass ?? "A"}>
          <option value="A">Class A</option>
          <option value="B">Class B (portable tools)</option>
        </SelectField>
        <SelectField label="dmax limit (IEC 61000-3-3)" name="dmaxLimitPercent" errors={errors} defaultValue={values.dmaxLimitPercent ?? "4"}>
          <option value="4">4 % (general)</option>
          <option value="6">6 % (switched a few times a day)</option>
          <option value="7">7 % (attended while in use)</option>
        </SelectField>
        <TextField label="Supply resistance (Ω)" name="impedanceResistanceOhm" errors={errors} values={values} inputMode="decimal" />
        <TextField label="Supply reactance (Ω)" name="impedanceReactanceOhm" errors={errors} values={values} inputMode="decimal" />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Uncertainty and verdict</legend>
        <AccuracySelect label="Current accuracy" name="currentAccuracy" choices={currentChoices} defaultValue={values.currentAccuracy} errors={errors} />
        <AccuracySelect label="Voltage accuracy" name="voltageAccuracy" choices={voltageChoices} defaultValue={values.voltageAccuracy} errors={errors} />
        <DecisionRuleSelect errors={errors} defaultValue={values.rule} />
      </fieldset>

      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton pending={pending}>Start analysis</SubmitButton>
        <FormStatus status={state.status} message={state.message} />
      </div>
    </form>
  );
}
