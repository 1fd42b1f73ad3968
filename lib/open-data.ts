import { stringify } from "csv-stringify/sync";
import type { PublishedResult } from "@/lib/published-results";

// A report's measurements as open data: one record per measurement of the current published revision, the same
// records as CSV and as JSON. Every numeric column's name ends in its unit, so a spreadsheet never mixes watts with
// amperes in one column: the measured figures sit in one group of columns per unit (value_W, value_A …), filled on
// the rows measured in that unit and empty on the others. Numbers are written at full precision, as stored.

export type OpenDataColumnType = "string" | "number" | "boolean";
export type OpenDataColumn = { name: string; type: OpenDataColumnType; unit: string | null; description: string };
export type OpenDataValue = string | number | boolean | null;
export type OpenDataRecord = Record<string, OpenDataValue>;

export const openDataLicence = {
  name: "CC BY 4.0",
  url: "https://creativecommons.org/licenses/by/4.0/",
  attribution: "Bench data from Benchplate under CC BY 4.0: credit Benchplate and the report's author, and link the report.",
};

/** A unit as a column-name suffix: letters, digits and underscores only, readable in any spreadsheet or script. */
const unitSuffixes: Record<string, string> = { "°C": "degC", "L/min": "L_per_min", Ω: "ohm" };

export function unitSuffix(unit: string): string {
  return unitSuffixes[unit] ?? (unit.replace(/[^A-Za-z0-9]+/g, "_").replace(/^_|_$/g, "") || "unitless");
}

type ContextColumn = OpenDataColumn & { read: (result: PublishedResult) => OpenDataValue };

const text = (value: string | null | undefined) => (value === undefined || value === null || value === "" ? null : value);

const contextColumns: ContextColumn[] = [
  { name: "report_slug", type: "string", unit: null, description: "The report's address on Benchplate: /reports/<slug>.", read: (r) => r.report.slug },
  { name: "report_revision", type: "number", unit: null, description: "The published revision these figures come from.", read: (r) => r.report.revisionNumber },
  {
    name: "report_retracted",
    type: "boolean",
    unit: null,
    description: "true when the report was retracted: its results no longer stand.",
    read: (r) => r.report.retracted,
  },
  { name: "tool", type: "string", unit: null, description: "Maker and model of the tool tested.", read: (r) => r.tool.name },
  { name: "tool_slug", type: "string", unit: null, description: "The tool's address on Benchplate: /tools/<slug>.", read: (r) => r.tool.slug },
  { name: "run_id", type: "string", unit: null, description: "The test run the measurement belongs to.", read: (r) => r.run.id },
  { name: "run_tested_on", type: "string", unit: null, description: "The day of the test run (YYYY-MM-DD).", read: (r) => r.run.testedOn },
  { name: "lab", type: "string", unit: null, description: "The bench the run was done on.", read: (r) => r.run.labName },
  { name: "protocol", type: "string", unit: null, description: "The test protocol followed.", read: (r) => r.run.protocol.name },
  { name: "protocol_version", type: "number", unit: null, description: "The protocol's version.", read: (r) => r.run.protocol.version },
  { name: "supply_voltage_V", type: "number", unit: "V", description: "Nominal supply voltage of the run.", read: (r) => r.run.conditions.supplyVoltage },
  { name: "supply_frequency_Hz", type: "number", unit: "Hz", description: "Nominal supply frequency of the run.", read: (r) => r.run.conditions.supplyFrequencyHz },
  {
    name: "measured_supply_voltage_V",
    type: "number",
    unit: "V",
    description: "Supply voltage measured during the run, where recorded.",
    read: (r) => r.run.conditions.measuredSupplyVoltage,
  },
  { name: "ambient_degC", type: "number", unit: "°C", description: "Ambient temperature.", read: (r) => r.run.conditions.ambientC },
  {
    name: "temperature_setpoint_degC",
    type: "number",
    unit: "°C",
    description: "Temperature setpoint, where the protocol sets one.",
    read: (r) => r.run.conditions.temperatureSetpointC,
  },
  { name: "airflow_setpoint", type: "string", unit: null, description: "Airflow setting as the tool labels it.", read: (r) => text(r.run.conditions.airflowSetpoint) },
  { name: "nozzle", type: "string", unit: null, description: "Nozzle or tip fitted.", read: (r) => text(r.run.conditions.nozzle) },
  {
    name: "measuring_distance_mm",
    type: "number",
    unit: "mm",
    description: "Distance from the nozzle to the sensor.",
    read: (r) => r.run.conditions.measuringDistanceMm,
  },
  { name: "warm_up_min", type: "number", unit: "min", description: "Warm-up before measuring.", read: (r) => r.run.conditions.warmUpMinutes },
  { name: "quantity_kind", type: "string", unit: null, description: "The measured quantity as a fixed key.", read: (r) => r.kind },
  { name: "quantity", type: "string", unit: null, description: "The measured quantity in words.", read: (r) => r.quantity },
  {
    name: "unit",
    type: "string",
    unit: null,
    description: "The measurement's unit: its figures are in the columns whose names end in this unit.",
    read: (r) => r.unit,
  },
  { name: "source", type: "string", unit: null, description: "analysis (from a capture) or manual (read by hand).", read: (r) => r.source },
  { name: "analysis_label", type: "string", unit: null, description: "The cited analysis, as the report names it.", read: (r) => r.analysis?.label ?? null },
  {
    name: "verdict",
    type: "string",
    unit: null,
    description: "meets rating, above rating, below rating or inconclusive; empty where nothing was judged.",
    read: (r) => r.verdict?.result ?? null,
  },
  { name: "decision_rule", type: "string", unit: null, description: "simple or guarded acceptance.", read: (r) => r.verdict?.rule ?? null },
  { name: "tolerance_source", type: "string", unit: null, description: "Where the tolerance comes from.", read: (r) => text(r.verdict?.tolerance.source) },
  {
    name: "tolerance_basis",
    type: "string",
    unit: null,
    description: "The tolerance as the source states it.",
    read: (r) => text(r.verdict?.tolerance.row ?? r.verdict?.tolerance.description),
  },
  {
    name: "normalized_to_V",
    type: "number",
    unit: "V",
    description: "The rated voltage a power figure was normalised to before judging; empty where not normalised.",
    read: (r) => r.verdict?.normalizedTo ?? null,
  },
];

