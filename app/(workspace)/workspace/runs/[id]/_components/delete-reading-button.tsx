"use client";

import { useActionState } from "react";
import { idleActionState } from "@/lib/action-state";
import { deleteManualReading } from "../../actions";

export function DeleteReadingButton({ readingId, label }: { readingId: string; label: string }) {
  const [state, formAction, pending] = useActionState(deleteManualReading, idleActionState);
  return (
    <form action={formAction}>
      <input type="hidden" name="readingId" value={readingId} />
      <button type="submit" disabled={pending} className="text-xs font-semibold text-copper-deep hover:underline disabled:opacity-60">
        Delete<span className="sr-only"> {label}</span>
      </button>
      {state.status === "error" || state.status === "forbidden" ? <p className="text-xs text-copper-deep">{state.message}</p> : null}
    </form>
  );
}
