"use client";

import { createProtocol, reviseProtocol } from "@/app/(workspace)/workspace/protocols/actions";
import { CheckboxField, FormStatus, SelectField, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { measurementKindInfo, measurementKinds } from "@/lib/measurement-kinds";
import { protocolFormSchema, protocolRevisionSchema, protocolToleranceFields } from "@/lib/validations/protocol";

/** A protocol's next version; `slug` set means revising that protocol, which always appends a version. */
export function ProtocolForm({ defaults, slug }: { defaults: Record<string, string>; slug?: string }) {
  const [state, formAction, pending] = useCheckedAction(slug ? reviseProtocol : createProtocol, slug ? protocolRevisionSchema : protocolFormSchema);
  const values = state.values ?? defaults;
  const errors = state.fieldErrors;
  const field = { errors, values };
  const requiredError = errors?.requiredMeasurements;
  return (
    <form action={formAction} noValidate className="space-y-8">
      {slug ? <input type="hidden" name="slug" value={slug} /> : null}
      <fieldset className="space-y-4">
        <legend className="mb-2 font-serif text-xl">Protocol</legend>
        <TextField label="Name" name="name" {...field} />
        <TextAreaField label="Summary" name="summary" rows={2} {...field} hint="What the protocol tests, on which kind of tool." />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Conditions</legend>
        <TextField label="Supply voltage (V)" name="supplyVoltage" inputMode="decimal" {...field} />
        <SelectField label="Supply frequency" name="supplyFrequencyHz" errors={errors} defaultValue={values.supplyFrequencyHz ?? ""} key={`frequency-${values.supplyFrequencyHz}`}>
          <option value="" disabled>
            Choose…
          </option>
          <option value="50">50 Hz</option>
          <option value="60">60 Hz</option>
        </SelectField>
        <TextField label="Ambient temperature (°C)" name="ambientC" inputMode="decimal" {...field} />
        <TextField label="Warm-up time (minutes)" name="warmUpMinutes" inputMode="decimal" {...field} />
        <TextField label="Nozzle or tip" name="nozzle" {...field} hint="e.g. 6 mm round nozzle; empty if it varies." />
        <TextField label="Airflow setpoint" name="airflowSetpoint" {...field} hint="As the tool's dial reads, e.g. 60 % or step 5." />
        <TextField label="Temperature setpoint (°C)" name="temperatureSetpointC" inputMode="decimal" {...field} />
        <TextField label="Measuring distance from the outlet (mm)" name="measuringDistanceMm" inputMode="decimal" {...field} />
      </fieldset>

      <fieldset className="space-y-3" aria-describedby={requiredError?.length ? "requiredMeasurements-error" : undefined}>
        <legend className="mb-2 font-serif text-xl">Required measurements</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {measurementKinds.map((kind) => (
            <CheckboxField
              key={kind}
              id={`requiredMeasurements-${kind}`}
              name={`requiredMeasurements.${kind}`}
              label={`${measurementKindInfo[kind].label} (${measurementKindInfo[kind].unit})`}
              defaultChecked={values[`requiredMeasurements.${kind}`] === "on"}
            />
          ))}
        </div>
        {requiredError?.length ? (
          <p id="requiredMeasurements-error" className="text-sm text-copper-deep">
            {requiredError.join(" ")}
          </p>
        ) : null}
        <div className="max-w-xs">
          <TextField label="Repeats of each measurement" name="repeats" inputMode="numeric" {...field} />
        </div>
      </fieldset>

      <fieldset className="space-y-4">
        <legend className="mb-2 font-serif text-xl">Tolerances the protocol sets</legend>
        <p className="text-sm text-ink-soft">
          IEC 60335-1 gives the tolerance for power input and current; for airflow, heat-up time and temperature the protocol
          states its own, with where it comes from.
        </p>
        {protocolToleranceFields.map(({ field: prefix, label, absoluteUnit }) => (
          <fieldset key={prefix} className="grid gap-3 rounded border border-rule bg-paper-raised p-3 sm:grid-cols-4">
            <legend className="px-1 text-sm font-semibold">{label}</legend>
            <SelectField label="Kind" name={`${prefix}Kind`} errors={errors} defaultValue={values[`${prefix}Kind`] ?? ""} key={`${prefix}-${values[`${prefix}Kind`]}`}>
              <option value="">Not set</option>
              <option value="percent">Percent of rated</option>
              <option value="absolute">Absolute ({absoluteUnit})</option>
            </SelectField>
            <TextField label="Plus" name={`${prefix}Plus`} inputMode="decimal" {...field} />
            <TextField label="Minus" name={`${prefix}Minus`} inputMode="decimal" {...field} />
            <TextField label="Source" name={`${prefix}Source`} {...field} hint="A standard, the maker, or this protocol." />
          </fieldset>
        ))}
      </fieldset>

      <TextAreaField
        label="Steps (MDX)"
        name="stepsMdx"
        rows={14}
        className="figure rounded border border-rule bg-paper-raised px-3 py-2 text-sm text-ink aria-invalid:border-copper"
        {...field}
        hint="Markdown with headings and numbered lists. Scripts, expressions and unknown elements are not run."
      />
      <TextAreaField
        label="Safety cautions"
        name="safetyCautions"
        rows={11}
        {...field}
        hint="Shown first on the protocol page. One caution per line, starting with “- ”."
      />

      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>{slug ? "Save as a new version" : "Create protocol"}</SubmitButton>
    </form>
  );
}
