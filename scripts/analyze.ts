// npm run --silent analyze -- FILE [flags]: analyse a capture CSV; a readable
// summary, or with --json the analysis object documented in the README.

import { basename } from "node:path";
import { parseArgs } from "node:util";
import { z } from "zod";
import { analyzeCapture, type AnalysisOptions, type CaptureAnalysis } from "../lib/bench/analysis";
import { CaptureError } from "../lib/bench/capture-csv";
import { startHelperThread } from "../lib/bench/helper-thread";

const USAGE = `usage: npm run --silent analyze -- FILE [--current COL] [--current-scale K] [--voltage COL] [--voltage-scale K]
  [--time COL] [--sample-interval S] [--nominal-voltage V] [--frequency HZ] [--lamp 230|120] [--impedance R,X]
  [--dmax-limit 4|6|7] [--class A|B] [--rated-power W --rated-voltage V|VMIN-VMAX] [--appliance heating|motor|combined]
  [--current-accuracy P%+A] [--voltage-accuracy P%+V] [--rule simple|guarded] [--json]
COL is a column name or a 1-based column number; K multiplies the column into amperes or volts.`;

class UsageError extends Error {}

const number = (flag: string) =>
  z
    .string()
    .trim()
    .transform((text, context) => {
      const value = Number(text);
      if (text === "" || !Number.isFinite(value)) {
        context.addIssue({ code: "custom", message: `--${flag} must be a number, got "${text}"` });
        return z.NEVER;
      }
      return value;
    });

const column = z
  .string()
  .trim()
  .min(1)
  .transform((text) => (/^\d+$/.test(text) ? Number(text) : text));

const flagsSchema = z
  .object({
    file: z.string({ error: "give the capture file" }).min(1, "give the capture file"),
    current: column.optional(),
    "current-scale": number("current-scale").optional(),
    voltage: column.optional(),
    "voltage-scale": number("voltage-scale").optional(),
    time: column.optional(),
    "sample-interval": number("sample-interval").optional(),
    "nominal-voltage": number("nominal-voltage").optional(),
    frequency: number("frequency").optional(),
    lamp: z.enum(["230", "120"], { error: "--lamp must be 230 or 120" }).transform(Number).optional(),
    impedance: z
      .string()
      .regex(/^\s*[\d.eE+-]+\s*,\s*[\d.eE+-]+\s*$/, '--impedance must be "R,X" in ohms, e.g. 0.4,0.25')
      .transform((text) => text.split(",").map(Number) as [number, number])
      .optional(),
    "dmax-limit": z.enum(["4", "6", "7"], { error: "--dmax-limit must be 4, 6 or 7 (per cent)" }).transform(Number).optional(),
    class: z.enum(["A", "B"], { error: "--class must be A or B" }).optional(),
    "rated-power": number("rated-power").optional(),
    "rated-voltage": z
      .string()
      .trim()
      .regex(/^[\d.]+(\s*-\s*[\d.]+)?$/, "--rated-voltage must be V or VMIN-VMAX, e.g. 230 or 220-240")
      .transform((text) => {
        const [min, max] = text.split("-").map((part) => Number(part.trim()));
        return max === undefined ? (min as number) : { min: min as number, max };
      })
      .optional(),
    appliance: z.enum(["heating", "motor", "combined"], { error: "--appliance must be heating, motor or combined" }).optional(),
    "current-accuracy": z.string().optional(),
    "voltage-accuracy": z.string().optional(),
    rule: z.enum(["simple", "guarded"], { error: "--rule must be simple or guarded" }).optional(),
    json: z.boolean().default(false),
  })
  .superRefine((flags, context) => {
    const ratingFlags = ["rated-voltage", "appliance", "current-accuracy", "voltage-accuracy", "rule"] as const;
    if (flags["rated-power"] === undefined) {
      for (const flag of ratingFlags) {
        if (flags[flag] !== undefined) context.addIssue({ code: "custom", message: `--${flag} is used only with --rated-power` });
      }
    } else if (flags["rated-voltage"] === undefined) {
      context.addIssue({ code: "custom", message: "--rated-power needs --rated-voltage (V or VMIN-VMAX)" });
    }
  });

type Flags = z.output<typeof flagsSchema>;

