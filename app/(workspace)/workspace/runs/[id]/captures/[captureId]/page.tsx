import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { SafetyNotice } from "@/components/safety-notice";
import { getAnalysis, getCapture, listCaptureAnalyses } from "@/db/queries/captures";
import { getRun, listRunInstruments } from "@/db/queries/runs";
import {
  accuracyChoices,
  heatUpMappingDefaults,
  waveformMappingDefaults,
  type StoredAnalysisOptions,
} from "@/lib/analysis-options";
import type { CaptureAnalysis } from "@/lib/bench/analysis";
import { CaptureError } from "@/lib/bench/capture-csv";
import { referenceImpedance } from "@/lib/bench/flicker";
import { readStoredCaptureColumns } from "@/lib/capture-uploads";
import type { HeatUpLogResult } from "@/lib/run-measurements";
import { requirePagePermission } from "@/lib/session";
import { captureKindLabels } from "@/lib/validations/runs";
import { AnalysisFigures } from "./_components/analysis-figures";
import { AnalysisStatus } from "./_components/analysis-status";
import { HeatUpMappingForm } from "./_components/heat-up-mapping-form";
import { WaveformMappingForm } from "./_components/waveform-mapping-form";

export const metadata: Metadata = { title: "Capture" };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

async function readHeading(objectKey: string) {
  try {
    return { heading: await readStoredCaptureColumns(objectKey), problem: null };
  } catch (error) {
    if (error instanceof CaptureError) return { heading: null, problem: error.message };
    throw error;
  }
}

function describeMapping(options: StoredAnalysisOptions): string {
  if (options.kind === "waveform") {
    const { mapping } = options;
    return `current “${mapping.currentColumn}” × ${mapping.currentScale}${mapping.voltageColumn ? `, voltage “${mapping.voltageColumn}” × ${mapping.voltageScale}` : ", no voltage"}, Class ${mapping.harmonicClass}, ${mapping.rule} rule`;
  }
  const { mapping } = options;
  return `temperature “${mapping.temperatureColumn}” × ${mapping.temperatureScale}, setpoint ${mapping.setpointC} °C ± ${mapping.bandC} °C, ${mapping.rule} rule`;
}

