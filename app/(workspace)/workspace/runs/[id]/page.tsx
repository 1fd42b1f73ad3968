import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import { formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { SafetyNotice } from "@/components/safety-notice";
import { EmptyTableRow } from "@/components/ui/empty-table-row";
import { listRunCaptures } from "@/db/queries/captures";
import { getRun, getRunFormChoices, listCalibrationWarnings, listManualReadings, listRunInstruments } from "@/db/queries/runs";
import { mean } from "@/lib/bench/statistics";
import { measurementKindInfo } from "@/lib/measurement-kinds";
import { storedVerdictSchema } from "@/lib/report-embeds";
import { accuracyForReading, describeReadings } from "@/lib/run-measurements";
import { requirePagePermission } from "@/lib/session";
import { captureKindLabels, unitSourceLabels } from "@/lib/validations/runs";
import { RunForm, type RunFormValues } from "../_components/run-form";
import { CaptureUpload } from "./_components/capture-upload";
import { DeleteReadingButton } from "./_components/delete-reading-button";
import { ManualReadingForm } from "./_components/manual-reading-form";

export const metadata: Metadata = { title: "Test run" };

const statusLabels = {
  awaiting_upload: "Upload not finished",
  uploaded: "Uploaded",
  abandoned: "Abandoned",
  queued: "Analysis queued",
  running: "Analysing…",
  done: "Analysed",
  failed: "Analysis failed",
} as const;

function FactList({ rows, figures = false }: { rows: [string, string][]; figures?: boolean }) {
  return (
    <dl className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
      {rows.map(([label, value]) => (
        <div key={label} className="grid grid-cols-2 gap-4 px-4 py-2">
          <dt className="text-ink-soft">{label}</dt>
          <dd className={figures ? "figure" : undefined}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function formatBytes(bytes: number): string {
  return bytes < 1024 * 1024 ? `${formatNumber(bytes / 1024, 3)} KB` : `${formatNumber(bytes / 1024 / 1024, 3)} MB`;
}

function runFormValues(run: NonNullable<Awaited<ReturnType<typeof getRun>>>): RunFormValues {
  const text = (value: number | string | null) => (value === null ? "" : String(value));
  return {
    testedOn: run.testedOn,
    unitSerialNumber: run.unit.serialNumber,
    unitFirmware: text(run.unit.firmware),
    unitVoltageVariant: run.unit.voltageVariant,
    unitSource: run.unit.source,
    unitSourceNote: text(run.unit.sourceNote),
    notes: run.notes,
    ...Object.fromEntries(Object.entries(run.conditions).map(([name, value]) => [name, text(value)])),
  };
}

export default async function RunPage({ params }: PageProps<"/workspace/runs/[id]">) {
  const { id } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/runs/${id}`);
  const run = /^[0-9a-f-]{36}$/i.test(id) ? await getRun({ id, viewer: user }) : null;
  if (!run) notFound();
  const [instruments, warnings, readings, captures, choices] = await Promise.all([
    listRunInstruments({ runId: run.id }),
    listCalibrationWarnings({ runIds: [run.id] }),
    listManualReadings({ runId: run.id }),
    listRunCaptures({ runId: run.id }),
    getRunFormChoices({ viewer: user }),
  ]);
  const instrumentLabel = (instrumentId: string | null) => {
    const snapshot = instruments.find((entry) => entry.instrumentId === instrumentId)?.snapshot;
    return snapshot ? `${snapshot.maker} ${snapshot.model} (${snapshot.serialNumber})` : "—";
  };
  const { conditions, unit } = run;
  const conditionRows: [string, string][] = [
    ["Supply", `${conditions.supplyVoltage} V, ${conditions.supplyFrequencyHz} Hz`],
    ["Measured supply voltage", conditions.measuredSupplyVoltage === null ? "not measured" : `${conditions.measuredSupplyVoltage} V`],
    ["Ambient", `${conditions.ambientC} °C`],
    ["Nozzle or tip", conditions.nozzle ?? "—"],
    ["Airflow setpoint", conditions.airflowSetpoint ?? "—"],
    ["Temperature setpoint", conditions.temperatureSetpointC === null ? "—" : `${conditions.temperatureSetpointC} °C`],
    ["Measuring distance", conditions.measuringDistanceMm === null ? "—" : `${conditions.measuringDistanceMm} mm`],
    ["Warm-up", `${conditions.warmUpMinutes} min`],
  ];
  const unitRows: [string, string][] = [
    ["Serial number", unit.serialNumber],
    ["Firmware", unit.firmware ?? "—"],
    ["Voltage variant", unit.voltageVariant],
    ["Obtained", `${unitSourceLabels[unit.source]}${unit.sourceNote ? `: ${unit.sourceNote}` : ""}`],
  ];

  return (
    <article className="space-y-10">
      <header className="space-y-2">
        <p className="text-sm">
          <Link href="/workspace/runs" className="text-verdigris-deep hover:text-copper">
            ← Test runs
          </Link>
        </p>
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">Test run · {run.testedOn}</p>
        <h1 className="font-serif text-3xl sm:text-4xl">{run.tool.name}</h1>
        <p className="text-ink-soft">
          {run.lab.name} · {run.protocol.name} v{run.protocol.version} · by {run.reviewerName}
        </p>
      </header>

      {warnings.length ? (
        <section role="alert" aria-labelledby="calibration-heading" className="rounded border-l-4 border-copper bg-copper-wash/60 px-4 py-3 text-sm">
          <h2 id="calibration-heading" className="font-semibold text-copper-deep">
            Calibration overdue on the test date
          </h2>
          <ul className="mt-1 list-disc pl-5">
            {warnings.map((warning) => (
              <li key={warning.instrumentId}>
                {warning.maker} {warning.model} ({warning.serialNumber}) was due for calibration on {warning.calibrationDueOn}; this run is dated {warning.testedOn}.
                Its readings carry no traceable accuracy.
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="cautions-heading" className="space-y-2">
        <h2 id="cautions-heading" className="sr-only">
          Safety
        </h2>
        <SafetyNotice />
        {run.protocol.safetyCautions ? (
          <details className="text-sm">
            <summary className="cursor-pointer font-semibold">The protocol&apos;s safety cautions</summary>
            <p className="mt-2 max-w-3xl whitespace-pre-line text-ink-soft">{run.protocol.safetyCautions}</p>
          </details>
        ) : null}
      </section>

      <div className="grid gap-8 lg:grid-cols-2">
        <section aria-labelledby="unit-heading">
          <h2 id="unit-heading" className="mb-3 font-serif text-2xl">
            Unit tested
          </h2>
          <FactList rows={unitRows} />
        </section>
        <section aria-labelledby="conditions-heading">
          <h2 id="conditions-heading" className="mb-3 font-serif text-2xl">
            Supply and conditions
          </h2>
          <FactList rows={conditionRows} figures />
        </section>
      </div>

      <section aria-labelledby="instruments-heading" className="space-y-3">
        <h2 id="instruments-heading" className="font-serif text-2xl">
          Instruments, as recorded for this run
        </h2>
        <ul className="grid gap-3 md:grid-cols-2">
          {instruments.map(({ instrumentId, snapshot }) => (
            <li key={instrumentId} className="rounded border border-rule bg-paper-raised px-4 py-3 text-sm">
              <p className="font-semibold">
                {snapshot.maker} {snapshot.model} <span className="font-normal text-ink-soft">· {snapshot.kind.replaceAll("_", " ")} · {snapshot.serialNumber}</span>
              </p>
              <p className="text-xs text-ink-faint">
                Calibrated {snapshot.calibratedOn}, due {snapshot.calibrationDueOn}
              </p>
              <ul className="figure mt-1 text-xs">
                {snapshot.accuracy.map((range, index) => (
                  <li key={index}>
                    {range.quantity.replaceAll("_", " ")} to {range.rangeMax} {range.unit}: ±({range.percentOfReading} % + {range.offset} {range.unit})
                  </li>
                ))}
              </ul>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="readings-heading" className="space-y-4">
        <h2 id="readings-heading" className="font-serif text-2xl">
          Manual readings
        </h2>
        {/* relative: the delete buttons' screen-reader labels are positioned, and would otherwise widen the page on a phone. */}
        <div className="relative overflow-x-auto rounded border border-rule bg-paper-raised">
          <table className="w-full min-w-[56rem] text-left text-sm">
            <caption className="sr-only">Readings taken by hand, with their spread, uncertainty and verdict</caption>
            <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2">Quantity</th>
                <th scope="col" className="px-3 py-2">Readings</th>
                <th scope="col" className="px-3 py-2 text-right">Mean</th>
                <th scope="col" className="px-3 py-2 text-right">Spread (s, min–max)</th>
                <th scope="col" className="px-3 py-2 text-right">Type A</th>
                <th scope="col" className="px-3 py-2 text-right">Type B</th>
                <th scope="col" className="px-3 py-2 text-right">Mean ± U (k = 2)</th>
                <th scope="col" className="px-3 py-2">Verdict</th>
                <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {readings.map((reading) => {
                const snapshot = instruments.find((entry) => entry.instrumentId === reading.instrumentId)?.snapshot;
                const described = describeReadings({
                  values: reading.values,
                  accuracy: snapshot ? accuracyForReading(snapshot.accuracy, reading.unit, mean(reading.values)) : null,
                });
                const verdict = storedVerdictSchema.safeParse(reading.verdict);
                const label = measurementKindInfo[reading.kind].label;
                return (
                  <tr key={reading.id} className="border-t border-rule align-top">
                    <th scope="row" className="px-3 py-2 font-semibold">
                      {label}
                      <span className="block text-xs font-normal text-ink-faint">{instrumentLabel(reading.instrumentId)}</span>
                      {reading.note ? <span className="block text-xs font-normal text-ink-soft">{reading.note}</span> : null}
                    </th>
                    <td className="figure px-3 py-2">{reading.values.map((value) => formatNumber(value)).join(", ")}</td>
                    <td className="figure px-3 py-2 text-right">
                      {formatNumber(described.spread.mean)} {reading.unit}
                    </td>
                    <td className="figure px-3 py-2 text-right">
                      {formatNumber(described.spread.standardDeviation, 3)} ({formatNumber(described.spread.min)}–{formatNumber(described.spread.max)})
                    </td>
                    <td className="figure px-3 py-2 text-right">{described.typeA === null ? "one reading" : formatNumber(described.typeA, 3)}</td>
                    <td className="figure px-3 py-2 text-right">{described.uncertainty.typeB === null ? "no spec" : formatNumber(described.uncertainty.typeB, 3)}</td>
                    <td className="figure px-3 py-2 text-right">{formatMeasured(described.spread.mean, described.uncertainty.expanded, reading.unit)}</td>
                    <td className="px-3 py-2">
                      {verdict.success ? <VerdictBadge result={verdict.data.result} /> : <span className="text-xs text-ink-faint">no rating applies</span>}
                    </td>
                    <td className="px-3 py-2">
                      <DeleteReadingButton readingId={reading.id} label={label} />
                    </td>
                  </tr>
                );
              })}
              {readings.length === 0 ? (
                <EmptyTableRow columns={9}>No readings yet.</EmptyTableRow>
              ) : null}
            </tbody>
          </table>
        </div>
        <h3 className="font-serif text-xl">Record readings</h3>
        <ManualReadingForm
          runId={run.id}
          instruments={instruments.map(({ instrumentId }) => ({ id: instrumentId, label: instrumentLabel(instrumentId) }))}
          requiredKinds={run.protocol.requiredMeasurements}
          repeats={run.protocol.repeats}
        />
      </section>

      <section aria-labelledby="captures-heading" className="space-y-4">
        <h2 id="captures-heading" className="font-serif text-2xl">
          Captures
        </h2>
        {captures.length ? (
          <ul className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
            {captures.map((capture) => (
              <li key={capture.id} className="flex flex-wrap items-center justify-between gap-2 px-4 py-3">
                <span>
                  {capture.status === "uploaded" ? (
                    <Link href={`/workspace/runs/${run.id}/captures/${capture.id}`} className="font-semibold hover:text-copper">
                      {capture.fileName}
                    </Link>
                  ) : (
                    <span className="font-semibold">{capture.fileName}</span>
                  )}
                  <span className="block text-xs text-ink-faint">
                    {captureKindLabels[capture.kind]} · {formatBytes(capture.declaredBytes)}
                  </span>
                </span>
                <span className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
                  {capture.latestAnalysisStatus ? statusLabels[capture.latestAnalysisStatus] : statusLabels[capture.status]}
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-soft">No captures yet.</p>
        )}
        <h3 className="font-serif text-xl">Upload a capture</h3>
        <CaptureUpload runId={run.id} />
      </section>

      <section aria-labelledby="edit-heading">
        <details className="rounded border border-rule bg-paper-raised p-4">
          <summary id="edit-heading" className="cursor-pointer font-serif text-xl">
            Edit run details
          </summary>
          <div className="mt-4">
            <RunForm
              choices={{ labs: choices.labs, tools: choices.tools, protocolVersions: choices.protocolVersions, instruments: choices.instruments }}
              edit={{ runId: run.id, labId: run.lab.id, values: runFormValues(run), instrumentIds: instruments.map((entry) => entry.instrumentId) }}
            />
          </div>
        </details>
      </section>
    </article>
  );
}
