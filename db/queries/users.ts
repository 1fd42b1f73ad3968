import "server-only";
import { and, asc, count, eq, gt, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { passwordResetTokens, reports, signInAttempts, testRuns, users, type UserRole } from "@/db/schema";

/** Columns safe to hand to pages: never the password hash. */
const publicUserColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  avatarKey: users.avatarKey,
};

export async function getUserCredentials({ email }: { email: string }) {
  const [row] = await db
    .select({ ...publicUserColumns, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  return row ?? null;
}

export async function getUserById({ id }: { id: string }) {
  const [row] = await db.select(publicUserColumns).from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}

export async function getUserByEmail({ email }: { email: string }) {
  const [row] = await db.select(publicUserColumns).from(users).where(eq(users.email, email)).limit(1);
  return row ?? null;
}

export async function insertReader(
  tx: Transaction,
  { name, email, passwordHash }: { name: string; email: string; passwordHash: string },
) {
  const [row] = await tx
    .insert(users)
    .values({ name, email, passwordHash, role: "reader" })
    .onConflictDoNothing({ target: users.email })
    .returning(publicUserColumns);
  return row ?? null;
}

export async function listAccounts() {
  return db.select({ ...publicUserColumns, createdAt: users.createdAt }).from(users).orderBy(asc(users.name));
}

/** Returns the role the account had before, for the audit log; null when the account does not exist. */
export async function updateUserRole(tx: Transaction, { userId, role }: { userId: string; role: UserRole }) {
  const [previous] = await tx.select({ role: users.role }).from(users).where(eq(users.id, userId)).for("update");
  if (!previous) return null;
  await tx.update(users).set({ role }).where(eq(users.id, userId));
  return { id: userId, previousRole: previous.role };
}

/** Serialises role changes so concurrent demotions cannot together remove the last admin. */
export async function lockRoleChanges(tx: Transaction) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('benchplate:user-roles'))`);
}

export async function countAdmins(tx: Transaction) {
  const [row] = await tx.select({ value: count() }).from(users).where(eq(users.role, "admin"));
  return row?.value ?? 0;
}

export async function updateUserAvatar(tx: Transaction, { userId, avatarKey }: { userId: string; avatarKey: string | null }) {
  const [previous] = await tx.select({ avatarKey: users.avatarKey }).from(users).where(eq(users.id, userId)).for("update");
  await tx.update(users).set({ avatarKey }).where(eq(users.id, userId));
  return previous?.avatarKey ?? null;
}

export async function updateUserPassword(tx: Transaction, { userId, passwordHash }: { userId: string; passwordHash: string }) {
  await tx.update(users).set({ passwordHash }).where(eq(users.id, userId));
}

export async function insertPasswordResetToken(
  tx: Transaction,
  { userId, tokenHash, expiresAt }: { userId: string; tokenHash: string; expiresAt: Date },
) {
  await tx.insert(passwordResetTokens).values({ userId, tokenHash, expiresAt });
}

/** Marks the token used in the same statement that finds it, so two concurrent uses cannot both succeed. */
export async function consumePasswordResetToken(tx: Transaction, { tokenHash, now }: { tokenHash: string; now: Date }) {
  const [row] = await tx
    .update(passwordResetTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(passwordResetTokens.tokenHash, tokenHash),
        isNull(passwordResetTokens.usedAt),
        gt(passwordResetTokens.expiresAt, now),
      ),
    )
    .returning({ userId: passwordResetTokens.userId });
  return row ?? null;
}

export async function insertSignInAttempt({
  email,
  clientAddress,
  succeeded,
}: {
  email: string;
  clientAddress: string;
  succeeded: boolean;
}) {
  await db.insert(signInAttempts).values({ email, clientAddress, succeeded });
}

export async function countRecentSignInFailures({
  email,
  clientAddress,
  since,
}: {
  email: string;
  clientAddress: string;
  since: Date;
}) {
  const failuresWhere = (column: typeof signInAttempts.email | typeof signInAttempts.clientAddress, value: string) =>
    and(eq(column, value), eq(signInAttempts.succeeded, false), gt(signInAttempts.createdAt, since));
  const [[byAccount], [byAddress]] = await Promise.all([
    db.select({ value: count() }).from(signInAttempts).where(failuresWhere(signInAttempts.email, email)),
    db.select({ value: count() }).from(signInAttempts).where(failuresWhere(signInAttempts.clientAddress, clientAddress)),
  ]);
  return { byAccount: byAccount?.value ?? 0, byAddress: byAddress?.value ?? 0 };
}

/** Bench runs and reports keep their author: an account that wrote any cannot simply disappear. */
export async function countAuthoredWork(tx: Transaction, { userId }: { userId: string }) {
  const [[runs], [authored]] = await Promise.all([
    tx.select({ value: count() }).from(testRuns).where(eq(testRuns.reviewerId, userId)),
    tx.select({ value: count() }).from(reports).where(eq(reports.authorId, userId)),
  ]);
  return { runs: runs?.value ?? 0, reports: authored?.value ?? 0 };
}

/**
 * Deletes the account row. The schema does the rest: comments, requests and log entries keep their rows with the
 * person's reference set to null, memberships and reset tokens go with it. Returns the avatar's object key for removal.
 */
export async function deleteUser(tx: Transaction, { userId }: { userId: string }) {
  const [row] = await tx.delete(users).where(eq(users.id, userId)).returning({ avatarKey: users.avatarKey });
  return row ?? null;
}
