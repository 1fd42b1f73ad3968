import type { ReactNode } from "react";
import { SelectField } from "@/components/ui/form-controls";
import type { AccuracyChoice } from "@/lib/analysis-options";

type Errors = Record<string, string[] | undefined> | undefined;

/** A column of the capture by the name its header gives it; `none` adds a "no such column" choice. */
export function ColumnSelect({
  label,
  name,
  columns,
  defaultValue,
  errors,
  none,
}: {
  label: string;
  name: string;
  columns: string[];
  defaultValue: string | undefined;
  errors: Errors;
  none?: string;
}) {
  return (
    <SelectField label={label} name={name} errors={errors} defaultValue={defaultValue ?? ""}>
      {none ? <option value="">{none}</option> : null}
      {columns.map((column, index) => (
        <option key={`${index}-${column}`} value={column}>
          {index + 1}: {column}
        </option>
      ))}
    </SelectField>
  );
}

export function AccuracySelect({
  label,
  name,
  choices,
  defaultValue,
  errors,
  hint,
}: {
  label: string;
  name: string;
  choices: AccuracyChoice[];
  defaultValue: string | undefined;
  errors: Errors;
  hint?: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-1">
      <SelectField label={label} name={name} errors={errors} defaultValue={defaultValue ?? ""}>
        <option value="">No accuracy spec (no Type B term)</option>
        {choices.map((choice) => (
          <option key={choice.value} value={choice.value}>
            {choice.label}
          </option>
        ))}
      </SelectField>
      {hint ? <p className="text-xs text-ink-faint">{hint}</p> : null}
    </div>
  );
}
