"use client";

import { deleteAccount } from "@/app/(account)/actions";
import { FormStatus, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { accountDeletionSchema } from "@/lib/validations/account";

export function DeleteAccountForm({ email }: { email: string }) {
  const [state, formAction, pending] = useCheckedAction(deleteAccount, accountDeletionSchema);
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <TextField
        label="Type your e-mail address to confirm"
        name="confirmEmail"
        type="email"
        autoComplete="off"
        errors={state.fieldErrors}
        hint={`This account uses ${email}.`}
      />
      <FormStatus status={state.status} message={state.message} />
      <div>
        <button
          type="submit"
          disabled={pending}
          className="rounded border-2 border-copper-deep px-4 py-2 font-semibold text-copper-deep hover:bg-copper-deep hover:text-paper-raised disabled:opacity-60"
        >
          {pending ? "Deleting…" : "Delete my account"}
        </button>
      </div>
    </form>
  );
}
