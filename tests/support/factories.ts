import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { Role } from "@/lib/authz";
import { hashPassword } from "@/lib/passwords";

export const factoryPassword = "factory-password-1";

let cachedHash: Promise<string> | undefined;

/** A throwaway account with a unique address, so tests never depend on or disturb the demo people. */
export async function createAccount({ role, name = `Test ${role}` }: { role: Role; name?: string }) {
  cachedHash ??= hashPassword(factoryPassword);
  const email = `${role}-${randomUUID()}@tests.benchplate.test`;
  const [row] = await db
    .insert(users)
    .values({ email, name, role, passwordHash: await cachedHash })
    .returning({ id: users.id, email: users.email, name: users.name, role: users.role });
  if (!row) throw new Error("account not created");
  return row;
}
