import "server-only";
import type { z } from "zod";
import type { ActionState } from "@/lib/action-state";
import { actionAccess, type ActionKey } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { checkAccess, type CurrentUser } from "@/lib/session";

type UserFor<K extends ActionKey> = (typeof actionAccess)[K] extends "public" ? CurrentUser | null : CurrentUser;

/**
 * Every server action goes through here: the role check comes first and reads its permission from the
 * map in lib/authz.ts, then the form is parsed with zod, then the body runs with typed data.
 * redirect() and notFound() are not caught: Next implements them as exceptions.
 */
export function guardedAction<K extends ActionKey, S extends z.ZodType>(
  key: K,
  schema: S,
  body: (data: z.output<S>, user: UserFor<K>, formData: FormData) => Promise<ActionState | void>,
) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    const decision = await checkAccess(actionAccess[key]);
    if (!decision.allowed) {
      return decision.reason === "unauthenticated"
        ? { status: "unauthenticated", message: "Sign in first." }
        : { status: "forbidden", message: "Your role does not allow this." };
    }
    const parsed = schema.safeParse(formEntries(formData));
    if (!parsed.success) {
      const fieldErrors: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) {
        const field = issue.path.join(".") || "form";
        (fieldErrors[field] ??= []).push(issue.message);
      }
      return { status: "error", message: "Some fields need attention.", fieldErrors, values: echoableValues(formData) };
    }
    try {
      return (await body(parsed.data, decision.user as UserFor<K>, formData)) ?? { status: "ok" };
    } catch (error) {
      if (error instanceof UserFacingError) {
        return { status: "error", message: error.message, fieldErrors: error.fieldErrors, values: echoableValues(formData) };
      }
      throw error;
    }
  };
}

// Secrets and files are never sent back to the browser.
function echoableValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [name, value] of formData.entries()) {
    if (typeof value === "string" && !name.startsWith("$ACTION") && !/password|token/i.test(name)) values[name] = value;
  }
  return values;
}

function formEntries(formData: FormData): Record<string, FormDataEntryValue> {
  const entries: Record<string, FormDataEntryValue> = {};
  for (const [name, value] of formData.entries()) {
    if (!name.startsWith("$ACTION")) entries[name] = value;
  }
  return entries;
}
