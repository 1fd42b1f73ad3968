"use client";

import { useState } from "react";
import { FormStatus, SelectField, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import type { ProtocolConditions } from "@/db/schema";
import { isCalibrationOverdue } from "@/lib/calibration";
import { runFormSchema, runUpdateSchema, unitSourceLabels, unitSources } from "@/lib/validations/runs";
import { createRun, updateRun } from "../actions";
import { formKey } from "./form-key";
import { narrowFields } from "./narrow-fields";

type Choice = { id: string; name: string };

export type RunFormChoices = {
  labs: Choice[];
  tools: Choice[];
  protocolVersions: { id: string; protocolName: string; version: number; conditions: ProtocolConditions }[];
  instruments: { id: string; labId: string | null; kind: string; maker: string; model: string; serialNumber: string; calibrationDueOn: string }[];
};

/** Field values as the form's inputs hold them (strings), for an edit form or a refusal's echo. */
export type RunFormValues = Record<string, string>;

const conditionInputs: { name: keyof ProtocolConditions | "measuredSupplyVoltage"; label: string; hint?: string; inputMode?: "decimal" }[] = [
  { name: "supplyVoltage", label: "Nominal supply voltage (V)", inputMode: "decimal" },
  { name: "ambientC", label: "Ambient temperature (°C)", inputMode: "decimal" },
  { name: "nozzle", label: "Nozzle or tip" },
  { name: "airflowSetpoint", label: "Airflow setpoint", hint: "As the tool's dial or display shows it." },
  { name: "temperatureSetpointC", label: "Temperature setpoint (°C)", inputMode: "decimal" },
  { name: "measuringDistanceMm", label: "Measuring distance (mm)", inputMode: "decimal" },
  { name: "warmUpMinutes", label: "Warm-up time (min)", inputMode: "decimal" },
  { name: "measuredSupplyVoltage", label: "Measured supply voltage (V)", hint: "What the meter read at the socket, if you measured it.", inputMode: "decimal" },
];

function conditionDefaults(conditions: ProtocolConditions | undefined): RunFormValues {
  if (!conditions) return {};
  return Object.fromEntries(Object.entries(conditions).map(([name, value]) => [name, value === null ? "" : String(value)]));
}

const today = () => new Date().toISOString().slice(0, 10);

const firstLab = (choices: RunFormChoices) => choices.labs[0]?.id ?? "";

/**
 * New runs pick a lab, a tool and the latest version of a protocol, whose conditions fill the condition fields; an
 * edit keeps those three, since another tool or protocol version would be another run.
 */
export function RunForm({
  choices,
  edit,
}: {
  choices: RunFormChoices;
  edit?: { runId: string; labId: string; values: RunFormValues; instrumentIds: string[] };
}) {
  const [state, formAction, pending] = useCheckedAction(edit ? updateRun : createRun, edit ? runUpdateSchema : runFormSchema);
  const [protocolVersionId, setProtocolVersionId] = useState(edit ? "" : (choices.protocolVersions[0]?.id ?? ""));
  const [testedOn, setTestedOn] = useState(edit?.values.testedOn ?? today());
  const [labId, setLabId] = useState(edit?.labId ?? firstLab(choices));
  const errors = state.fieldErrors;
  const protocol = choices.protocolVersions.find((version) => version.id === protocolVersionId);
  const values: RunFormValues = state.values ?? { ...(edit?.values ?? {}), ...conditionDefaults(protocol?.conditions) };
  const checked = new Set(
    state.values
      ? Object.keys(state.values).filter((name) => name.startsWith("instrumentIds.")).map((name) => name.slice("instrumentIds.".length))
      : (edit?.instrumentIds ?? []),
  );

  return (
    <form key={formKey(state)} action={formAction} className={`space-y-8 ${narrowFields}`} noValidate>
      {edit ? <input type="hidden" name="runId" value={edit.runId} /> : null}
      {!edit ? (
        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-2 font-serif text-xl">What is tested</legend>
          <SelectField label="Lab" name="labId" errors={errors} value={labId} onChange={(event) => setLabId(event.target.value)}>
            {choices.labs.map((lab) => (
              <option key={lab.id} value={lab.id}>
                {lab.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Tool" name="toolId" errors={errors} defaultValue={values.toolId}>
            <option value="">Choose a tool…</option>
            {choices.tools.map((tool) => (
              <option key={tool.id} value={tool.id}>
                {tool.name}
              </option>
            ))}
          </SelectField>
          <SelectField
            label="Protocol (latest version)"
            name="protocolVersionId"
            errors={errors}
            value={protocolVersionId}
            onChange={(event) => setProtocolVersionId(event.target.value)}
          >
            {choices.protocolVersions.map((version) => (
              <option key={version.id} value={version.id}>
                {version.protocolName} v{version.version}
              </option>
            ))}
          </SelectField>
        </fieldset>
      ) : null}

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 font-serif text-xl">The unit on the bench</legend>
        <TextField label="Test date" name="testedOn" type="date" errors={errors} value={testedOn} onChange={(event) => setTestedOn(event.target.value)} />
        <TextField label="Serial number" name="unitSerialNumber" errors={errors} values={values} autoComplete="off" />
        <TextField label="Firmware" name="unitFirmware" errors={errors} values={values} hint="Leave empty if the unit shows none." />
        <TextField label="Voltage variant" name="unitVoltageVariant" errors={errors} values={values} hint="e.g. 230 V, EU plug" />
        <SelectField label="How the unit was obtained" name="unitSource" errors={errors} defaultValue={values.unitSource ?? "bought"}>
          {unitSources.map((source) => (
            <option key={source} value={source}>
              {unitSourceLabels[source]}
            </option>
          ))}
        </SelectField>
        <TextField label="Note on how it was obtained" name="unitSourceNote" errors={errors} values={values} hint="Who loaned or gave it, on what terms." />
      </fieldset>

      <fieldset aria-describedby={errors?.instrumentIds ? "instrumentIds-error" : undefined}>
        <legend className="mb-2 font-serif text-xl">Instruments used</legend>
        <p className="mb-3 text-sm text-ink-soft">
          The lab&apos;s instruments and shared ones. The run keeps each instrument&apos;s accuracy and calibration as they are today.
        </p>
        <ul className="grid gap-2 sm:grid-cols-2">
          {choices.instruments.filter((instrument) => instrument.labId === null || instrument.labId === labId).map((instrument) => {
            const overdue = isCalibrationOverdue(instrument.calibrationDueOn, testedOn);
            return (
              <li key={instrument.id}>
                <label className="flex items-start gap-2 rounded border border-rule bg-paper-raised px-3 py-2 text-sm">
                  <input
                    type="checkbox"
                    name={`instrumentIds.${instrument.id}`}
                    value={instrument.id}
                    defaultChecked={checked.has(instrument.id)}
                    className="mt-1 size-4 accent-copper"
                  />
                  <span>
                    <span className="font-semibold">
                      {instrument.maker} {instrument.model}
                    </span>{" "}
                    <span className="text-ink-soft">
                      {instrument.kind.replaceAll("_", " ")} · {instrument.serialNumber}
                    </span>
                    <span className={`block text-xs ${overdue ? "font-semibold text-copper-deep" : "text-ink-faint"}`}>
                      Calibration due {instrument.calibrationDueOn}
                      {overdue ? ": overdue on the test date" : ""}
                    </span>
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
        {errors?.instrumentIds ? (
          <p id="instrumentIds-error" className="mt-2 text-sm text-copper-deep">
            {errors.instrumentIds.join(" ")}
          </p>
        ) : null}
      </fieldset>

      <fieldset key={protocolVersionId} className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 font-serif text-xl">Supply and conditions</legend>
        <p className="text-sm text-ink-soft sm:col-span-3">
          {protocol ? `Filled in from ${protocol.protocolName} v${protocol.version}; change what differed on the day.` : "As they were on the day."}
        </p>
        <SelectField label="Supply frequency" name="supplyFrequencyHz" errors={errors} defaultValue={values.supplyFrequencyHz ?? "50"}>
          <option value="50">50 Hz</option>
          <option value="60">60 Hz</option>
        </SelectField>
        {conditionInputs.map((input) => (
          <TextField key={input.name} label={input.label} name={input.name} errors={errors} values={values} hint={input.hint} inputMode={input.inputMode} />
        ))}
      </fieldset>

      <TextAreaField label="Notes" name="notes" errors={errors} values={values} rows={4} hint="Anything a reader of the report should know about this run." />

      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton pending={pending}>{edit ? "Save run" : "Create run"}</SubmitButton>
        <FormStatus status={state.status} message={state.message} />
      </div>
    </form>
  );
}
