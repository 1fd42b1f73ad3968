import { z } from "zod";
import { withIndexedRows } from "@/lib/form-data";
import { toolCategories } from "@/lib/validations/catalogue";
import { evenWithFieldErrors, numberField, optionalNumberField, optionalText, requiredText } from "@/lib/validations/form-fields";

export const applianceTypes = ["heating", "motor", "combined"] as const;

/** IEC 60335-1's classification, which picks the power-input tolerance row. */
export const applianceTypeLabels: Record<(typeof applianceTypes)[number], string> = {
  heating: "Heating appliance",
  motor: "Motor-operated appliance",
  combined: "Combined appliance",
};

export const accessoryKinds = ["nozzle", "tip", "stand", "other"] as const;

export const accessoryKindLabels: Record<(typeof accessoryKinds)[number], string> = {
  nozzle: "Nozzle",
  tip: "Tip",
  stand: "Stand or holder",
  other: "Other",
};

/** How a tool's rated frequency is marked on its plate. */
export const ratedFrequencyChoices = { "50": [50], "60": [60], "50/60": [50, 60] } as const satisfies Record<string, readonly number[]>;

/** "" is "not stated": IEC 60335-1 then takes the heating rows, and the verdict says it assumed so. */
export const motorShareChoices = { "": null, above: true, "not-above": false } as const;

export function motorShareLabel(motorShareAboveHalf: boolean | null): string {
  if (motorShareAboveHalf === null) return "Not stated";
  return motorShareAboveHalf ? "More than half" : "Half or less";
}

export const newMakerChoice = "new";

// Intl knows the ISO 4217 list in Node and every current browser, so the form and the server check the same codes.
const isoCurrencies = new Set(Intl.supportedValuesOf("currency"));

export const photoLimits = {
  maxBytes: 7 * 1024 * 1024,
  /** Web renditions; none is made wider than the uploaded picture. */
  widths: [480, 960, 1600] as const,
};

const accessorySchema = z.object({
  kind: z.enum(accessoryKinds, { error: "Choose what kind of accessory this is." }),
  name: requiredText("Name the accessory, or remove the row.", 80),
  size: optionalText(40),
});

const toolFields = z.object({
  makerId: z.union([z.uuid(), z.literal(newMakerChoice)], { error: "Choose the maker, or “A maker not listed yet”." }),
  newMakerName: optionalText(80),
  newMakerCountry: optionalText(60),
  model: requiredText("Enter the model as the maker names it.", 80),
  category: z.enum(toolCategories, { error: "Choose the kind of tool." }),
  applianceType: z.enum(applianceTypes, { error: "Choose heating, motor-operated or combined." }),
  motorShare: z.enum(["", "above", "not-above"], { error: "Choose whether the motor takes more than half." }).default(""),
  ratedPowerW: numberField("Enter the rated power input in watts.").pipe(
    z.number().positive("Rated power input must be above 0 W.").max(10_000, "Rated power input above 10 kW is not a bench tool."),
  ),
  ratedVoltageMin: numberField("Enter the rated voltage in volts.").pipe(
    z.number().positive("Rated voltage must be above 0 V.").max(1000, "Rated voltage above 1000 V is not mains."),
  ),
  ratedVoltageMax: optionalNumberField((field) => field.positive("The upper end must be above 0 V.").max(1000, "Rated voltage above 1000 V is not mains.")),
  ratedFrequency: z.enum(Object.keys(ratedFrequencyChoices) as [keyof typeof ratedFrequencyChoices], {
    error: "Choose the rated frequency: 50 Hz, 60 Hz or 50/60 Hz.",
  }),
  ratedAirflowLpm: optionalNumberField((field) => field.positive("Rated airflow must be above 0 L/min.").max(2000, "Rated airflow above 2000 L/min is not a bench tool.")),
  temperatureMinC: optionalNumberField((field) => field.min(0, "Use °C at or above 0.").max(1200, "Use °C up to 1200.")),
  temperatureMaxC: optionalNumberField((field) => field.min(0, "Use °C at or above 0.").max(1200, "Use °C up to 1200.")),
  claimedHeatUpSeconds: optionalNumberField((field) => field.positive("The claimed heat-up time must be above 0 s.").max(3600, "Give the heat-up time in seconds, up to 3600.")),
  price: optionalNumberField((field) => field.positive("The price must be above 0.").max(1_000_000, "The price must be below 1 000 000.")),
  currency: optionalText(12),
  accessories: z.array(accessorySchema).max(40, "List at most 40 accessories."),
  summary: z.string().trim().max(600, "Keep the summary to 600 characters.").default(""),
});

