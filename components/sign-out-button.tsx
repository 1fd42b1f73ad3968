"use client";

import { useActionState } from "react";
import { signOutUser } from "@/app/(auth)/actions";
import { idleActionState } from "@/lib/action-state";

export function SignOutButton() {
  const [, formAction, pending] = useActionState(signOutUser, idleActionState);
  return (
    <form action={formAction}>
      <button type="submit" disabled={pending} className="text-sm text-ink-soft underline-offset-4 hover:underline">
        Sign out
      </button>
    </form>
  );
}
