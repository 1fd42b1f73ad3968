"use client";

import type { ReactNode } from "react";
import type { z } from "zod";
import { FormStatus, SubmitButton } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import type { ActionState } from "@/lib/action-state";

type FieldErrors = ActionState["fieldErrors"];
type Values = ActionState["values"];

/**
 * A small form bound to one server action: hidden fields, the visible fields the caller draws (given the field
 * errors and echoed values), a status line and a button.
 */
export function ActionForm({
  action,
  schema,
  hidden,
  submitLabel,
  fields,
  className = "flex flex-col gap-3",
  encType,
}: {
  action: (previous: ActionState, formData: FormData) => Promise<ActionState>;
  schema: z.ZodType;
  hidden: Record<string, string>;
  submitLabel: string;
  fields?: (errors: FieldErrors, values: Values) => ReactNode;
  className?: string;
  encType?: "multipart/form-data";
}) {
  const [state, formAction, pending] = useCheckedAction(action, schema);
  return (
    <form action={formAction} className={className} encType={encType} noValidate>
      {Object.entries(hidden).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      {fields?.(state.fieldErrors, state.values)}
      <FormStatus status={state.status} message={state.message} />
      {state.fieldErrors?.submission ? (
        <ul className="list-disc space-y-1 pl-5 text-sm text-copper-deep">
          {state.fieldErrors.submission.map((problem) => (
            <li key={problem}>{problem}</li>
          ))}
        </ul>
      ) : null}
      <div>
        <SubmitButton pending={pending}>{submitLabel}</SubmitButton>
      </div>
    </form>
  );
}
