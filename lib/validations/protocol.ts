import { z } from "zod";
import type { ProtocolConditions, ProtocolTolerance, ProtocolVersion } from "@/db/schema";
import { measurementKinds } from "@/lib/measurement-kinds";
import { evenWithFieldErrors, numberField, optionalNumberField, optionalText, requiredText } from "@/lib/validations/form-fields";

export type ToleranceKey = keyof ProtocolVersion["tolerances"];

/** The ratings a protocol sets its own tolerance for, with the form's field prefix for each. */
export const protocolToleranceFields = [
  { key: "airflow", field: "airflowTolerance", label: "Airflow", absoluteUnit: "L/min" },
  { key: "heat_up_time", field: "heatUpTolerance", label: "Heat-up time", absoluteUnit: "s" },
  { key: "temperature_vs_setpoint", field: "temperatureTolerance", label: "Temperature against setpoint", absoluteUnit: "°C" },
] as const satisfies readonly { key: ToleranceKey; field: string; label: string; absoluteUnit: string }[];

/** What a new protocol starts with; the author edits it to suit the tool and the bench. */
export const defaultSafetyCautions = [
  "Power the tool under test through an isolation transformer, or measure only with isolated or differential probes.",
  "Use CAT-rated probes, leads and current clamp, rated for the mains voltage and the measurement category of the socket.",
  "Never float an oscilloscope's ground: do not defeat its protective earth to make a mains measurement.",
  "Nozzles, tips and the air leaving them burn long after switch-off: keep them on their stands, point hot air away from people and cables, and let them cool before changing them.",
  "Solder and flux fumes: work under fume extraction and keep the room ventilated.",
  "Follow your local electrical codes; leave any work on fixed wiring to a licensed electrician.",
]
  .map((line) => `- ${line}`)
  .join("\n");

export const defaultStepsMdx = [
  "## Set-up",
  "",
  "1. Let the tool and the room settle to the stated ambient temperature.",
  "2. Connect the supply through the measuring set-up and check the supply voltage at the socket.",
  "",
  "## Measurements",
  "",
  "1. Record each required measurement the stated number of times.",
].join("\n");

const toleranceFields = Object.fromEntries(
  protocolToleranceFields.flatMap(({ field }) => [
    [`${field}Kind`, z.enum(["", "percent", "absolute"], { error: "Choose percent, absolute or not set." }).default("")],
    [`${field}Plus`, optionalNumberField((number) => number.min(0, "Use a size, not a sign: 0 or more."))],
    [`${field}Minus`, optionalNumberField((number) => number.min(0, "Use a size, not a sign: 0 or more."))],
    [`${field}Source`, optionalText(200)],
  ]),
) as Record<string, z.ZodType>;

const protocolFields = z.object({
  name: requiredText("Name the protocol, e.g. “Hot-air station bench protocol”.", 120).pipe(z.string().min(4, "Use at least 4 characters.")),
  summary: requiredText("Say in a sentence what the protocol tests and on what.", 600),
  supplyVoltage: numberField("Enter the supply voltage in volts.").pipe(
    z.number().min(90, "Mains supply between 90 and 260 V.").max(260, "Mains supply between 90 and 260 V."),
  ),
  supplyFrequencyHz: z.enum(["50", "60"], { error: "Choose 50 Hz or 60 Hz." }).transform(Number),
  ambientC: numberField("Enter the ambient temperature in °C.").pipe(
    z.number().min(10, "Bench ambient between 10 and 40 °C.").max(40, "Bench ambient between 10 and 40 °C."),
  ),
  nozzle: optionalText(80),
  airflowSetpoint: optionalText(80),
  temperatureSetpointC: optionalNumberField((number) => number.min(50, "Setpoints from 50 °C.").max(600, "Setpoints up to 600 °C.")),
  measuringDistanceMm: optionalNumberField((number) => number.positive("The distance must be above 0 mm.").max(500, "Up to 500 mm from the outlet.")),
  warmUpMinutes: numberField("Enter the warm-up time in minutes (0 for none).").pipe(
    z.number().min(0, "Warm-up cannot be negative.").max(240, "Warm-up up to 240 minutes."),
  ),
  repeats: numberField("Enter how many times each measurement is repeated.").pipe(
    z.number().int("Repeats are a whole number.").min(1, "At least one repeat.").max(50, "At most 50 repeats."),
  ),
  requiredMeasurements: z.array(z.enum(measurementKinds)).min(1, "Tick at least one measurement the protocol requires."),
  stepsMdx: requiredText("Write the steps, in MDX.", 20_000),
  safetyCautions: requiredText("State the safety cautions for this work.", 5_000),
  ...toleranceFields,
});

