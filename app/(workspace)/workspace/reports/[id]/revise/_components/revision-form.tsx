"use client";

import { ActionForm } from "@/components/ui/action-form";
import { SelectField, TextAreaField, TextField } from "@/components/ui/form-controls";
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
  return (
    <ActionForm
      action={proposeRevision}
      schema={proposeRevisionSchema}
      hidden={{ reportId: report.id }}
      submitLabel="Send the revision to the desk"
      className="flex max-w-4xl flex-col gap-4"
      fields={(errors, values) => (
        <>
          <SelectField label="Kind of revision" name="kind" errors={errors} defaultValue={values?.kind ?? "correction"}>
            {revisionKinds.map((kind) => (
              <option key={kind} value={kind}>
                {revisionKindLabels[kind]}: {kind === "correction" ? "a finding or figure changes" : "wording, context or a link, no finding changes"}
              </option>
            ))}
          </SelectField>
          <TextAreaField label="Change note" name="changeNote" rows={3} errors={errors} values={values} hint="Readers see this beside the revision: what changed and why." />
          <fieldset className="min-w-0 space-y-3 rounded border border-rule p-4">
            <legend className="px-1 text-sm font-semibold">Cited analyses</legend>
            <p className="text-xs text-ink-faint">Point a label at a newer analysis (after a re-analysis) to carry its figures into this revision.</p>
            {report.citations.map((citation, index) => (
              <div key={citation.label}>
                <input type="hidden" name={`citations.${index}.label`} value={citation.label} />
                <SelectField
                  label={`“${citation.label}”`}
                  name={`citations.${index}.analysisId`}
                  errors={errors}
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
          <TextField label="Title" name="title" errors={errors} defaultValue={values?.title ?? report.title} />
          <TextAreaField label="Disclosure" name="disclosure" rows={3} errors={errors} defaultValue={values?.disclosure ?? report.disclosure} />
          <TextAreaField
            label="Body (MDX)"
            name="bodyMdx"
            rows={18}
            errors={errors}
            defaultValue={values?.bodyMdx ?? report.bodyMdx}
            className="rounded border border-rule bg-paper-raised px-3 py-2 font-mono text-sm text-ink aria-invalid:border-copper"
          />
        </>
      )}
    />
  );
}
