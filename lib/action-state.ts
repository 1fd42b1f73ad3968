// Shared by server actions and the client forms that call them, so it must not import server-only code.
export type ActionState = {
  status: "idle" | "ok" | "error" | "unauthenticated" | "forbidden";
  message?: string;
  fieldErrors?: Record<string, string[] | undefined>;
  /** What was typed, echoed back after a refusal: React resets a form after its action, and retyping everything is hostile. */
  values?: Record<string, string>;
};

export const idleActionState: ActionState = { status: "idle" };
