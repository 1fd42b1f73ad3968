"use client";

import { useActionState } from "react";
import { changeUserRole } from "@/app/(admin)/actions";
import { idleActionState } from "@/lib/action-state";
import { roles, type Role } from "@/lib/authz";

export function RoleForm({ userId, role, name }: { userId: string; role: Role; name: string }) {
  const [state, formAction, pending] = useActionState(changeUserRole, idleActionState);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="userId" value={userId} />
      <label htmlFor={`role-${userId}`} className="sr-only">
        Role of {name}
      </label>
      <select id={`role-${userId}`} name="role" defaultValue={role} className="rounded border border-rule bg-paper-raised px-2 py-1">
        {roles.map((option) => (
          <option key={option} value={option}>
            {option}
          </option>
        ))}
      </select>
      <button type="submit" disabled={pending} className="rounded border border-ink px-2 py-1 text-xs font-semibold hover:bg-ink hover:text-paper-raised">
        Save
      </button>
      <span aria-live="polite" className={`text-xs ${state.status === "ok" ? "text-verdigris-deep" : "text-copper-deep"}`}>
        {state.status !== "idle" ? state.message : null}
      </span>
    </form>
  );
}
