"use client";

import { useEffect, useId, useRef } from "react";
import { postComment } from "@/app/(public)/reports/actions";
import { FormStatus, SubmitButton } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { commentLimits, postCommentSchema } from "@/lib/validations/editorial";

// Its own textarea markup rather than TextAreaField: the author's reply forms repeat on one page, and each needs an id
// of its own, where TextAreaField takes its id from the field's name.
export function CommentForm({ reportId, parentId, label }: { reportId: string; parentId?: string; label: string }) {
  const [state, formAction, pending] = useCheckedAction(postComment, postCommentSchema);
  const form = useRef<HTMLFormElement>(null);
  const id = useId();
  // A posted comment clears the box; a refused one keeps what was typed (echoed back by the action).
  useEffect(() => {
    if (state.status === "ok") form.current?.reset();
  }, [state]);
  const problems = state.fieldErrors?.body;
  return (
    <form ref={form} action={formAction} className="flex max-w-2xl flex-col gap-2" noValidate>
      <input type="hidden" name="reportId" value={reportId} />
      {parentId ? <input type="hidden" name="parentId" value={parentId} /> : null}
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        name="body"
        rows={parentId ? 3 : 5}
        maxLength={commentLimits.maxLength}
        defaultValue={state.status === "ok" ? undefined : state.values?.body}
        aria-invalid={problems?.length ? true : undefined}
        aria-describedby={`${id}-hint${problems?.length ? ` ${id}-error` : ""}`}
        className="rounded border border-rule bg-paper-raised px-3 py-2 text-base text-ink aria-invalid:border-copper"
      />
      <p id={`${id}-hint`} className="text-xs text-ink-faint">
        Plain text; web addresses become links. {parentId ? "Your reply as the report's author appears at once." : "Readers' comments appear once an editor approves them."}
      </p>
      {problems?.length ? (
        <p id={`${id}-error`} className="text-sm text-copper-deep">
          {problems.join(" ")}
        </p>
      ) : null}
      <FormStatus status={state.status} message={state.status === "error" && problems?.length ? undefined : state.message} />
      <div>
        <SubmitButton pending={pending}>{parentId ? "Post the reply" : "Post the comment"}</SubmitButton>
      </div>
    </form>
  );
}
