"use client";

import { FormStatus } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { commenterTrustSchema, moderateCommentSchema } from "@/lib/validations/editorial";
import { moderateComment, setCommenterTrust } from "../actions";

const button = "rounded border px-3 py-1 text-sm font-semibold disabled:opacity-60";

/** Approve, reject or mark as spam: each button sends its own status with the comment. */
export function ModerationButtons({ commentId, status }: { commentId: string; status: string }) {
  const [state, formAction, pending] = useCheckedAction(moderateComment, moderateCommentSchema);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="commentId" value={commentId} />
      {status !== "approved" ? (
        <button type="submit" name="status" value="approved" disabled={pending} className={`${button} border-verdict-meets bg-verdict-meets text-white`}>
          Approve
        </button>
      ) : null}
      {status !== "rejected" ? (
        <button type="submit" name="status" value="rejected" disabled={pending} className={`${button} border-ink`}>
          Reject
        </button>
      ) : null}
      {status !== "spam" ? (
        <button type="submit" name="status" value="spam" disabled={pending} className={`${button} border-copper text-copper-deep`}>
          Mark as spam
        </button>
      ) : null}
      <FormStatus status={state.status} message={state.message} />
    </form>
  );
}

export function TrustButton({ userId, trusted, name }: { userId: string; trusted: boolean; name: string }) {
  const [state, formAction, pending] = useCheckedAction(setCommenterTrust, commenterTrustSchema);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="userId" value={userId} />
      {trusted ? null : <input type="hidden" name="trusted" value="on" />}
      <button type="submit" disabled={pending} className="text-sm font-semibold text-verdigris-deep underline disabled:opacity-60">
        {trusted ? `Stop trusting ${name}` : `Trust ${name}: skip moderation`}
      </button>
      <FormStatus status={state.status} message={state.message} />
    </form>
  );
}