type UnitField = { prefix: string; description: string; always?: true; read: (result: PublishedResult) => number | null };

const unitFields: UnitField[] = [
  { prefix: "value", description: "Measured value", always: true, read: (r) => r.value },
  { prefix: "expanded_uncertainty_k2", description: "Expanded uncertainty (k = 2) of the measured value", always: true, read: (r) => r.expandedUncertainty },
  { prefix: "rated", description: "The tool's rating the value was judged against", read: (r) => r.verdict?.rated ?? null },
  { prefix: "tolerance_lower", description: "Lower tolerance limit", read: (r) => r.verdict?.lower ?? null },
  { prefix: "tolerance_upper", description: "Upper tolerance limit", read: (r) => r.verdict?.upper ?? null },
  { prefix: "acceptance_lower", description: "Lower acceptance limit after the decision rule's guard band", read: (r) => r.verdict?.acceptanceLower ?? null },
  { prefix: "acceptance_upper", description: "Upper acceptance limit after the decision rule's guard band", read: (r) => r.verdict?.acceptanceUpper ?? null },
  { prefix: "normalized", description: "The value normalised to the rated voltage, as judged", read: (r) => r.verdict?.normalized ?? null },
];

/**
 * The columns for these results: the context, then one group per unit that occurs, in the order the units first
 * appear. A group always has the value and its uncertainty; the verdict's figures only where some row of that unit
 * has them (a current is rarely judged), so the sheet carries no column that is empty all the way down.
 */
export function openDataColumns(results: readonly PublishedResult[]): OpenDataColumn[] {
  const units = [...new Set(results.map((result) => result.unit))];
  return [
    ...contextColumns.map(({ name, type, unit, description }) => ({ name, type, unit, description })),
    ...units.flatMap((unit) =>
      unitFields
        .filter((field) => field.always || results.some((result) => result.unit === unit && field.read(result) !== null))
        .map(({ prefix, description }) => ({ name: `${prefix}_${unitSuffix(unit)}`, type: "number" as const, unit, description: `${description}, in ${unit}.` })),
    ),
  ];
}

export function openDataRecords(results: readonly PublishedResult[], columns: readonly OpenDataColumn[] = openDataColumns(results)): OpenDataRecord[] {
  const names = new Set(columns.map((column) => column.name));
  return results.map((result) => {
    const record: OpenDataRecord = Object.fromEntries(columns.map((column) => [column.name, null]));
    for (const column of contextColumns) record[column.name] = column.read(result);
    for (const field of unitFields) {
      const name = `${field.prefix}_${unitSuffix(result.unit)}`;
      if (names.has(name)) record[name] = field.read(result);
    }
    return record;
  });
}

/** RFC 4180 (CRLF, quotes where needed), a header row of column names, empty cells for nulls, true/false for flags. */
export function openDataCsv(columns: readonly OpenDataColumn[], records: readonly OpenDataRecord[]): string {
  return stringify(records as OpenDataRecord[], {
    header: true,
    columns: columns.map((column) => ({ key: column.name, header: column.name })),
    record_delimiter: "windows",
    cast: { boolean: (value) => (value ? "true" : "false"), number: (value) => String(value) },
  });
}

export type OpenDataReport = {
  slug: string;
  title: string;
  authorName: string;
  url: string;
  revision: { number: number; kind: string; publishedAt: string; url: string };
  retracted: boolean;
  retractionReason: string | null;
};

/** The JSON download: what the records are, where they come from and on what terms, then the records themselves. */
export function openDataDocument({ report, results, downloads }: { report: OpenDataReport; results: readonly PublishedResult[]; downloads: { csv: string; json: string } }) {
  const columns = openDataColumns(results);
  return {
    metadata: {
      report: { slug: report.slug, title: report.title, author: report.authorName, url: report.url },
      revision: report.revision,
      publishedAt: report.revision.publishedAt,
      retracted: report.retracted,
      retractionReason: report.retractionReason,
      licence: openDataLicence,
      attribution: `${report.authorName}, “${report.title}”, revision ${report.revision.number}, Benchplate, ${report.url}`,
      source: "The frozen figures of the report's current published revision; a correction publishes a new revision and changes these files.",
      downloads,
      columns,
    },
    records: openDataRecords(results, columns),
  };
}

export type OpenDataDocument = ReturnType<typeof openDataDocument>;

export function measurementsDownloadPath(slug: string, extension: "csv" | "json"): string {
  return `/reports/${slug}/measurements.${extension}`;
}

/** A file name that says which report, which revision, and whether it was retracted. */
export function openDataFileName(report: Pick<OpenDataReport, "slug" | "retracted" | "revision">, extension: "csv" | "json"): string {
  return `${report.slug}-revision-${report.revision.number}${report.retracted ? "-retracted" : ""}-measurements.${extension}`;
}
