import "server-only";
import { and, count, desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type Transaction } from "@/db";
import { auditLog, users } from "@/db/schema";

export async function insertAuditEntry(
  tx: Transaction,
  entry: { actorId: string | null; action: string; subjectType: string; subjectId: string | null; details: Record<string, unknown> },
) {
  const [row] = await tx.insert(auditLog).values(entry).returning({ id: auditLog.id });
  if (!row) throw new Error("audit entry not inserted");
  return row;
}

const subjectAccount = alias(users, "subject_account");

/** Newest first. The actor's name only: the log is read by editors and admins, who need no more to follow it. */
export async function listAuditEntries({ action, page, perPage }: { action?: string; page: number; perPage: number }) {
  const where = action ? eq(auditLog.action, action) : undefined;
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: auditLog.id,
        createdAt: auditLog.createdAt,
        action: auditLog.action,
        subjectType: auditLog.subjectType,
        subjectId: auditLog.subjectId,
        details: auditLog.details,
        actorName: users.name,
        actorRole: users.role,
        subjectAccountName: subjectAccount.name,
      })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .leftJoin(subjectAccount, and(eq(auditLog.subjectType, "user"), eq(subjectAccount.id, auditLog.subjectId)))
      .where(where)
      .orderBy(desc(auditLog.createdAt), desc(auditLog.id))
      .limit(perPage)
      .offset((page - 1) * perPage),
    db.select({ value: count() }).from(auditLog).where(where),
  ]);
  return { entries: rows, total: total?.value ?? 0 };
}
