import { z } from "zod";
import { measurementKinds } from "@/lib/measurement-kinds";

// Shared by the run, reading and capture forms in the browser and by the actions and handlers that receive them.

export const unitSources = ["bought", "loaned", "given"] as const;

export const unitSourceLabels: Record<(typeof unitSources)[number], string> = {
  bought: "Bought at retail",
  loaned: "Loaned (returned after testing)",
  given: "Given (kept)",
};

export const decisionRules = ["simple", "guarded"] as const;

export const decisionRuleLabels: Record<(typeof decisionRules)[number], string> = {
  simple: "Simple acceptance (the tolerance limits decide)",
  guarded: "Guarded acceptance (guard band of U)",
};

const blankToUndefined = (value: unknown) => (typeof value === "string" && value.trim() === "" ? undefined : value);

function toNumber(label: string) {
  return (text: string, context: z.RefinementCtx) => {
    const value = Number(text.replace(",", "."));
    if (!Number.isFinite(value)) {
      context.addIssue({ code: "custom", message: `The ${label} must be a number.` });
      return z.NEVER;
    }
    return value;
  };
}

const requiredNumber = (label: string) =>
  z.string({ error: `Enter the ${label}.` }).trim().min(1, `Enter the ${label}.`).transform(toNumber(label));

const optionalNumber = (label: string) => z.preprocess(blankToUndefined, z.string().trim().transform(toNumber(label)).optional());

const optionalText = (max: number, label: string) =>
  z.preprocess(blankToUndefined, z.string().trim().max(max, `Keep the ${label} under ${max} characters.`).optional());

