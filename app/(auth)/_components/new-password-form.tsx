"use client";

import { useActionState } from "react";
import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { resetPassword } from "@/app/(auth)/actions";
import { idleActionState } from "@/lib/action-state";

export function NewPasswordForm({ token }: { token: string }) {
  const [state, formAction, pending] = useActionState(resetPassword, idleActionState);
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" required errors={state.fieldErrors} values={state.values} hint="At least 10 characters." />
      <TextField label="New password again" name="confirmPassword" type="password" autoComplete="new-password" required errors={state.fieldErrors} values={state.values} />
      <FormStatus status={state.status} message={state.fieldErrors?.token?.join(" ") ?? state.message} />
      <SubmitButton pending={pending}>Set the new password</SubmitButton>
    </form>
  );
}
