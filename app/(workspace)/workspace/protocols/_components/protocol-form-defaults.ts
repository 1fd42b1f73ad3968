import type { ProtocolVersionView } from "@/db/queries/protocols";
import { protocolToleranceFields } from "@/lib/validations/protocol";

const text = (value: number | string | null) => (value === null ? "" : String(value));

/** A stored version as the form's field values, the starting point of the next version. */
export function protocolFormDefaults(version: ProtocolVersionView): Record<string, string> {
  const { conditions } = version;
  const values: Record<string, string> = {
    name: version.name,
    summary: version.summary,
    supplyVoltage: text(conditions.supplyVoltage),
    supplyFrequencyHz: text(conditions.supplyFrequencyHz),
    ambientC: text(conditions.ambientC),
    nozzle: text(conditions.nozzle),
    airflowSetpoint: text(conditions.airflowSetpoint),
    temperatureSetpointC: text(conditions.temperatureSetpointC),
    measuringDistanceMm: text(conditions.measuringDistanceMm),
    warmUpMinutes: text(conditions.warmUpMinutes),
    repeats: text(version.repeats),
    stepsMdx: version.stepsMdx,
    safetyCautions: version.safetyCautions,
  };
  for (const kind of version.requiredMeasurements) values[`requiredMeasurements.${kind}`] = "on";
  for (const { key, field } of protocolToleranceFields) {
    const tolerance = version.tolerances[key];
    if (!tolerance) continue;
    values[`${field}Kind`] = tolerance.kind;
    values[`${field}Plus`] = text(tolerance.plus);
    values[`${field}Minus`] = text(tolerance.minus);
    values[`${field}Source`] = tolerance.source;
  }
  return values;
}