const isoDate = z
  .string({ error: "Enter the date." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter the date as YYYY-MM-DD.")
  .refine((text) => !Number.isNaN(Date.parse(`${text}T00:00:00Z`)), "That date does not exist.");

const uuidOf = (what: string) => z.uuid(`Choose ${what}.`);

/**
 * Checkboxes of one list are named `<name>.<id>`: a form sends repeated names as separate entries, of which an
 * action's parser keeps only the last.
 */
export function withCheckedList(input: unknown, name: string): unknown {
  if (typeof input !== "object" || input === null || Array.isArray(input)) return input;
  const output: Record<string, unknown> = {};
  const checked: unknown[] = [];
  for (const [key, value] of Object.entries(input)) {
    if (key.startsWith(`${name}.`)) checked.push(value);
    else output[key] = value;
  }
  output[name] ??= checked;
  return output;
}

const conditionFields = {
  supplyVoltage: requiredNumber("supply voltage").pipe(
    z.number().min(90, "Supply voltage is between 90 and 260 V.").max(260, "Supply voltage is between 90 and 260 V."),
  ),
  supplyFrequencyHz: requiredNumber("supply frequency").pipe(
    z.number().refine((value) => value === 50 || value === 60, "Supply frequency is 50 or 60 Hz."),
  ),
  ambientC: requiredNumber("ambient temperature").pipe(
    z.number().min(-10, "Ambient temperature is between −10 and 50 °C.").max(50, "Ambient temperature is between −10 and 50 °C."),
  ),
  nozzle: optionalText(80, "nozzle"),
  airflowSetpoint: optionalText(80, "airflow setpoint"),
  temperatureSetpointC: optionalNumber("temperature setpoint").pipe(
    z.number().min(50, "A setpoint is between 50 and 650 °C.").max(650, "A setpoint is between 50 and 650 °C.").optional(),
  ),
  measuringDistanceMm: optionalNumber("measuring distance").pipe(
    z.number().min(0, "The distance cannot be negative.").max(500, "Keep the distance under 500 mm.").optional(),
  ),
  warmUpMinutes: requiredNumber("warm-up time").pipe(
    z.number().min(0, "Warm-up cannot be negative.").max(240, "Warm-up is at most 240 minutes."),
  ),
  measuredSupplyVoltage: optionalNumber("measured supply voltage").pipe(
    z.number().min(80, "A measured supply voltage is between 80 and 280 V.").max(280, "A measured supply voltage is between 80 and 280 V.").optional(),
  ),
};

const runDetailFields = {
  testedOn: isoDate.refine((text) => text <= new Date().toISOString().slice(0, 10), "A run cannot be dated in the future."),
  instrumentIds: z.array(uuidOf("an instrument"), { error: "Choose the instruments used." }).min(1, "Choose at least one instrument."),
  unitSerialNumber: z.string({ error: "Enter the unit's serial number." }).trim().min(1, "Enter the unit's serial number.").max(80, "Keep the serial number under 80 characters."),
  unitFirmware: optionalText(80, "firmware version"),
  unitVoltageVariant: z.string({ error: "Enter the voltage variant." }).trim().min(1, "Enter the voltage variant, e.g. 230 V EU plug.").max(80, "Keep the voltage variant under 80 characters."),
  unitSource: z.enum(unitSources, { error: "Say how the unit was obtained." }),
  unitSourceNote: optionalText(500, "note on how the unit was obtained"),
  notes: optionalText(5000, "notes"),
  ...conditionFields,
};

function requireSourceNote(run: { unitSource: (typeof unitSources)[number]; unitSourceNote?: string }, context: z.RefinementCtx) {
  if (run.unitSource !== "bought" && !run.unitSourceNote) {
    context.addIssue({ code: "custom", path: ["unitSourceNote"], message: "Say who loaned or gave the unit, and on what terms." });
  }
}

export const runFormSchema = z.preprocess(
  (input) => withCheckedList(input, "instrumentIds"),
  z
    .object({
      labId: uuidOf("the lab"),
      toolId: uuidOf("the tool tested"),
      protocolVersionId: uuidOf("the protocol"),
      ...runDetailFields,
    })
    .superRefine(requireSourceNote),
);

/** Editing keeps the tool and protocol version: a different one is a different run. */
export const runUpdateSchema = z.preprocess(
  (input) => withCheckedList(input, "instrumentIds"),
  z
    .object({ runId: uuidOf("a run"), ...runDetailFields })
    .superRefine(requireSourceNote),
);

export type RunForm = z.output<typeof runFormSchema>;
export type RunUpdate = z.output<typeof runUpdateSchema>;

/** "12.1, 12.3; 12.2" or one value a line: meters are read by hand, so any of the usual separators will do. */
export function parseReadingValues(text: string): number[] | null {
  const parts = text.split(/[\s,;]+/).filter((part) => part !== "");
  const values = parts.map(Number);
  return values.length > 0 && values.every(Number.isFinite) ? values : null;
}

export const maxRepeats = 50;

export const manualReadingSchema = z.object({
  runId: uuidOf("a run"),
  kind: z.enum(measurementKinds, { error: "Choose what was measured." }),
  values: z
    .string({ error: "Enter the readings." })
    .trim()
    .min(1, "Enter the readings.")
    .transform((text, context) => {
      const values = parseReadingValues(text);
      if (values === null) {
        context.addIssue({ code: "custom", message: "Readings are numbers separated by commas or spaces, e.g. 41.2, 40.8, 41.5." });
        return z.NEVER;
      }
      if (values.length > maxRepeats) {
        context.addIssue({ code: "custom", message: `At most ${maxRepeats} repeats.` });
        return z.NEVER;
      }
      return values;
    }),
  instrumentId: z.preprocess(blankToUndefined, uuidOf("an instrument of this run").optional()),
  rule: z.enum(decisionRules, { error: "Choose a decision rule." }).default("simple"),
  note: optionalText(500, "note"),
});

export const manualReadingDeleteSchema = z.object({ readingId: uuidOf("a reading") });

export const captureKinds = ["waveform", "heat_up_log"] as const;

export const captureKindLabels: Record<(typeof captureKinds)[number], string> = {
  waveform: "Current and voltage waveform (scope or logger CSV)",
  heat_up_log: "Heat-up log (temperature against time)",
};

export const captureLimits = {
  maxBytes: 200 * 1024 * 1024,
  fileNamePattern: /\.(csv|tsv|txt)$/i,
} as const;

/** What the browser declares before it uploads: the server signs an upload of exactly this size. */
export const captureUploadRequestSchema = z.object({
  runId: uuidOf("a run"),
  kind: z.enum(captureKinds, { error: "Choose what the capture holds." }),
  fileName: z
    .string({ error: "Choose a file." })
    .trim()
    .min(1, "Choose a file.")
    .max(200, "File names are limited to 200 characters.")
    .regex(captureLimits.fileNamePattern, "Captures are CSV, TSV or TXT exports."),
  sizeBytes: z.coerce
    .number({ error: "The file size is missing." })
    .int("The file size must be whole bytes.")
    .positive("The file is empty.")
    .max(captureLimits.maxBytes, `Captures up to ${captureLimits.maxBytes / 1024 / 1024} MB.`),
});

export const captureIdSchema = z.object({ id: z.uuid("Unknown capture.") });
export const analysisIdSchema = z.object({ id: z.uuid("Unknown analysis.") });

/** A column by the name the capture's header gives it, or "none". */
const column = z.string({ error: "Choose a column." }).trim().min(1, "Choose a column.").max(200);
const optionalColumn = z.preprocess(blankToUndefined, column.optional());
const positiveScale = (label: string) =>
  requiredNumber(label).pipe(z.number().refine((value) => value > 0, `The ${label} must be above 0.`));
/** "instrumentId:rangeIndex", picking one accuracy line of one of the run's instruments. */
const accuracyChoice = z.preprocess(
  blankToUndefined,
  z
    .string()
    .regex(/^[0-9a-f-]{36}:\d+$/i, "Choose an accuracy line from the run's instruments.")
    .optional(),
);

const timeFields = {
  timeColumn: optionalColumn,
  sampleIntervalSeconds: optionalNumber("sample interval").pipe(z.number().positive("The sample interval must be above 0.").optional()),
};

function requireTimeBase(mapping: { timeColumn?: string; sampleIntervalSeconds?: number }, context: z.RefinementCtx) {
  if (!mapping.timeColumn && mapping.sampleIntervalSeconds === undefined) {
    context.addIssue({ code: "custom", path: ["sampleIntervalSeconds"], message: "Choose a time column or give the sample interval." });
  }
  if (mapping.timeColumn && mapping.sampleIntervalSeconds !== undefined) {
    context.addIssue({ code: "custom", path: ["sampleIntervalSeconds"], message: "Give a time column or a sample interval, not both." });
  }
}

export const waveformMappingSchema = z
  .object({
    captureId: uuidOf("a capture"),
    currentColumn: column,
    currentScale: positiveScale("current scale"),
    voltageColumn: optionalColumn,
    voltageScale: optionalNumber("voltage scale").pipe(z.number().positive("The voltage scale must be above 0.").optional()),
    ...timeFields,
    harmonicClass: z.enum(["A", "B"], { error: "Choose the harmonic class." }),
    dmaxLimitPercent: z.enum(["4", "6", "7"], { error: "The dmax limit is 4, 6 or 7 %." }).transform((value) => Number(value) as 4 | 6 | 7),
    impedanceResistanceOhm: optionalNumber("supply resistance").pipe(z.number().min(0, "Resistance cannot be negative.").max(10, "Resistance up to 10 Ω.").optional()),
    impedanceReactanceOhm: optionalNumber("supply reactance").pipe(z.number().min(0, "Reactance cannot be negative.").max(10, "Reactance up to 10 Ω.").optional()),
    currentAccuracy: accuracyChoice,
    voltageAccuracy: accuracyChoice,
    rule: z.enum(decisionRules, { error: "Choose a decision rule." }),
  })
  .superRefine((mapping, context) => {
    requireTimeBase(mapping, context);
    if (mapping.voltageColumn && mapping.voltageColumn === mapping.currentColumn) {
      context.addIssue({ code: "custom", path: ["voltageColumn"], message: "Current and voltage need different columns." });
    }
    if (mapping.voltageColumn && mapping.voltageScale === undefined) {
      context.addIssue({ code: "custom", path: ["voltageScale"], message: "Give the voltage scale (1 when the column is in volts)." });
    }
    if ((mapping.impedanceResistanceOhm === undefined) !== (mapping.impedanceReactanceOhm === undefined)) {
      context.addIssue({ code: "custom", path: ["impedanceReactanceOhm"], message: "Give both the resistance and the reactance, or neither." });
    }
  });

export const heatUpMappingSchema = z
  .object({
    captureId: uuidOf("a capture"),
    temperatureColumn: column,
    temperatureScale: positiveScale("temperature scale"),
    ...timeFields,
    setpointC: requiredNumber("setpoint").pipe(z.number().min(50, "A setpoint is between 50 and 650 °C.").max(650, "A setpoint is between 50 and 650 °C.")),
    bandC: requiredNumber("band").pipe(z.number().positive("The band must be above 0 °C.").max(100, "A band up to ±100 °C.")),
    temperatureAccuracy: accuracyChoice,
    rule: z.enum(decisionRules, { error: "Choose a decision rule." }),
  })
  .superRefine(requireTimeBase);

export type WaveformMapping = z.output<typeof waveformMappingSchema>;
export type HeatUpMapping = z.output<typeof heatUpMappingSchema>;
