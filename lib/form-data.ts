import type { z } from "zod";

// Shared by server actions and the client forms that check the same schema before sending, so it must stay free of
// server-only imports.

/** A form's fields by name, without the entries Next adds to identify the action. */
export function formEntries(formData: FormData): Record<string, FormDataEntryValue> {
  const entries: Record<string, FormDataEntryValue> = {};
  for (const [name, value] of formData.entries()) {
    if (!name.startsWith("$ACTION")) entries[name] = value;
  }
  return entries;
}

// Secrets and files are never sent back to the browser.
export function echoableValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [name, value] of formData.entries()) {
    if (typeof value === "string" && !name.startsWith("$ACTION") && !/password|token/i.test(name)) values[name] = value;
  }
  return values;
}

/** zod issues keyed by the dotted path, which is also the name of the input that caused them. */
export function fieldErrorsOf(error: z.ZodError, fallbackField = "form"): Record<string, string[]> {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) (fieldErrors[issue.path.join(".") || fallbackField] ??= []).push(issue.message);
  return fieldErrors;
}

/**
 * Gathers repeated rows named `prefix.<index>.<field>` (a form's "add another" rows) into an array under `prefix`, in
 * index order. Indexes are kept as they are, so an error at `prefix.2.name` lands beside the input of that name.
 */
export function withIndexedRows(input: unknown, prefixes: readonly string[]): unknown {
  if (typeof input !== "object" || input === null || Array.isArray(input)) return input;
  const output: Record<string, unknown> = { ...input };
  for (const prefix of prefixes) {
    const rows: Record<string, unknown>[] = [];
    const rowField = new RegExp(`^${prefix.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}\\.(\\d+)\\.(\\w+)$`);
    for (const [name, value] of Object.entries(input)) {
      const match = rowField.exec(name);
      if (!match) continue;
      const index = Number(match[1]);
      (rows[index] ??= {})[match[2]!] = value;
      delete output[name];
    }
    if (!(prefix in output)) output[prefix] = Array.from(rows, (row) => row ?? {});
  }
  return output;
}
