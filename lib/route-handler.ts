import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { routeHandlerAccess } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/form-data";
import { checkAccess, type CurrentUser } from "@/lib/session";

type RouteKey = keyof typeof routeHandlerAccess;

/**
 * Route handlers run in a fixed order: parse (422 with field errors), authenticate (401), authorise (403),
 * act. Unexpected failures answer 500 without leaking SQL or stack traces.
 */
export async function handleRoute<S extends z.ZodType>(
  key: RouteKey,
  schema: S,
  input: unknown,
  act: (data: z.output<S>, user: CurrentUser | null) => Promise<Response>,
): Promise<Response> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) {
    return NextResponse.json({ error: { message: "Invalid request.", fieldErrors: fieldErrorsOf(parsed.error, "request") } }, { status: 422 });
  }
  const decision = await checkAccess(routeHandlerAccess[key]);
  if (!decision.allowed) {
    return decision.reason === "unauthenticated"
      ? NextResponse.json({ error: { message: "Sign in first." } }, { status: 401 })
      : NextResponse.json({ error: { message: "Your role does not allow this." } }, { status: 403 });
  }
  try {
    return await act(parsed.data, decision.user);
  } catch (error) {
    if (error instanceof UserFacingError) {
      return NextResponse.json({ error: { message: error.message, fieldErrors: error.fieldErrors } }, { status: error.status });
    }
    console.error(`${key} failed`, error);
    return NextResponse.json({ error: { message: "Something went wrong on our side." } }, { status: 500 });
  }
}

export function searchParamsObject(url: string): Record<string, string> {
  return Object.fromEntries(new URL(url).searchParams.entries());
}
