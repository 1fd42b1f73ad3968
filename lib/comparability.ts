// Whether two tools' published results were measured on equal terms. Pure: the compare page hands in the runs behind
// each tool's shown results (their protocol version and conditions) and gets back one named warning per condition in
// which the two sides differ, with what each side had, so a reader knows which differences may explain the figures.

import type { RunConditions } from "@/db/schema/bench";

export type ComparedRun = {
  protocol: { name: string; version: number };
  conditions: Pick<RunConditions, "supplyVoltage" | "supplyFrequencyHz" | "nozzle" | "airflowSetpoint" | "temperatureSetpointC" | "ambientC">;
};

export const comparabilityConditions = ["protocol", "supply-voltage", "supply-frequency", "nozzle", "temperature-setpoint", "airflow-setpoint", "ambient"] as const;

export type ComparabilityCondition = (typeof comparabilityConditions)[number];

export type ComparabilityWarning = {
  condition: ComparabilityCondition;
  /** The warning's name as readers see it, e.g. "Different supply voltage". */
  title: string;
  /** What each side's runs had, one entry per distinct value, in the order first met. */
  a: string[];
  b: string[];
};

/**
 * Ambient temperatures further apart than this are flagged. Common practice, no source: within about 2 °C a heating
 * tool's heat-up and steady state barely move, while bench notes start to mention the room beyond that.
 */
export const ambientThresholdC = 2;

type Described = { key: string; label: string };

type ConditionRule = {
  condition: ComparabilityCondition;
  describe: (run: ComparedRun) => Described;
  /** Title when the two sides differ; a rule may name the difference more exactly from the runs. */
  title: (runs: readonly ComparedRun[]) => string;
  /** Whether two values differ; equality of keys unless the rule says otherwise. */
  differs?: (a: ComparedRun, b: ComparedRun) => boolean;
};

const notStated = "not stated";

const rules: ConditionRule[] = [
  {
    condition: "protocol",
    describe: ({ protocol }) => ({ key: JSON.stringify([protocol.name, protocol.version]), label: `${protocol.name}, version ${protocol.version}` }),
    title: (runs) => (new Set(runs.map((run) => run.protocol.name)).size > 1 ? "Different protocols" : "Different protocol versions"),
  },
  {
    condition: "supply-voltage",
    describe: ({ conditions }) => ({ key: String(conditions.supplyVoltage), label: `${conditions.supplyVoltage} V` }),
    title: () => "Different supply voltage",
  },
  {
    condition: "supply-frequency",
    describe: ({ conditions }) => ({ key: String(conditions.supplyFrequencyHz), label: `${conditions.supplyFrequencyHz} Hz` }),
    title: () => "Different supply frequency",
  },
  {
    condition: "nozzle",
    describe: ({ conditions }) => textCondition(conditions.nozzle),
    title: () => "Different nozzle or tip",
  },
  {
    condition: "temperature-setpoint",
    describe: ({ conditions }) =>
      conditions.temperatureSetpointC === null ? { key: "", label: notStated } : { key: String(conditions.temperatureSetpointC), label: `${conditions.temperatureSetpointC} °C` },
    title: () => "Different temperature setpoint",
  },
  {
    condition: "airflow-setpoint",
    describe: ({ conditions }) => textCondition(conditions.airflowSetpoint),
    title: () => "Different airflow setpoint",
  },
  {
    condition: "ambient",
    describe: ({ conditions }) => ({ key: String(conditions.ambientC), label: `${conditions.ambientC} °C` }),
    title: () => `Ambient temperatures more than ${ambientThresholdC} °C apart`,
    differs: (a, b) => Math.abs(a.conditions.ambientC - b.conditions.ambientC) > ambientThresholdC,
  },
];

/** Free text set by reviewers: case and spacing are not a difference in conditions. */
function textCondition(value: string | null): Described {
  const trimmed = value?.trim() ?? "";
  return trimmed === "" ? { key: "", label: notStated } : { key: trimmed.replace(/\s+/g, " ").toLowerCase(), label: trimmed };
}

function distinctLabels(values: Described[]): string[] {
  const seen = new Map<string, string>();
  for (const value of values) if (!seen.has(value.key)) seen.set(value.key, value.label);
  return [...seen.values()];
}

/**
 * One warning for each condition in which any run behind tool A's results differs from any run behind tool B's, in a
 * fixed order; none when every pair matches (or a side has no runs, when there is nothing to compare).
 */
export function compareRunConditions(a: readonly ComparedRun[], b: readonly ComparedRun[]): ComparabilityWarning[] {
  const warnings: ComparabilityWarning[] = [];
  for (const rule of rules) {
    const differs = rule.differs ?? ((left: ComparedRun, right: ComparedRun) => rule.describe(left).key !== rule.describe(right).key);
    if (!a.some((left) => b.some((right) => differs(left, right)))) continue;
    warnings.push({ condition: rule.condition, title: rule.title([...a, ...b]), a: distinctLabels(a.map(rule.describe)), b: distinctLabels(b.map(rule.describe)) });
  }
  return warnings;
}