type ToolFields = z.output<typeof toolFields>;

/** A field's parsed number, or null when it was left empty or failed its own check. */
function given(value: unknown): number | null {
  return typeof value === "number" && Number.isFinite(value) ? value : null;
}

// Runs even when single fields failed (see `evenWithFieldErrors`), so every mistake shows at once; hence `given`.
function checkTool(tool: ToolFields, context: z.RefinementCtx) {
  const issue = (path: string, message: string) => context.addIssue({ code: "custom", path: [path], message });
  if (tool.makerId === newMakerChoice) {
    if (!tool.newMakerName || tool.newMakerName.length < 2) issue("newMakerName", "Enter the new maker's name.");
    if (!tool.newMakerCountry || tool.newMakerCountry.length < 2) issue("newMakerCountry", "Enter the country the maker is based in.");
  }
  const [voltageMin, voltageMax] = [given(tool.ratedVoltageMin), given(tool.ratedVoltageMax)];
  if (voltageMin !== null && voltageMax !== null && voltageMax < voltageMin) {
    issue("ratedVoltageMax", "The upper end of the voltage range cannot be below the lower end.");
  }
  const [temperatureMin, temperatureMax] = [given(tool.temperatureMinC), given(tool.temperatureMaxC)];
  if (tool.temperatureMinC === null && temperatureMax !== null) issue("temperatureMinC", "Give both ends of the temperature range, or neither.");
  if (tool.temperatureMaxC === null && temperatureMin !== null) issue("temperatureMaxC", "Give both ends of the temperature range, or neither.");
  if (temperatureMin !== null && temperatureMax !== null && temperatureMax <= temperatureMin) {
    issue("temperatureMaxC", "The highest temperature must be above the lowest.");
  }
  if (tool.currency && !isoCurrencies.has(tool.currency.toUpperCase())) {
    issue("currency", "Use a three-letter ISO 4217 currency code such as EUR, USD or GBP.");
  } else if (tool.price !== null && tool.price !== undefined && !tool.currency) {
    issue("currency", "Give the currency of the price, e.g. EUR.");
  } else if (tool.currency && tool.price === null) {
    issue("price", "Give the price, or clear the currency.");
  }
  if (tool.motorShare && tool.applianceType !== "combined") {
    issue("motorShare", "The motor's share applies to combined appliances only.");
  }
}

function toToolValues<T extends ToolFields>({ motorShare, ratedFrequency, price, currency, ratedVoltageMax, ...tool }: T) {
  return {
    ...tool,
    ratedVoltageMax: ratedVoltageMax ?? tool.ratedVoltageMin,
    ratedFrequenciesHz: [...ratedFrequencyChoices[ratedFrequency]],
    motorShareAboveHalf: motorShareChoices[motorShare],
    // Minor units, as lib/format.ts reads them back.
    priceMinor: price === null ? null : Math.round(price * 100),
    currency: currency ? currency.toUpperCase() : null,
  };
}

const withAccessoryRows = (input: unknown) => withIndexedRows(input, ["accessories"]);

const toolSlug = z.string({ error: "Unknown tool." }).regex(/^[a-z0-9-]{1,100}$/, "Unknown tool.");

export const toolFormSchema = z.preprocess(withAccessoryRows, toolFields.superRefine(checkTool, evenWithFieldErrors).transform(toToolValues));

export const toolUpdateSchema = z.preprocess(
  withAccessoryRows,
  toolFields.extend({ slug: toolSlug }).superRefine(checkTool, evenWithFieldErrors).transform(toToolValues),
);

export type ToolForm = z.output<typeof toolFormSchema>;

export const toolPhotoUploadSchema = z.object({
  slug: toolSlug,
  photo: z
    .instanceof(File, { message: "Choose a photo." })
    .refine((file) => file.size > 0, "Choose a photo: the chosen file is empty.")
    .refine((file) => file.size <= photoLimits.maxBytes, `Photos up to ${photoLimits.maxBytes / 1024 / 1024} MB.`)
    .refine((file) => /^image\/(png|jpeg|webp|avif)$/.test(file.type), "Use a JPEG, PNG, WebP or AVIF photo."),
  altText: requiredText("Describe the photo for readers who cannot see it.", 300).pipe(
    z.string().min(8, "Describe the photo in a few words: what it shows, from which side."),
  ),
});

export const toolPhotoDeleteSchema = z.object({
  slug: toolSlug,
  photoId: z.uuid("Unknown photo."),
});
