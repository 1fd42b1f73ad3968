import type { ActionState } from "@/lib/action-state";

/**
 * A key that changes with what a refused submission echoed back. React resets a form after its action, and a
 * <select> goes back to the option it was first rendered with, whatever its defaultValue has become since; a new key
 * mounts the form afresh, so every field starts from the echoed values.
 */
export function formKey(state: ActionState): string {
  return state.values ? JSON.stringify(state.values) : state.status;
}
