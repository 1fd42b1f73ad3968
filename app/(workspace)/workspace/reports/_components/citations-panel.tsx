"use client";

import { SelectField, TextField } from "@/components/ui/form-controls";
import { citeAnalysisSchema, removeCitationSchema } from "@/lib/validations/reports";
import { citeAnalysis, removeCitation } from "../actions";
import { ActionForm } from "@/components/ui/action-form";

export type CitationRow = { label: string; analysisId: string; status: string; captureKind: string; captureFileName: string; testedOn: string; toolName: string };
export type CitableRow = { analysisId: string; description: string };

const kindWords: Record<string, string> = { waveform: "waveform", heat_up_log: "heat-up log" };

export function CitationsPanel({ reportId, citations, citable }: { reportId: string; citations: CitationRow[]; citable: CitableRow[] }) {
  return (
    <section aria-labelledby="citations-heading" className="space-y-3">
      <h2 id="citations-heading" className="font-serif text-2xl">
        Cited analyses
      </h2>
      <p className="max-w-3xl text-sm text-ink-soft">
        The body embeds an analysis by its label, e.g. <code className="figure">&lt;VerdictTable analysis=&quot;label&quot; /&gt;</code>. A label keeps
        pointing at the analysis chosen here, even after a re-analysis; choose the new analysis under the same label to move it.
      </p>
      {citations.length ? (
        <ul className="divide-y divide-rule rounded border border-rule bg-paper-raised">
          {citations.map((citation) => (
            <li key={citation.label} className="flex flex-wrap items-center justify-between gap-3 px-3 py-2 text-sm">
              <span>
                <span className="figure font-semibold">{citation.label}</span> · {citation.toolName}, {kindWords[citation.captureKind] ?? citation.captureKind}{" "}
                {citation.captureFileName}, run of {citation.testedOn}
                {citation.status !== "done" ? <span className="text-copper-deep"> · analysis {citation.status}</span> : null}
              </span>
              <ActionForm
                action={removeCitation}
                schema={removeCitationSchema}
                hidden={{ reportId, label: citation.label }}
                submitLabel={`Remove ${citation.label}`}
                className="flex items-center gap-2"
              />
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-soft">Nothing cited yet.</p>
      )}
      <ActionForm
        action={citeAnalysis}
        schema={citeAnalysisSchema}
        hidden={{ reportId }}
        submitLabel="Cite"
        className="flex max-w-3xl flex-col gap-3 rounded border border-rule bg-paper-sunk p-3"
        fields={(errors, values) => (
          <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_14rem] [&>*]:min-w-0">
            <SelectField label="Analysis" name="analysisId" errors={errors} defaultValue={values?.analysisId ?? ""} key={values?.analysisId}>
              <option value="">{citable.length ? "Choose a finished analysis…" : "No finished analysis of this report's tools yet"}</option>
              {citable.map((row) => (
                <option key={row.analysisId} value={row.analysisId}>
                  {row.description}
                </option>
              ))}
            </SelectField>
            <TextField label="Label" name="label" errors={errors} values={values} key={values?.label} placeholder="e.g. full-power" hint="Lower case, digits, hyphens." />
          </div>
        )}
      />
    </section>
  );
}
