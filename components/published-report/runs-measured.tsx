import type { FrozenRun, RunConditions } from "@/db/schema";
import { isCalibrationOverdue } from "@/lib/calibration";

const sourceWords = { bought: "bought at retail", loaned: "on loan", given: "given to the reviewer" } as const;

/** A run's supply and conditions as label and value, in the order the protocol states them. */
export function conditionLines(conditions: RunConditions): [string, string][] {
  const lines: [string, string][] = [
    ["Supply", `${conditions.supplyVoltage} V ${conditions.supplyFrequencyHz} Hz nominal${conditions.measuredSupplyVoltage === null ? "" : `, ${conditions.measuredSupplyVoltage} V measured`}`],
    ["Ambient", `${conditions.ambientC} °C`],
    ["Warm-up", `${conditions.warmUpMinutes} min`],
  ];
  if (conditions.nozzle) lines.push(["Nozzle", conditions.nozzle]);
  if (conditions.airflowSetpoint) lines.push(["Airflow setpoint", conditions.airflowSetpoint]);
  if (conditions.temperatureSetpointC !== null) lines.push(["Temperature setpoint", `${conditions.temperatureSetpointC} °C`]);
  if (conditions.measuringDistanceMm !== null) lines.push(["Measuring distance", `${conditions.measuringDistanceMm} mm`]);
  return lines;
}

/** Protocol version, supply, conditions, the unit and the instruments of each cited run, as frozen with the revision. */
export function RunsMeasured({ runs }: { runs: FrozenRun[] }) {
  if (runs.length === 0) return null;
  return (
    <section aria-labelledby="runs-heading" className="space-y-4">
      <h2 id="runs-heading" className="font-serif text-2xl">
        How it was measured
      </h2>
      {runs.map((run) => (
        <div key={run.id} className="rounded border border-rule bg-paper-raised p-4 text-sm">
          <h3 className="font-serif text-lg">
            {run.toolName}: run of <span className="figure">{run.testedOn}</span> at {run.labName}
          </h3>
          <p className="text-ink-soft">
            Protocol: {run.protocol.name}, version {run.protocol.version}. {run.protocol.summary}
          </p>
          <div className="mt-3 grid gap-4 md:grid-cols-2">
            <dl className="divide-y divide-rule rounded border border-rule">
              {conditionLines(run.conditions).map(([label, value]) => (
                <div key={label} className="grid grid-cols-2 gap-2 px-3 py-1.5">
                  <dt className="text-ink-soft">{label}</dt>
                  <dd className="figure">{value}</dd>
                </div>
              ))}
              <div className="grid grid-cols-2 gap-2 px-3 py-1.5">
                <dt className="text-ink-soft">Unit tested</dt>
                <dd>
                  serial <span className="figure">{run.unit.serialNumber}</span>, {run.unit.voltageVariant}
                  {run.unit.firmware ? `, firmware ${run.unit.firmware}` : ""}; {sourceWords[run.unit.source]}
                  {run.unit.sourceNote ? ` (${run.unit.sourceNote})` : ""}
                </dd>
              </div>
            </dl>
            <div>
              <h4 className="font-semibold">Instruments</h4>
              <ul className="mt-1 space-y-1">
                {run.instruments.map((instrument) => {
                  const overdue = isCalibrationOverdue(instrument.calibrationDueOn, run.testedOn);
                  return (
                    <li key={`${instrument.maker}-${instrument.model}-${instrument.serialNumber}`}>
                      {instrument.maker} {instrument.model} <span className="figure text-ink-faint">({instrument.serialNumber})</span>: calibrated{" "}
                      <span className="figure">{instrument.calibratedOn}</span>, due <span className="figure">{instrument.calibrationDueOn}</span>
                      {overdue ? <strong className="ml-1 text-verdict-inconclusive">— overdue on the test date</strong> : null}
                    </li>
                  );
                })}
                {run.instruments.length === 0 ? <li className="text-ink-soft">No instrument recorded.</li> : null}
              </ul>
            </div>
          </div>
        </div>
      ))}
    </section>
  );
}