function readFlags(argv: string[]): Flags {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        current: { type: "string" },
        "current-scale": { type: "string" },
        voltage: { type: "string" },
        "voltage-scale": { type: "string" },
        time: { type: "string" },
        "sample-interval": { type: "string" },
        "nominal-voltage": { type: "string" },
        frequency: { type: "string" },
        lamp: { type: "string" },
        impedance: { type: "string" },
        "dmax-limit": { type: "string" },
        class: { type: "string" },
        "rated-power": { type: "string" },
        "rated-voltage": { type: "string" },
        appliance: { type: "string" },
        "current-accuracy": { type: "string" },
        "voltage-accuracy": { type: "string" },
        rule: { type: "string" },
        json: { type: "boolean" },
        help: { type: "boolean" },
      },
    });
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
  if (parsed.values.help) {
    process.stdout.write(`${USAGE}\n`);
    process.exit(0);
  }
  if (parsed.positionals.length > 1) throw new UsageError(`one capture file at a time, got ${parsed.positionals.length}`);
  const { help: _help, ...values } = parsed.values;
  const result = flagsSchema.safeParse({ ...values, file: parsed.positionals[0] });
  if (!result.success) throw new UsageError(result.error.issues.map((issue) => issue.message).join("; "));
  return result.data;
}

/** A scale without a column applies to the column found by name. */
function channel(column: string | number | undefined, scale: number | undefined) {
  return column === undefined && scale === undefined ? undefined : { column, scale: scale ?? 1 };
}

function toOptions(flags: Flags): AnalysisOptions {
  const ratedPowerW = flags["rated-power"];
  const ratedVoltage = flags["rated-voltage"];
  return {
    current: channel(flags.current, flags["current-scale"]),
    voltage: channel(flags.voltage, flags["voltage-scale"]),
    time: flags.time,
    sampleIntervalSeconds: flags["sample-interval"],
    nominalVoltage: flags["nominal-voltage"],
    nominalFrequencyHz: flags.frequency,
    lamp: flags.lamp as 230 | 120 | undefined,
    impedance: flags.impedance === undefined ? null : { resistanceOhm: flags.impedance[0], reactanceOhm: flags.impedance[1] },
    dmaxLimitPercent: flags["dmax-limit"] as 4 | 6 | 7 | undefined,
    harmonicClass: flags.class,
    rating:
      ratedPowerW === undefined || ratedVoltage === undefined
        ? null
        : {
            ratedPowerW,
            ratedVoltage,
            appliance: flags.appliance,
            currentAccuracy: flags["current-accuracy"] ?? null,
            voltageAccuracy: flags["voltage-accuracy"] ?? null,
            rule: flags.rule,
          },
  };
}

const fixed = (value: number, digits: number) => value.toFixed(digits);
const percent = (value: number) => `${(value * 100).toFixed(1)} %`;

