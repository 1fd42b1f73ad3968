"use server";

import { randomUUID } from "node:crypto";
import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { updateUserAvatar } from "@/db/queries/users";
import { guardedAction } from "@/lib/guarded-action";
import { reencodeSquareImage } from "@/lib/images";
import { deleteObject, putObject } from "@/lib/object-storage";
import { avatarLimits } from "@/lib/validations/account";
import { avatarUploadSchema } from "@/lib/validations/avatar";

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
