"use client";

import { useActionState } from "react";
import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { signUpReader } from "@/app/(auth)/actions";
import { idleActionState } from "@/lib/action-state";

export function SignUpForm() {
  const [state, formAction, pending] = useActionState(signUpReader, idleActionState);
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <TextField label="Name" name="name" autoComplete="name" required errors={state.fieldErrors} values={state.values} hint="Shown beside your comments." />
      <TextField label="Email" name="email" type="email" autoComplete="email" required errors={state.fieldErrors} values={state.values} />
      <TextField label="Password" name="password" type="password" autoComplete="new-password" required errors={state.fieldErrors} values={state.values} hint="At least 10 characters." />
      <TextField label="Password again" name="confirmPassword" type="password" autoComplete="new-password" required errors={state.fieldErrors} values={state.values} />
      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>Create reader account</SubmitButton>
    </form>
  );
}
