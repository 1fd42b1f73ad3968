import "server-only";
import { and, asc, eq, inArray, or, sql, type SQL } from "drizzle-orm";
import type { Transaction } from "@/db";
import { outboxMessages, type NewOutboxMessage } from "@/db/schema";

/** Inserts a message unless one with the same dedupe key exists; null when it already did. */
export async function insertOutboxMessage(tx: Transaction, message: NewOutboxMessage) {
  const [row] = await tx
    .insert(outboxMessages)
    .values(message)
    .onConflictDoNothing({ target: outboxMessages.dedupeKey })
    .returning({ id: outboxMessages.id, status: outboxMessages.status });
  return row ?? null;
}

/**
 * Locks the oldest pending message that is due, skipping any another sender holds, so two senders never take the
 * same one. A failed message waits 30 s, then 60 s, 120 s … up to an hour, counted from its last attempt (updated_at
 * changes only when an attempt is recorded).
 */
export async function claimDueOutboxMessage(tx: Transaction, { now, onlyIds }: { now: Date; onlyIds?: readonly string[] }) {
  const due = or(
    eq(outboxMessages.attempts, 0),
    sql`${outboxMessages.updatedAt} <= ${now.toISOString()}::timestamptz - make_interval(secs => least(30 * power(2, ${outboxMessages.attempts} - 1), 3600))`,
  );
  const filters: (SQL | undefined)[] = [eq(outboxMessages.status, "pending"), due];
  if (onlyIds) filters.push(onlyIds.length ? inArray(outboxMessages.id, [...onlyIds]) : sql`false`);
  const [row] = await tx
    .select({
      id: outboxMessages.id,
      topic: outboxMessages.topic,
      toAddress: outboxMessages.toAddress,
      subject: outboxMessages.subject,
      text: outboxMessages.text,
      attempts: outboxMessages.attempts,
    })
    .from(outboxMessages)
    .where(and(...filters))
    .orderBy(asc(outboxMessages.createdAt))
    .limit(1)
    .for("update", { skipLocked: true });
  return row ?? null;
}

export async function markOutboxMessageSent(tx: Transaction, { id, sentAt, keepText }: { id: string; sentAt: Date; keepText: boolean }) {
  await tx
    .update(outboxMessages)
    .set({ status: "sent", sentAt, attempts: sql`${outboxMessages.attempts} + 1`, lastError: null, ...(keepText ? {} : { text: "" }) })
    .where(eq(outboxMessages.id, id));
}

export async function recordOutboxFailure(tx: Transaction, { id, error, giveUp }: { id: string; error: string; giveUp: boolean }) {
  await tx
    .update(outboxMessages)
    .set({ attempts: sql`${outboxMessages.attempts} + 1`, lastError: error.slice(0, 500), ...(giveUp ? { status: "failed" as const } : {}) })
    .where(eq(outboxMessages.id, id));
}

/** Mail not yet sent to someone who deleted their account is never sent. */
export async function suppressPendingMailTo(tx: Transaction, { recipientId }: { recipientId: string }) {
  await tx
    .update(outboxMessages)
    .set({ status: "suppressed" })
    .where(and(eq(outboxMessages.recipientId, recipientId), eq(outboxMessages.status, "pending")));
}
