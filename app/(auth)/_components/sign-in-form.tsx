"use client";

import Link from "next/link";
import { useActionState } from "react";
import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { signInWithPassword } from "@/app/(auth)/actions";
import { idleActionState } from "@/lib/action-state";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const [state, formAction, pending] = useActionState(signInWithPassword, idleActionState);
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      <TextField label="Email" name="email" type="email" autoComplete="email" required errors={state.fieldErrors} values={state.values} />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" required errors={state.fieldErrors} values={state.values} />
      <FormStatus status={state.status} message={state.message} />
      <SubmitButton pending={pending}>Sign in</SubmitButton>
      <p className="text-sm text-ink-soft">
        <Link href="/reset-password" className="underline underline-offset-4">
          Forgot the password?
        </Link>{" "}
        ·{" "}
        <Link href="/sign-up" className="underline underline-offset-4">
          Join as a reader
        </Link>
      </p>
    </form>
  );
}
