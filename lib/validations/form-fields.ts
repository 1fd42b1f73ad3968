import { z } from "zod";

// Field builders for forms: an input left empty arrives as "", which must read as "not given", not as 0.

function blankToUndefined(value: unknown): unknown {
  if (typeof value === "string" && value.trim() === "") return undefined;
  return value === null ? undefined : value;
}

function toNumber(value: unknown): unknown {
  const present = blankToUndefined(value);
  return typeof present === "string" ? Number(present.trim()) : present;
}

const notANumber = "Enter a number, such as 230 or 12.5.";

/** A number the form must have; `required` is the message when the field is left empty. */
export function numberField(required: string, invalid = notANumber) {
  return z.preprocess(toNumber, z.number({ error: (issue) => (issue.input === undefined ? required : invalid) }));
}

/** A number that may be left empty (null). Pass the checks (positive, ranges) in `refine`. */
export function optionalNumberField(refine: (field: z.ZodNumber) => z.ZodNumber = (field) => field, invalid = notANumber) {
  return z.preprocess(toNumber, refine(z.number({ error: invalid })).optional()).transform((value) => value ?? null);
}

export function requiredText(required: string, max: number) {
  return z
    .string({ error: required })
    .trim()
    .min(1, required)
    .max(max, `Use at most ${max} characters.`);
}

export function optionalText(max: number) {
  return z.preprocess(
    blankToUndefined,
    z.string().trim().max(max, `Use at most ${max} characters.`).optional(),
  ).transform((value) => value || null);
}

export function dateField(required: string) {
  return z.preprocess(blankToUndefined, z.iso.date({ error: (issue) => (issue.input === undefined ? required : "Enter a date as YYYY-MM-DD.") }));
}

/** A checkbox: present ("on") when ticked, absent otherwise. */
export const checkboxField = z.preprocess((value) => value === "on" || value === "true" || value === true, z.boolean());

/**
 * For a form-wide superRefine: zod skips refinements once a single field has failed, which would hold back the
 * cross-field messages until a second submit. With this they run whenever the form is an object at all, so the
 * refinement must read each field defensively.
 */
export const evenWithFieldErrors = {
  when: (payload: { value: unknown }) => typeof payload.value === "object" && payload.value !== null,
};

/** For a query string: a parameter given empty (as a plain GET form sends an unused field) is read as not given. */
export function withoutBlankParams(input: unknown): unknown {
  if (typeof input !== "object" || input === null || Array.isArray(input)) return input;
  return Object.fromEntries(Object.entries(input).filter(([, value]) => !(typeof value === "string" && value.trim() === "")));
}

/**
 * Text a reader types into a search box: control characters (a NUL byte, which PostgreSQL refuses in text, among
 * them) become spaces, the ends are trimmed, and the length is capped.
 */
export function searchText(max: number, tooLong: string) {
  return z
    .string()
    .transform((value) => value.replace(/[\u0000-\u001f\u007f]/g, " "))
    .pipe(z.string().trim().max(max, tooLong));
}