function summary(file: string, result: CaptureAnalysis): string {
  const { capture, current, voltage, power, estimatedPower, halfCycles, harmonics, flicker, verdict } = result;
  const lines: string[] = [];
  const row = (label: string, text: string) => lines.push(`${label.padEnd(10)}${text}`);
  row(
    "Capture",
    `${basename(file)}: ${capture.samples} samples at ${fixed(result.sampleRateHz, 1)} S/s (${fixed(capture.durationSeconds, 3)} s), ` +
      `current from "${capture.columns.current}"${capture.columns.voltage === null ? ", no voltage channel" : `, voltage from "${capture.columns.voltage}"`}`,
  );
  row("Frequency", `${fixed(result.frequencyHz, 3)} Hz (${result.frequencySource === "nominal" ? "nominal" : `from the ${result.frequencySource}'s zero crossings`})`);
  row(
    "Current",
    `RMS ${fixed(current.rms, 4)} A, peak ${fixed(current.peak, 4)} A, crest factor ${current.crestFactor === null ? "—" : fixed(current.crestFactor, 3)}, DC ${fixed(current.dc, 4)} A`,
  );
  if (voltage !== null) row("Voltage", `RMS ${fixed(voltage.rms, 2)} V, peak ${fixed(voltage.peak, 2)} V`);
  if (power !== null) {
    row(
      "Power",
      `real ${fixed(power.real, 1)} W, apparent ${fixed(power.apparent, 1)} VA, power factor ${power.factor === null ? "—" : fixed(power.factor, 3)}` +
        (power.whileConducting === null
          ? ""
          : `; while conducting ${fixed(power.whileConducting, 1)} W (power factor ${power.factorWhileConducting === null ? "—" : fixed(power.factorWhileConducting, 3)})`),
    );
  }
  if (estimatedPower !== null) {
    row(
      "Power",
      `ESTIMATE from ${estimatedPower.assumedVoltage} V nominal (resistive load): mean ${fixed(estimatedPower.mean, 1)} W, ` +
        `while conducting ${fixed(estimatedPower.whileConducting, 1)} W`,
    );
  }
  row(
    "Firing",
    `${halfCycles.firing}${halfCycles.asymmetric ? ", ASYMMETRIC" : ""}: duty ${percent(halfCycles.duty)} of ${halfCycles.count} half-cycles, ` +
      `${fixed(halfCycles.switchesPerMinute, 1)} switchings/min, longest off ${fixed(halfCycles.longestOffSeconds, 3)} s`,
  );
  if (halfCycles.asymmetricNote !== null) row("", halfCycles.asymmetricNote);
  const above = harmonics.orders.filter((order) => order.withinLimit === false);
  row(
    "Harmonics",
    `indicative, Class ${harmonics.class}, ${harmonics.windows} window${harmonics.windows === 1 ? "" : "s"} of ${harmonics.windowCycles} cycles: fundamental ${fixed(harmonics.fundamentalAmps, 4)} A, ` +
      `THD ${harmonics.thdPercent === null ? "—" : `${fixed(harmonics.thdPercent, 2)} %`}; ` +
      (harmonics.applicable
        ? above.length === 0
          ? "every order within its limit"
          : `above the limit at ${above.map((order) => `${order.order} (${fixed(order.amps, 3)} A > ${fixed(order.limitAmps ?? 0, 3)} A)`).join(", ")}`
        : `limits not applicable: ${harmonics.notApplicableReason}`),
  );
  if (flicker !== null) {
    row(
      "Flicker",
      `Pst ${fixed(flicker.pst, 3)} (limit ${flicker.pstLimit}), dc ${fixed(flicker.dcPercent, 3)} % (${flicker.dcLimitPercent} %), ` +
        `dmax ${fixed(flicker.dmaxPercent, 3)} % (${flicker.dmaxLimitPercent} %), Tmax ${fixed(flicker.tmaxSeconds, 3)} s (${flicker.tmaxLimitSeconds} s)`,
    );
  } else row("Flicker", `not estimated: ${result.flickerUnavailableReason}`);
  if (verdict !== null) {
    const judged = verdict.normalized ?? verdict.measured;
    row(
      "Verdict",
      `${verdict.result.toUpperCase()}: ${fixed(judged, 1)} W${verdict.normalizedTo === null ? " as measured" : ` normalised to ${verdict.normalizedTo} V`} ` +
        `against ${verdict.rated} W rated (tolerance ${verdict.lower === null ? "—" : fixed(verdict.lower, 1)} to ${verdict.upper === null ? "—" : fixed(verdict.upper, 1)} W, ` +
        `U = ${fixed(verdict.expandedUncertainty, 1)} W (k = 2), ${verdict.rule} acceptance)`,
    );
  } else if (result.verdictUnavailableReason !== null) row("Verdict", `none: ${result.verdictUnavailableReason}`);
  for (const warning of result.warnings) row("Warning", warning);
  return lines.join("\n");
}

async function main(argv: string[]): Promise<number> {
  const json = argv.includes("--json");
  // The helper thread starts while the flags and the start of the capture are read; a failure to start is reported
  // like any other, when a large capture's blocks wait for it.
  const helper = startHelperThread();
  try {
    const flags = readFlags(argv);
    const result = await analyzeCapture({ path: flags.file }, toOptions(flags), undefined, helper);
    process.stdout.write(flags.json ? `${JSON.stringify(result)}\n` : `${summary(flags.file, result)}\n`);
    return 0;
  } catch (error) {
    const message =
      error instanceof z.ZodError
        ? error.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`).join("; ")
        : error instanceof Error
          ? error.message
          : String(error);
    const line = error instanceof CaptureError ? error.line : null;
    process.stderr.write(`analyze: ${message}${error instanceof UsageError ? `\n${USAGE}` : ""}\n`);
    if (json) {
      const problem = error instanceof CaptureError ? error.problem : message;
      process.stdout.write(`${JSON.stringify({ error: { message: problem, line } })}\n`);
    }
    return 1;
  }
}

process.exitCode = await main(process.argv.slice(2));
