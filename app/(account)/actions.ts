"use server";

import { randomUUID } from "node:crypto";
import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { withdrawAllVotes } from "@/db/queries/measurement-requests";
import { upsertNotificationSettings } from "@/db/queries/notifications";
import { suppressPendingMailTo } from "@/db/queries/outbox";
import { countAdmins, countAuthoredWork, deleteUser, lockRoleChanges, updateUserAvatar } from "@/db/queries/users";
import { recordAudit } from "@/lib/audit";
import { signOut } from "@/lib/auth";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { reencodeSquareImage } from "@/lib/images";
import { topicsForRole } from "@/lib/notification-topics";
import { deleteObject, putObject } from "@/lib/object-storage";
import { accountDeletionSchema, avatarLimits } from "@/lib/validations/account";
import { avatarUploadSchema } from "@/lib/validations/avatar";
import { notificationSettingsSchema } from "@/lib/validations/notifications";

export const updateAvatar = guardedAction("(account)/actions.ts#updateAvatar", avatarUploadSchema, async ({ avatar }, user) => {
  const image = await reencodeSquareImage(Buffer.from(await avatar.arrayBuffer()), avatarLimits.edgePixels);
  const avatarKey = `avatars/${user.id}/${randomUUID()}.webp`;
  await putObject(avatarKey, image, "image/webp");
  let previousKey: string | null;
  try {
    previousKey = await db.transaction((tx) => updateUserAvatar(tx, { userId: user.id, avatarKey }));
  } catch (error) {
    // The row did not change, so the new object would be an orphan.
    await deleteObject(avatarKey);
    throw error;
  }
  if (previousKey) await deleteObject(previousKey).catch(() => undefined);
  revalidatePath("/account");
  return { status: "ok", message: "Picture updated." };
});

export const updateNotificationPreferences = guardedAction(
  "(account)/actions.ts#updateNotificationPreferences",
  notificationSettingsSchema,
  async (settings, user) => {
    // Only the topics this role is offered: a box the form never showed must not switch anything off.
    const offered = Object.fromEntries(topicsForRole(user.role).map((topic) => [topic, settings[topic]]));
    await db.transaction((tx) => upsertNotificationSettings(tx, { userId: user.id, settings: offered }));
    revalidatePath("/account");
    return { status: "ok", message: "E-mail settings saved." };
  },
);

export const deleteAccount = guardedAction("(account)/actions.ts#deleteAccount", accountDeletionSchema, async ({ confirmEmail }, user) => {
  if (confirmEmail !== user.email) {
    throw new UserFacingError("The address does not match.", 400, { confirmEmail: ["Type this account's e-mail address exactly."] });
  }
  const deleted = await db.transaction(async (tx) => {
    // Taken like a role change, so two admins deleting themselves at once cannot leave Benchplate without one.
    await lockRoleChanges(tx);
    const authored = await countAuthoredWork(tx, { userId: user.id });
    if (authored.runs > 0 || authored.reports > 0) {
      throw new UserFacingError(
        "Your bench runs and reports stay on Benchplate with your name. Ask an editor to hand them to another reviewer, then delete the account.",
        409,
      );
    }
    const votesWithdrawn = await withdrawAllVotes(tx, { userId: user.id });
    await suppressPendingMailTo(tx, { recipientId: user.id });
    // No name or address in the entry: the account is gone, and so is what identified the person.
    await recordAudit(tx, { actorId: user.id, action: "account.deleted", subjectType: "user", subjectId: user.id, details: { role: user.role, votesWithdrawn } });
    const row = await deleteUser(tx, { userId: user.id });
    if ((await countAdmins(tx)) === 0) {
      throw new UserFacingError("Benchplate needs at least one admin: make another account admin before deleting yours.", 409);
    }
    return row;
  });
  if (deleted?.avatarKey) await deleteObject(deleted.avatarKey).catch(() => undefined);
  await signOut({ redirectTo: "/account-deleted" });
});
