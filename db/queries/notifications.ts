import "server-only";
import { eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { notificationPreferences } from "@/db/schema";
import { notificationTopics, type NotificationTopic } from "@/lib/notification-topics";

const topicColumnKey = {
  submission: "submissions",
  decision: "decisions",
  moderation: "moderation",
  request_update: "requestUpdates",
} as const satisfies Record<NotificationTopic, keyof typeof notificationPreferences.$inferInsert>;

export type NotificationSettings = Record<NotificationTopic, boolean>;

const preferenceColumns = {
  submissions: notificationPreferences.submissions,
  decisions: notificationPreferences.decisions,
  moderation: notificationPreferences.moderation,
  requestUpdates: notificationPreferences.requestUpdates,
  unsubscribeToken: notificationPreferences.unsubscribeToken,
};

type PreferenceRow = Pick<typeof notificationPreferences.$inferSelect, keyof typeof preferenceColumns>;

function settingsOf(row: PreferenceRow | undefined): NotificationSettings {
  return Object.fromEntries(notificationTopics.map((topic) => [topic, row ? row[topicColumnKey[topic]] : true])) as NotificationSettings;
}

function columnValues(settings: Partial<NotificationSettings>) {
  const values: Partial<Record<(typeof topicColumnKey)[NotificationTopic], boolean>> = {};
  for (const topic of notificationTopics) {
    const value = settings[topic];
    if (value !== undefined) values[topicColumnKey[topic]] = value;
  }
  return values;
}

/** The person's settings and unsubscribe token, creating the row (everything on) the first time it is needed. */
export async function ensureNotificationPreferences(tx: Transaction, { userId }: { userId: string }) {
  await tx.insert(notificationPreferences).values({ userId }).onConflictDoNothing();
  const [row] = await tx.select(preferenceColumns).from(notificationPreferences).where(eq(notificationPreferences.userId, userId));
  if (!row) throw new Error(`notification preferences for ${userId} missing after insert`);
  return { settings: settingsOf(row), unsubscribeToken: row.unsubscribeToken };
}

/** Everything is on for someone who never changed a setting. */
export async function getNotificationSettings({ userId }: { userId: string }): Promise<NotificationSettings> {
  const [row] = await db.select(preferenceColumns).from(notificationPreferences).where(eq(notificationPreferences.userId, userId));
  return settingsOf(row);
}

export async function upsertNotificationSettings(
  tx: Transaction,
  { userId, settings }: { userId: string; settings: Partial<NotificationSettings> },
) {
  const values = columnValues(settings);
  if (Object.keys(values).length === 0) return;
  await tx
    .insert(notificationPreferences)
    .values({ userId, ...values })
    .onConflictDoUpdate({ target: notificationPreferences.userId, set: values });
}

/** Switches one topic off for the holder of the token; null when no one holds it. */
export async function unsubscribeByToken({ token, topic }: { token: string; topic: NotificationTopic }) {
  const [row] = await db
    .update(notificationPreferences)
    .set(columnValues({ [topic]: false }))
    .where(eq(notificationPreferences.unsubscribeToken, token))
    .returning({ userId: notificationPreferences.userId });
  return row ?? null;
}
