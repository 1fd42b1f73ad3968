"use client";

import { useActionState } from "react";
import type { z } from "zod";
import { idleActionState, type ActionState } from "@/lib/action-state";
import { echoableValues, fieldErrorsOf, formEntries } from "@/lib/form-data";

type ServerAction = (previous: ActionState, formData: FormData) => Promise<ActionState>;

/**
 * useActionState with the server action's own zod schema checked in the browser first, so mistakes show beside their
 * fields without a round trip. The server parses again whatever happens here.
 */
export function useCheckedAction(action: ServerAction, schema: z.ZodType) {
  return useActionState(async (previous: ActionState, formData: FormData): Promise<ActionState> => {
    const parsed = schema.safeParse(formEntries(formData));
    if (!parsed.success) {
      return { status: "error", message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error), values: echoableValues(formData) };
    }
    return action(previous, formData);
  }, idleActionState);
}