type ProtocolFields = z.output<typeof protocolFields> & Record<string, unknown>;

function checkTolerances(protocol: ProtocolFields, context: z.RefinementCtx) {
  for (const { field } of protocolToleranceFields) {
    if (!protocol[`${field}Kind`]) continue;
    for (const part of ["Plus", "Minus"]) {
      if (protocol[`${field}${part}`] === null) context.addIssue({ code: "custom", path: [`${field}${part}`], message: `Give the ${part === "Plus" ? "upper" : "lower"} tolerance, or set the tolerance to not set.` });
    }
    if (!protocol[`${field}Source`]) context.addIssue({ code: "custom", path: [`${field}Source`], message: "Say where the tolerance comes from (a standard, the maker, the protocol's own choice)." });
  }
}

function toProtocolValues(protocol: ProtocolFields) {
  const conditions: ProtocolConditions = {
    supplyVoltage: protocol.supplyVoltage,
    supplyFrequencyHz: protocol.supplyFrequencyHz,
    ambientC: protocol.ambientC,
    nozzle: protocol.nozzle,
    airflowSetpoint: protocol.airflowSetpoint,
    temperatureSetpointC: protocol.temperatureSetpointC,
    measuringDistanceMm: protocol.measuringDistanceMm,
    warmUpMinutes: protocol.warmUpMinutes,
  };
  const tolerances: Partial<Record<ToleranceKey, ProtocolTolerance>> = {};
  for (const { key, field } of protocolToleranceFields) {
    const kind = protocol[`${field}Kind`] as "" | ProtocolTolerance["kind"];
    if (kind) {
      tolerances[key] = { kind, plus: protocol[`${field}Plus`] as number, minus: protocol[`${field}Minus`] as number, source: protocol[`${field}Source`] as string };
    }
  }
  return {
    name: protocol.name,
    summary: protocol.summary,
    conditions,
    requiredMeasurements: protocol.requiredMeasurements,
    repeats: protocol.repeats,
    tolerances,
    stepsMdx: protocol.stepsMdx,
    safetyCautions: protocol.safetyCautions,
  };
}

/** Ticked boxes arrive as `requiredMeasurements.<kind>` = "on": one name per box, since forms keep the last of repeated names. */
function withRequiredMeasurements(input: unknown): unknown {
  if (typeof input !== "object" || input === null) return input;
  const prefix = "requiredMeasurements.";
  const kinds = Object.entries(input)
    .filter(([name, value]) => name.startsWith(prefix) && value === "on")
    .map(([name]) => name.slice(prefix.length));
  return { ...input, requiredMeasurements: kinds };
}

export const protocolFormSchema = z.preprocess(
  withRequiredMeasurements,
  protocolFields.superRefine(checkTolerances, evenWithFieldErrors).transform(toProtocolValues),
);

export const protocolRevisionSchema = z.preprocess(
  withRequiredMeasurements,
  protocolFields
    .extend({ slug: z.string({ error: "Unknown protocol." }).regex(/^[a-z0-9-]{1,100}$/, "Unknown protocol.") })
    .superRefine(checkTolerances, evenWithFieldErrors)
    .transform((protocol) => ({ slug: protocol.slug, ...toProtocolValues(protocol) })),
);

export type ProtocolForm = z.output<typeof protocolFormSchema>;
