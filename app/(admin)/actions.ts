"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { countAdmins, lockRoleChanges, updateUserRole } from "@/db/queries/users";
import { recordAudit } from "@/lib/audit";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { roleChangeSchema } from "@/lib/validations/account";

export const changeUserRole = guardedAction("(admin)/actions.ts#changeUserRole", roleChangeSchema, async ({ userId, role }, admin) => {
  await db.transaction(async (tx) => {
    await lockRoleChanges(tx);
    const changed = await updateUserRole(tx, { userId, role });
    if (!changed) throw new UserFacingError("That account no longer exists.", 404);
    if ((await countAdmins(tx)) === 0) throw new UserFacingError("Benchplate needs at least one admin.", 409);
    if (changed.previousRole !== role) {
      await recordAudit(tx, { actorId: admin.id, action: "user.role_changed", subjectType: "user", subjectId: userId, details: { from: changed.previousRole, to: role } });
    }
  });
  revalidatePath("/admin");
  return { status: "ok", message: `Role changed to ${role}.` };
});
