"use client";

import { createInstrument, updateInstrument } from "@/app/(workspace)/workspace/instruments/actions";
import { FormStatus, SelectField, SubmitButton, TextField } from "@/components/ui/form-controls";
import { countIndexedRows, RepeatingRows } from "@/components/ui/repeating-rows";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { accuracyQuantities, accuracyQuantityInfo, instrumentKindLabels, instrumentKinds } from "@/lib/instrument-kinds";
import { instrumentFormSchema, instrumentUpdateSchema } from "@/lib/validations/instrument";

type Lab = { id: string; name: string };

/** An instrument's identity, accuracy lines and calibration; `id` set means editing that instrument. */
export function InstrumentForm({ labs, defaults, id }: { labs: Lab[]; defaults: Record<string, string>; id?: string }) {
  const [state, formAction, pending] = useCheckedAction(id ? updateInstrument : createInstrument, id ? instrumentUpdateSchema : instrumentFormSchema);
  const values = state.values ?? defaults;
  const errors = state.fieldErrors;
  const field = { errors, values };
  return (
    <form action={formAction} noValidate className="space-y-8">
      {id ? <input type="hidden" name="id" value={id} /> : null}
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Instrument</legend>
        <SelectField label="Kind" name="kind" errors={errors} defaultValue={values.kind ?? ""} key={`kind-${values.kind}`}>
          <option value="" disabled>
            Choose…
          </option>
          {instrumentKinds.map((kind) => (
            <option key={kind} value={kind}>
              {instrumentKindLabels[kind]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Lab" name="labId" errors={errors} defaultValue={values.labId ?? ""} key={`lab-${values.labId}`}>
          <option value="">No lab (kept by you)</option>
          {labs.map((lab) => (
            <option key={lab.id} value={lab.id}>
              {lab.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Maker" name="maker" {...field} />
        <TextField label="Model" name="model" {...field} />
        <TextField label="Serial number" name="serialNumber" {...field} />
      </fieldset>

      <RepeatingRows
        key={JSON.stringify(state.values ?? null)}
        legend="Accuracy per range"
        hint={
          <>
            One line per range from the datasheet, written ±(% of reading + offset), e.g. <span className="figure">1.5% + 0.05</span> for
            ±(1.5 % of reading + 0.05 A). The offset is in the range&apos;s unit.
          </>
        }
        addLabel="Add a range"
        rowLabel={(index) => `Range ${index + 1}`}
        initialCount={countIndexedRows(values, "accuracy")}
        minRows={1}
        error={errors?.accuracy}
        renderRow={(index, source) => {
          const stored = (part: string) => (source === null ? undefined : values[`accuracy.${source}.${part}`]);
          return (
            <>
              <SelectField label="Quantity" name={`accuracy.${index}.quantity`} errors={errors} defaultValue={stored("quantity") ?? "current"}>
                {accuracyQuantities.map((quantity) => (
                  <option key={quantity} value={quantity}>
                    {accuracyQuantityInfo[quantity].label} ({accuracyQuantityInfo[quantity].unit})
                  </option>
                ))}
              </SelectField>
              <TextField label="Unit" name={`accuracy.${index}.unit`} errors={errors} defaultValue={stored("unit")} size={6} />
              <TextField label="Range maximum" name={`accuracy.${index}.rangeMax`} errors={errors} defaultValue={stored("rangeMax")} inputMode="decimal" size={8} />
              <TextField label="Accuracy ±(% + offset)" name={`accuracy.${index}.spec`} errors={errors} defaultValue={stored("spec")} placeholder="1.5% + 0.05" />
            </>
          );
        }}
      />

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 font-serif text-xl">Calibration</legend>
        <TextField label="Calibrated on" name="calibratedOn" type="date" {...field} />
        <TextField label="Calibration due on" name="calibrationDueOn" type="date" {...field} hint="From the calibration certificate." />
      </fieldset>

      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>{id ? "Save instrument" : "Add instrument"}</SubmitButton>
    </form>
  );
}
