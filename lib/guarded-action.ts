import "server-only";
import type { z } from "zod";
import type { ActionState } from "@/lib/action-state";
import { actionAccess, type ActionKey } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { echoableValues, fieldErrorsOf, formEntries } from "@/lib/form-data";
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
      return { status: "error", message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error), values: echoableValues(formData) };
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
