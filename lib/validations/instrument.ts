import { z } from "zod";
import type { AccuracyRange } from "@/db/schema";
import { parseAccuracySpec } from "@/lib/bench/uncertainty";
import { accuracyQuantities, instrumentKinds } from "@/lib/instrument-kinds";
import { withIndexedRows } from "@/lib/form-data";
import { dateField, evenWithFieldErrors, numberField, requiredText } from "@/lib/validations/form-fields";

/** How a datasheet line is written back into the form: "1.5% + 0.05". */
export function formatAccuracySpec({ percentOfReading, offset }: Pick<AccuracyRange, "percentOfReading" | "offset">): string {
  return `${percentOfReading}% + ${offset}`;
}

const accuracySpecField = requiredText('Enter the accuracy as "% of reading + offset", e.g. 1.5% + 0.05.', 60)
  .transform((text, context) => {
    try {
      return parseAccuracySpec(text);
    } catch (error) {
      context.addIssue({ code: "custom", message: (error as Error).message });
      return z.NEVER;
    }
  })
  .refine((spec) => spec.percentOfReading >= 0 && spec.offset >= 0, "Neither term of an accuracy spec can be negative.")
  .refine((spec) => spec.percentOfReading > 0 || spec.offset > 0, "±(0 % + 0) would claim a perfect instrument; copy the datasheet's line.");

const accuracyRowSchema = z
  .object({
    quantity: z.enum(accuracyQuantities, { error: "Choose what this range measures." }),
    unit: requiredText("Give the unit of the range, e.g. A.", 12),
    rangeMax: numberField("Enter the top of the range.").pipe(z.number().positive("The top of the range must be above 0.")),
    spec: accuracySpecField,
  })
  .transform(({ spec, ...row }): AccuracyRange => ({ ...row, ...spec }));

const instrumentFields = z.object({
  kind: z.enum(instrumentKinds, { error: "Choose what kind of instrument this is." }),
  maker: requiredText("Enter the maker.", 80),
  model: requiredText("Enter the model.", 80),
  serialNumber: requiredText("Enter the serial number from the instrument's plate.", 80),
  labId: z.union([z.uuid(), z.literal("")], { error: "Choose one of your labs." }).transform((value) => value || null),
  accuracy: z.array(accuracyRowSchema).min(1, "Add at least one accuracy line from the datasheet.").max(20, "List at most 20 ranges."),
  calibratedOn: dateField("Enter the date of the last calibration."),
  calibrationDueOn: dateField("Enter the date the next calibration is due."),
});

function checkCalibrationDates(instrument: z.output<typeof instrumentFields>, context: z.RefinementCtx) {
  const { calibratedOn, calibrationDueOn } = instrument;
  const valid = (date: unknown): date is string => typeof date === "string" && /^\d{4}-\d{2}-\d{2}$/.test(date);
  if (valid(calibratedOn) && valid(calibrationDueOn) && calibrationDueOn <= calibratedOn) {
    context.addIssue({ code: "custom", path: ["calibrationDueOn"], message: "The due date must come after the calibration date." });
  }
}

const withAccuracyRows = (input: unknown) => withIndexedRows(input, ["accuracy"]);

export const instrumentFormSchema = z.preprocess(withAccuracyRows, instrumentFields.superRefine(checkCalibrationDates, evenWithFieldErrors));

export const instrumentUpdateSchema = z.preprocess(
  withAccuracyRows,
  instrumentFields.extend({ id: z.uuid("Unknown instrument.") }).superRefine(checkCalibrationDates, evenWithFieldErrors),
);

export type InstrumentForm = z.output<typeof instrumentFormSchema>;
