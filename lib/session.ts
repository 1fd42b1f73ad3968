import "server-only";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { getUserById } from "@/db/queries/users";
import { auth } from "@/lib/auth";
import { can, type Access, type Permission } from "@/lib/authz";

/**
 * The signed-in user as the database has them now. The role is read from the row, not the token,
 * so a demoted account loses its rights on the very next request.
 */
export const getCurrentUser = cache(async () => {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  return getUserById({ id });
});

export type CurrentUser = NonNullable<Awaited<ReturnType<typeof getCurrentUser>>>;

/** For pages: anonymous visitors go to sign-in, signed-in users without the permission get a 403. */
export async function requirePagePermission(permission: Permission, returnTo: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  if (!can(user.role, permission)) forbidden();
  return user;
}

export type AccessDecision =
  | { allowed: true; user: CurrentUser | null }
  | { allowed: false; reason: "unauthenticated" | "forbidden" };

/** For actions and route handlers, which answer with a status instead of navigating. */
export async function checkAccess(access: Access): Promise<AccessDecision> {
  if (access === "public") return { allowed: true, user: await getCurrentUser() };
  const user = await getCurrentUser();
  if (!user) return { allowed: false, reason: "unauthenticated" };
  if (!can(user.role, access)) return { allowed: false, reason: "forbidden" };
  return { allowed: true, user };
}
