"use client";

import { useState } from "react";
import { createTool, updateTool } from "@/app/(workspace)/workspace/tools/actions";
import { FormStatus, SelectField, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { countIndexedRows, RepeatingRows } from "@/components/ui/repeating-rows";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { toolCategories, toolCategoryLabels } from "@/lib/validations/catalogue";
import {
  accessoryKindLabels,
  accessoryKinds,
  applianceTypeLabels,
  applianceTypes,
  newMakerChoice,
  ratedFrequencyChoices,
  toolFormSchema,
  toolUpdateSchema,
} from "@/lib/validations/tool";

type Maker = { id: string; name: string };

/** The tool's ratings; `slug` set means editing that tool, unset means a new one. */
export function ToolForm({ makers, defaults, slug }: { makers: Maker[]; defaults: Record<string, string>; slug?: string }) {
  const [state, formAction, pending] = useCheckedAction(slug ? updateTool : createTool, slug ? toolUpdateSchema : toolFormSchema);
  const values = state.values ?? defaults;
  const errors = state.fieldErrors;
  const [makerChoice, setMakerChoice] = useState(values.makerId ?? "");
  const [applianceType, setApplianceType] = useState(values.applianceType ?? "heating");
  const field = { errors, values };

  return (
    <form action={formAction} noValidate className="space-y-8">
      {slug ? <input type="hidden" name="slug" value={slug} /> : null}

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Maker and model</legend>
        <SelectField
          label="Maker"
          name="makerId"
          errors={errors}
          defaultValue={values.makerId ?? ""}
          key={`maker-${values.makerId}`}
          onChange={(event) => setMakerChoice(event.target.value)}
        >
          <option value="" disabled>
            Choose the maker…
          </option>
          {makers.map((maker) => (
            <option key={maker.id} value={maker.id}>
              {maker.name}
            </option>
          ))}
          <option value={newMakerChoice}>A maker not listed yet…</option>
        </SelectField>
        <TextField label="Model" name="model" {...field} hint="As the maker names it, e.g. Aeris 720." />
        {makerChoice === newMakerChoice ? (
          <>
            <TextField label="New maker's name" name="newMakerName" {...field} />
            <TextField label="New maker's country" name="newMakerCountry" {...field} />
          </>
        ) : null}
        <SelectField label="Kind of tool" name="category" errors={errors} defaultValue={values.category ?? ""} key={`category-${values.category}`}>
          <option value="" disabled>
            Choose…
          </option>
          {toolCategories.map((category) => (
            <option key={category} value={category}>
              {toolCategoryLabels[category]}
            </option>
          ))}
        </SelectField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Electrical ratings, as on the rating plate</legend>
        <TextField label="Rated power input (W)" name="ratedPowerW" inputMode="decimal" {...field} />
        <SelectField
          label="Appliance type (IEC 60335-1)"
          name="applianceType"
          errors={errors}
          defaultValue={values.applianceType ?? "heating"}
          key={`appliance-${values.applianceType}`}
          onChange={(event) => setApplianceType(event.target.value)}
        >
          {applianceTypes.map((type) => (
            <option key={type} value={type}>
              {applianceTypeLabels[type]}
            </option>
          ))}
        </SelectField>
        {applianceType === "combined" ? (
          <SelectField label="Does the motor take more than half the rated power?" name="motorShare" errors={errors} defaultValue={values.motorShare ?? ""} key={`motor-${values.motorShare}`}>
            <option value="">Not stated (the heating rows of Table 1 apply)</option>
            <option value="above">Yes, more than half</option>
            <option value="not-above">No, half or less</option>
          </SelectField>
        ) : null}
        <TextField label="Rated voltage, or the lower end of a range (V)" name="ratedVoltageMin" inputMode="decimal" {...field} />
        <TextField
          label="Upper end of the voltage range (V)"
          name="ratedVoltageMax"
          inputMode="decimal"
          {...field}
          hint="Leave empty for a single rated voltage."
        />
        <SelectField label="Rated frequency" name="ratedFrequency" errors={errors} defaultValue={values.ratedFrequency ?? ""} key={`frequency-${values.ratedFrequency}`}>
          <option value="" disabled>
            Choose…
          </option>
          {Object.keys(ratedFrequencyChoices).map((choice) => (
            <option key={choice} value={choice}>
              {choice} Hz
            </option>
          ))}
        </SelectField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Thermal and air ratings</legend>
        <TextField label="Lowest set temperature (°C)" name="temperatureMinC" inputMode="decimal" {...field} />
        <TextField label="Highest set temperature (°C)" name="temperatureMaxC" inputMode="decimal" {...field} />
        <TextField label="Claimed heat-up time (s)" name="claimedHeatUpSeconds" inputMode="decimal" {...field} hint="Empty when the maker states none." />
        <TextField label="Rated airflow (L/min)" name="ratedAirflowLpm" inputMode="decimal" {...field} hint="Hot-air tools only." />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Price</legend>
        <TextField label="Price paid or listed" name="price" inputMode="decimal" {...field} hint="In the currency's main unit, e.g. 189.00." />
        <TextField label="Currency" name="currency" maxLength={3} autoCapitalize="characters" {...field} hint="ISO 4217 code: EUR, USD, GBP…" />
      </fieldset>

      <RepeatingRows
        key={JSON.stringify(state.values ?? null)}
        legend="Accessories in the box"
        hint="Nozzles, tips and stands that come with the tool."
        addLabel="Add an accessory"
        rowLabel={(index) => `Accessory ${index + 1}`}
        initialCount={countIndexedRows(values, "accessories")}
        renderRow={(index, source) => {
          const stored = (part: string) => (source === null ? undefined : values[`accessories.${source}.${part}`]);
          return (
            <>
              <SelectField label="Kind" id={`accessories-${index}-kind`} name={`accessories.${index}.kind`} errors={errors} defaultValue={stored("kind") ?? "nozzle"}>
                {accessoryKinds.map((kind) => (
                  <option key={kind} value={kind}>
                    {accessoryKindLabels[kind]}
                  </option>
                ))}
              </SelectField>
              <TextField label="Name" name={`accessories.${index}.name`} errors={errors} defaultValue={stored("name")} />
              <TextField label="Size" name={`accessories.${index}.size`} errors={errors} defaultValue={stored("size")} hint="e.g. 6 mm" />
            </>
          );
        }}
      />

      <TextAreaField label="Summary" name="summary" rows={3} {...field} hint="One or two sentences readers see under the tool's name." />

      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>{slug ? "Save ratings" : "Add tool"}</SubmitButton>
    </form>
  );
}
