"use client";

import { FormStatus, SelectField, SubmitButton, TextAreaField, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { proposeRevisionSchema, revisionKindLabels, revisionKinds } from "@/lib/validations/editorial";
import { proposeRevision } from "../actions";

export type RevisionFormReport = {
  id: string;
  title: string;
  disclosure: string;
  bodyMdx: string;
  citations: { label: string; analysisId: string }[];
};

export function RevisionForm({ report, citable }: { report: RevisionFormReport; citable: { analysisId: string; description: string }[] }) {
  const [state, formAction, pending] = useCheckedAction(proposeRevision, proposeRevisionSchema);
  const values = state.values;
  return (
    <form action={formAction} className="flex max-w-4xl flex-col gap-4" noValidate>
      <input type="hidden" name="reportId" value={report.id} />
      <SelectField label="Kind of revision" name="kind" errors={state.fieldErrors} defaultValue={values?.kind ?? "correction"}>
        {revisionKinds.map((kind) => (
          <option key={kind} value={kind}>
            {revisionKindLabels[kind]}: {kind === "correction" ? "a finding or figure changes" : "wording, context or a link, no finding changes"}
          </option>
        ))}
      </SelectField>
      <TextAreaField
        label="Change note"
        name="changeNote"
        rows={3}
        errors={state.fieldErrors}
        values={values}
        hint="Readers see this beside the revision: what changed and why."
      />
      <fieldset className="min-w-0 space-y-3 rounded border border-rule p-4">
        <legend className="px-1 text-sm font-semibold">Cited analyses</legend>
        <p className="text-xs text-ink-faint">Point a label at a newer analysis (after a re-analysis) to carry its figures into this revision.</p>
        {report.citations.map((citation, index) => (
          <div key={citation.label}>
            <input type="hidden" name={`citations.${index}.label`} value={citation.label} />
            <SelectField
              label={`“${citation.label}”`}
              name={`citations.${index}.analysisId`}
              errors={state.fieldErrors}
              defaultValue={values?.[`citations.${index}.analysisId`] ?? citation.analysisId}
            >
              {citable.map((choice) => (
                <option key={choice.analysisId} value={choice.analysisId}>
                  {choice.analysisId === citation.analysisId ? "(cited now) " : ""}
                  {choice.description}
                </option>
              ))}
            </SelectField>
          </div>
        ))}
      </fieldset>
      <TextField label="Title" name="title" errors={state.fieldErrors} defaultValue={values?.title ?? report.title} />
      <TextAreaField label="Disclosure" name="disclosure" rows={3} errors={state.fieldErrors} defaultValue={values?.disclosure ?? report.disclosure} />
      <TextAreaField
        label="Body (MDX)"
        name="bodyMdx"
        rows={18}
        errors={state.fieldErrors}
        defaultValue={values?.bodyMdx ?? report.bodyMdx}
        className="rounded border border-rule bg-paper-raised px-3 py-2 font-mono text-sm text-ink aria-invalid:border-copper"
      />
      <FormStatus status={state.status} message={state.message} />
      {state.fieldErrors?.submission ? (
        <ul className="list-disc space-y-1 pl-5 text-sm text-copper-deep">
          {state.fieldErrors.submission.map((problem) => (
            <li key={problem}>{problem}</li>
          ))}
        </ul>
      ) : null}
      <div>
        <SubmitButton pending={pending}>Send the revision to the desk</SubmitButton>
      </div>
    </form>
  );
}
