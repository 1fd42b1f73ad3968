"use server";

import { createHash, randomBytes } from "node:crypto";
import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { z } from "zod";
import { db } from "@/db";
import {
  consumePasswordResetToken,
  getUserByEmail,
  insertPasswordResetToken,
  insertReader,
  updateUserPassword,
} from "@/db/queries/users";
import { signIn, signOut } from "@/lib/auth";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { passwordResetMail, welcomeMail } from "@/lib/mail-templates";
import { deliverMailNow, enqueueMail } from "@/lib/outbox";
import { hashPassword } from "@/lib/passwords";
import { passwordResetRequestSchema, passwordResetSchema, signInSchema, signUpSchema } from "@/lib/validations/account";

const resetLinkMinutes = 30;

// Only same-site paths: an open redirect after sign-in would hand attackers a trusted-looking link.
const callbackUrlField = z
  .string()
  .optional()
  .transform((value) => (value && value.startsWith("/") && !value.startsWith("//") ? value : "/"));

export const signInWithPassword = guardedAction(
  "(auth)/actions.ts#signInWithPassword",
  signInSchema.extend({ callbackUrl: callbackUrlField }),
  async ({ email, password, callbackUrl }) => {
    try {
      await signIn("credentials", { email, password, redirectTo: callbackUrl });
    } catch (error) {
      if (error instanceof AuthError) {
        const throttled = "code" in error && error.code === "throttled";
        return {
          status: "error",
          message: throttled
            ? "Too many failed attempts. Wait 15 minutes, or reset your password."
            : "That e-mail and password do not match an account.",
          values: { email, callbackUrl },
        };
      }
      throw error;
    }
  },
);

export const signUpReader = guardedAction("(auth)/actions.ts#signUpReader", signUpSchema, async ({ name, email, password }) => {
  const passwordHash = await hashPassword(password);
  const queued = await db.transaction(async (tx) => {
    const reader = await insertReader(tx, { name, email, passwordHash });
    if (!reader) return null;
    return enqueueMail(tx, { topic: "account", dedupeKey: `welcome:${reader.id}`, recipientId: reader.id, toAddress: email, ...welcomeMail({ name }) });
  });
  if (!queued) {
    throw new UserFacingError("An account with this e-mail already exists.", 409, {
      email: ["An account with this e-mail already exists. Sign in or reset the password."],
    });
  }
  // The account and its welcome are committed together; a mail outage only delays the welcome, it never fails the sign-up.
  await deliverMailNow([queued.id]);
  await signIn("credentials", { email, password, redirectTo: "/account" });
});

export const requestPasswordReset = guardedAction(
  "(auth)/actions.ts#requestPasswordReset",
  passwordResetRequestSchema,
  async ({ email }) => {
    const user = await getUserByEmail({ email });
    if (user) {
      const token = randomBytes(32).toString("base64url");
      const tokenHash = hashResetToken(token);
      const queued = await db.transaction(async (tx) => {
        await insertPasswordResetToken(tx, { userId: user.id, tokenHash, expiresAt: new Date(Date.now() + resetLinkMinutes * 60_000) });
        return enqueueMail(tx, {
          topic: "account",
          dedupeKey: `password-reset:${tokenHash}`,
          recipientId: user.id,
          toAddress: user.email,
          ...passwordResetMail({ name: user.name, token, validMinutes: resetLinkMinutes }),
        });
      });
      if (queued) await deliverMailNow([queued.id]);
    }
    // The same answer whether or not the account exists, so the form cannot be used to find accounts.
    return { status: "ok", message: "If an account uses that address, a reset link is on its way." };
  },
);

export const resetPassword = guardedAction(
  "(auth)/actions.ts#resetPassword",
  passwordResetSchema,
  async ({ token, password }) => {
    const passwordHash = await hashPassword(password);
    const reset = await db.transaction(async (tx) => {
      const consumed = await consumePasswordResetToken(tx, { tokenHash: hashResetToken(token), now: new Date() });
      if (consumed) await updateUserPassword(tx, { userId: consumed.userId, passwordHash });
      return consumed;
    });
    if (!reset) throw new UserFacingError("This reset link has expired or was already used. Ask for a new one.", 410);
    redirect("/sign-in?reset=done");
  },
);

export const signOutUser = guardedAction("(auth)/actions.ts#signOutUser", z.object({}), async () => {
  await signOut({ redirectTo: "/" });
});

// Stored hashed so a leaked table does not hand out working reset links.
function hashResetToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
