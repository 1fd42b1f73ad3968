"use client";

import { useActionState } from "react";
import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { requestPasswordReset } from "@/app/(auth)/actions";
import { idleActionState } from "@/lib/action-state";

export function ResetRequestForm() {
  const [state, formAction, pending] = useActionState(requestPasswordReset, idleActionState);
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <TextField label="Email" name="email" type="email" autoComplete="email" required errors={state.fieldErrors} values={state.values} />
      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>Send a reset link</SubmitButton>
    </form>
  );
}
