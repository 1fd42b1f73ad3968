import { FigureList } from "@/components/figure-list";
import type { ProtocolTolerance } from "@/db/schema";
import type { ProtocolVersionView as Version } from "@/db/queries/protocols";
import { measurementKindInfo } from "@/lib/measurement-kinds";
import { renderSafeMdx } from "@/lib/mdx/render";
import { protocolToleranceFields } from "@/lib/validations/protocol";

function formatTolerance(tolerance: ProtocolTolerance, absoluteUnit: string): string {
  const unit = tolerance.kind === "percent" ? " %" : ` ${absoluteUnit}`;
  return `+${tolerance.plus}${unit} / −${tolerance.minus}${unit}`;
}

/** The cautions as written, one per line; lines starting "- " read as a list. */
export function SafetyCautions({ text }: { text: string }) {
  const lines = text
    .split("\n")
    .map((line) => line.trim())
    .filter(Boolean);
  return (
    <aside aria-labelledby="cautions-heading" className="border-l-4 border-copper bg-copper-wash/60 px-4 py-3">
      <h2 id="cautions-heading" className="font-semibold text-copper-deep">
        Safety cautions: read before you start
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink">
        {lines.map((line, index) => (
          <li key={index}>{line.replace(/^[-*]\s+/, "")}</li>
        ))}
      </ul>
    </aside>
  );
}

export function ProtocolVersionView({ version }: { version: Version }) {
  const { conditions } = version;
  const rows: [string, string][] = [
    ["Supply", `${conditions.supplyVoltage} V, ${conditions.supplyFrequencyHz} Hz`],
    ["Ambient temperature", `${conditions.ambientC} °C`],
    ["Warm-up", `${conditions.warmUpMinutes} min`],
    ["Nozzle or tip", conditions.nozzle ?? "—"],
    ["Airflow setpoint", conditions.airflowSetpoint ?? "—"],
    ["Temperature setpoint", conditions.temperatureSetpointC === null ? "—" : `${conditions.temperatureSetpointC} °C`],
    ["Measuring distance", conditions.measuringDistanceMm === null ? "—" : `${conditions.measuringDistanceMm} mm`],
  ];
  const tolerances = protocolToleranceFields.flatMap(({ key, label, absoluteUnit }) => {
    const tolerance = version.tolerances[key];
    return tolerance ? [{ label, tolerance, absoluteUnit }] : [];
  });
  return (
    <div className="space-y-8">
      <SafetyCautions text={version.safetyCautions} />
      <p className="max-w-3xl font-serif text-lg text-ink-soft">{version.summary}</p>

      <div className="grid gap-8 lg:grid-cols-2">
        <section aria-labelledby="conditions-heading">
          <h2 id="conditions-heading" className="mb-3 font-serif text-2xl">
            Conditions
          </h2>
          <FigureList rows={rows} />
        </section>

        <section aria-labelledby="measurements-heading" className="space-y-4">
          <h2 id="measurements-heading" className="font-serif text-2xl">
            Required measurements
          </h2>
          <ul className="list-disc space-y-1 pl-6">
            {version.requiredMeasurements.map((kind) => (
              <li key={kind}>
                {measurementKindInfo[kind].label} <span className="figure text-ink-faint">({measurementKindInfo[kind].unit})</span>
              </li>
            ))}
          </ul>
          <p>
            Each repeated <span className="figure font-semibold">{version.repeats}</span> {version.repeats === 1 ? "time" : "times"}.
          </p>
          <h3 className="font-semibold">Tolerances</h3>
          {tolerances.length ? (
            <ul className="space-y-1 text-sm">
              {tolerances.map(({ label, tolerance, absoluteUnit }) => (
                <li key={label}>
                  {label}: <span className="figure">{formatTolerance(tolerance, absoluteUnit)}</span>{" "}
                  <span className="text-ink-soft">({tolerance.source})</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-ink-soft">None beyond IEC 60335-1&apos;s for power input and current.</p>
          )}
        </section>
      </div>

      <section aria-labelledby="steps-heading">
        <h2 id="steps-heading" className="mb-3 font-serif text-2xl">
          Steps
        </h2>
        <div className="prose prose-stone max-w-3xl font-serif">{renderSafeMdx(version.stepsMdx).content}</div>
      </section>
    </div>
  );
}
