"use client";

import { useState } from "react";
import { FormStatus, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { updateReportSchema } from "@/lib/validations/reports";
import { updateReport } from "../actions";
import { MdxPreview } from "./mdx-preview";
import { ToolFields } from "./tool-fields";

export type EditableReport = {
  id: string;
  title: string;
  toolId: string;
  secondToolId: string | undefined;
  disclosure: string;
  bodyMdx: string;
};

export function ReportEditor({ report, tools }: { report: EditableReport; tools: { id: string; name: string }[] }) {
  const [state, formAction, pending] = useCheckedAction(updateReport, updateReportSchema);
  const [body, setBody] = useState(report.bodyMdx);
  const values = state.values ?? { title: report.title, disclosure: report.disclosure };
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="reportId" value={report.id} />
      <TextField label="Title" name="title" errors={state.fieldErrors} values={values} key={`title-${values.title}`} required maxLength={160} />
      <ToolFields
        tools={tools}
        errors={state.fieldErrors}
        toolId={state.values?.toolId ?? report.toolId}
        secondToolId={state.values?.secondToolId ?? report.secondToolId}
      />
      <TextAreaField
        label="Disclosure"
        name="disclosure"
        errors={state.fieldErrors}
        values={values}
        key={`disclosure-${values.disclosure}`}
        rows={4}
        hint="How each unit was obtained (bought, loaned, given) and any tie to the maker: loans, gifts, payments, affiliate links, or that there is none."
      />
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor="bodyMdx" className="text-sm font-semibold text-ink">
            Body (MDX)
          </label>
          <textarea
            id="bodyMdx"
            name="bodyMdx"
            value={body}
            onChange={(event) => setBody(event.target.value)}
            rows={28}
            spellCheck
            aria-describedby="bodyMdx-hint"
            aria-invalid={state.fieldErrors?.bodyMdx?.length ? true : undefined}
            className="min-h-96 rounded border border-rule bg-paper-raised px-3 py-2 font-mono text-sm text-ink"
          />
          <p id="bodyMdx-hint" className="text-xs text-ink-faint">
            Markdown, plus the components listed below. Scripts, expressions in braces and unknown elements are removed.
          </p>
          {state.fieldErrors?.bodyMdx ? <p className="text-sm text-copper-deep">{state.fieldErrors.bodyMdx.join(" ")}</p> : null}
        </div>
        <MdxPreview reportId={report.id} source={body} />
      </div>
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Save draft</SubmitButton>
      </div>
    </form>
  );
}
