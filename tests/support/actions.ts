import { idleActionState, type ActionState } from "@/lib/action-state";

export type ServerAction = (previous: ActionState, formData: FormData) => Promise<ActionState>;

/** A FormData as a browser would post it: one entry per field. */
export function form(fields: Record<string, string | Blob>): FormData {
  const data = new FormData();
  for (const [name, value] of Object.entries(fields)) data.append(name, value);
  return data;
}

/** The location an action redirects to: Next implements redirect() as a thrown error whose digest carries it. */
export async function redirectOf(action: ServerAction, formData: FormData): Promise<string> {
  try {
    const state = await action(idleActionState, formData);
    throw new Error(`expected a redirect, got ${JSON.stringify(state)}`);
  } catch (error) {
    const digest = (error as { digest?: string }).digest;
    if (!digest?.startsWith("NEXT_REDIRECT")) throw error;
    return digest.split(";")[2]!;
  }
}