export default async function CapturePage({ params, searchParams }: PageProps<"/workspace/runs/[id]/captures/[captureId]">) {
  const { id, captureId } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/runs/${id}/captures/${captureId}`);
  if (!uuid.test(id) || !uuid.test(captureId)) notFound();
  const [run, capture] = await Promise.all([getRun({ id, viewer: user }), getCapture({ id: captureId, viewer: user })]);
  if (!run || !capture || capture.runId !== run.id || capture.status !== "uploaded") notFound();
  const [instruments, analyses, { heading, problem }] = await Promise.all([
    listRunInstruments({ runId: run.id }),
    listCaptureAnalyses({ captureId }),
    readHeading(capture.objectKey),
  ]);
  const wanted = (await searchParams).analysis;
  const selectedId = typeof wanted === "string" && analyses.some((analysis) => analysis.id === wanted) ? wanted : analyses[0]?.id;
  const selected = selectedId ? await getAnalysis({ id: selectedId, viewer: user }) : null;
  const previous = analyses[0]?.options as StoredAnalysisOptions | undefined;
  const { conditions } = run;

  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm">
          <Link href={`/workspace/runs/${run.id}`} className="text-verdigris-deep hover:text-copper">
            ← Run of {run.testedOn}: {run.tool.name}
          </Link>
        </p>
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">{captureKindLabels[capture.kind]}</p>
        <h1 className="break-all font-serif text-3xl">{capture.fileName}</h1>
      </header>
      <SafetyNotice compact />

      {selected ? (
        <section aria-labelledby="analysis-heading" className="space-y-4">
          <h2 id="analysis-heading" className="font-serif text-2xl">
            Analysis of {selected.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC
          </h2>
          <p className="text-sm text-ink-soft">{describeMapping(selected.options)}.</p>
          {selected.status === "queued" || selected.status === "running" ? (
            <AnalysisStatus analysisId={selected.id} initialStatus={selected.status} />
          ) : selected.status === "failed" ? (
            <div role="alert" className="rounded border-l-4 border-copper bg-copper-wash/60 px-4 py-3 text-sm">
              <p className="font-semibold text-copper-deep">The analysis failed{selected.error?.line ? ` at line ${selected.error.line} of the file` : ""}.</p>
              <p>{selected.error?.message}</p>
              <p className="mt-1 text-ink-soft">Correct the mapping below and start the analysis again, or upload a corrected file.</p>
            </div>
          ) : (
            <>
              <p className="text-xs text-ink-faint">Analysis code {selected.analysisVersion}.</p>
              <AnalysisFigures
                kind={selected.options.kind}
                result={selected.result as unknown as CaptureAnalysis | HeatUpLogResult}
                series={selected.displaySeries ?? null}
              />
            </>
          )}
        </section>
      ) : null}

      <section aria-labelledby="mapping-heading" className="space-y-3">
        <h2 id="mapping-heading" className="font-serif text-2xl">
          {analyses.length ? "Analyse again with another mapping" : "Map the columns and analyse"}
        </h2>
        {analyses.length ? (
          <p className="text-sm text-ink-soft">A new analysis never replaces an earlier one: reports keep citing the analysis they chose.</p>
        ) : null}
        {heading ? (
          <>
            <p className="text-sm text-ink-soft">
              The file&apos;s header names {heading.columns.length} columns: {heading.columns.map((column) => `“${column}”`).join(", ")}; numbers start on line{" "}
              {heading.firstDataLine}.
              {heading.header.length ? ` Header: ${heading.header.map((entry) => `${entry.key}${entry.value ? ` ${entry.value}` : ""}`).join("; ")}.` : ""}
            </p>
            {capture.kind === "waveform" ? (
              <WaveformMappingForm
                captureId={capture.id}
                columns={heading.columns}
                defaults={waveformMappingDefaults({
                  heading,
                  previous: previous?.kind === "waveform" ? previous.mapping : null,
                  expectedCurrentA: run.tool.ratedPowerW / conditions.supplyVoltage,
                  nominalVoltage: conditions.supplyVoltage,
                  instruments,
                })}
                currentChoices={accuracyChoices(instruments, "current")}
                voltageChoices={accuracyChoices(instruments, "voltage")}
                supply={{
                  voltage: conditions.supplyVoltage,
                  frequencyHz: conditions.supplyFrequencyHz,
                  referenceImpedance: referenceImpedance(conditions.supplyVoltage, conditions.supplyFrequencyHz) !== null,
                }}
              />
            ) : (
              <HeatUpMappingForm
                captureId={capture.id}
                columns={heading.columns}
                defaults={heatUpMappingDefaults({
                  heading,
                  previous: previous?.kind === "heat_up_log" ? previous.mapping : null,
                  setpointC: conditions.temperatureSetpointC,
                  tolerances: run.protocol.tolerances,
                  instruments,
                })}
                temperatureChoices={accuracyChoices(instruments, "temperature")}
              />
            )}
          </>
        ) : (
          <p role="alert" className="rounded border-l-4 border-copper bg-copper-wash/60 px-4 py-3 text-sm">
            The file cannot be read as a capture: {problem ?? "it is missing from storage"}. Upload a corrected export on the run page.
          </p>
        )}
      </section>

      {analyses.length ? (
        <section aria-labelledby="history-heading" className="space-y-3">
          <h2 id="history-heading" className="font-serif text-2xl">
            Analyses of this capture
          </h2>
          <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
            {analyses.map((analysis) => (
              <li key={analysis.id} className="flex flex-wrap items-baseline justify-between gap-2 px-4 py-2">
                <Link
                  href={`/workspace/runs/${run.id}/captures/${capture.id}?analysis=${analysis.id}`}
                  aria-current={analysis.id === selected?.id ? "true" : undefined}
                  className="hover:text-copper aria-[current=true]:font-semibold"
                >
                  {analysis.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC
                </Link>
                <span className="text-ink-soft">{describeMapping(analysis.options as StoredAnalysisOptions)}</span>
                <span className="text-xs font-semibold uppercase tracking-wide">{analysis.status}</span>
              </li>
            ))}
          </ol>
        </section>
      ) : null}
    </article>
  );
}
