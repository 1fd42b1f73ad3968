"use client";

import { useActionState } from "react";
import { FormStatus, SubmitButton } from "@/components/ui/form-controls";
import { updateAvatar } from "@/app/(account)/actions";
import { idleActionState } from "@/lib/action-state";

export function AvatarForm() {
  const [state, formAction, pending] = useActionState(updateAvatar, idleActionState);
  const errors = state.fieldErrors?.avatar;
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <label htmlFor="avatar" className="text-sm font-semibold">
        New picture
      </label>
      <input
        id="avatar"
        name="avatar"
        type="file"
        accept="image/png,image/jpeg,image/webp,image/gif,image/avif"
        aria-describedby="avatar-hint"
        className="text-sm"
      />
      <p id="avatar-hint" className="text-xs text-ink-faint">
        PNG, JPEG, WebP, GIF or AVIF up to 5 MB. We crop it square and remove its metadata (camera, location).
      </p>
      {errors?.length ? <p className="text-sm text-copper-deep">{errors.join(" ")}</p> : null}
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Upload picture</SubmitButton>
      </div>
    </form>
  );
}
