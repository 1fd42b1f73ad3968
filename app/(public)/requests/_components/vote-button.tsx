"use client";

import { useActionState } from "react";
import { toggleRequestVote } from "@/app/(public)/actions";
import { idleActionState } from "@/lib/action-state";

/** One vote per reader; pressing again withdraws it. The count comes from the server after each change. */
export function VoteButton({ requestId, voted, voteCount, label }: { requestId: string; voted: boolean; voteCount: number; label: string }) {
  const [state, formAction, pending] = useActionState(toggleRequestVote, idleActionState);
  return (
    <form action={formAction} className="flex flex-col items-center gap-1">
      <input type="hidden" name="requestId" value={requestId} />
      <button
        type="submit"
        disabled={pending}
        aria-pressed={voted}
        aria-label={`${voted ? "Withdraw your vote for" : "Vote for"} ${label} (${voteCount} ${voteCount === 1 ? "vote" : "votes"})`}
        className={`flex min-w-16 flex-col items-center rounded border px-3 py-1 text-sm font-semibold disabled:opacity-60 ${
          voted ? "border-verdigris bg-verdigris-wash text-verdigris-deep" : "border-ink hover:bg-ink hover:text-paper-raised"
        }`}
      >
        <span className="figure text-lg leading-tight">{voteCount}</span>
        <span className="text-xs">{voted ? "Voted" : "Vote"}</span>
      </button>
      <span aria-live="polite" className={`text-center text-xs ${state.status === "ok" ? "text-verdigris-deep" : "text-copper-deep"}`}>
        {state.status !== "idle" && state.status !== "ok" ? state.message : null}
      </span>
    </form>
  );
}
