import "server-only";
import { db, type Transaction } from "@/db";
import { ensureNotificationPreferences } from "@/db/queries/notifications";
import { claimDueOutboxMessage, insertOutboxMessage, markOutboxMessageSent, recordOutboxFailure } from "@/db/queries/outbox";
import { serverEnv } from "@/lib/env";
import { requestMailDelivery } from "@/lib/jobs";
import { sendMail, type OutgoingMail } from "@/lib/mail";
import { notificationTopicDetails, type NotificationTopic } from "@/lib/notification-topics";

export type MailToQueue = { dedupeKey: string; toAddress: string; subject: string; text: string } & (
  | { topic: "account"; recipientId?: string | null }
  | { topic: NotificationTopic; recipientId: string }
);

/** After this many failed attempts a message is marked failed; with the backoff that spans about five hours of outage. */
export const maxDeliveryAttempts = 12;

/**
 * Queues an e-mail in the caller's transaction, so it exists exactly when the change it reports was committed. The
 * dedupe key names the event and recipient: the same event queued twice yields one message. Notifications honour the
 * recipient's settings (a switched-off topic is stored as suppressed, so the log still shows it) and end with an
 * unsubscribe link. Returns null when the message already existed.
 */
export async function enqueueMail(tx: Transaction, mail: MailToQueue) {
  if (mail.topic === "account") {
    return insertOutboxMessage(tx, { ...mail, recipientId: mail.recipientId ?? null });
  }
  const { settings, unsubscribeToken } = await ensureNotificationPreferences(tx, { userId: mail.recipientId });
  return insertOutboxMessage(tx, {
    ...mail,
    text: `${mail.text}\n\n${unsubscribeFooter(mail.topic, unsubscribeToken)}`,
    status: settings[mail.topic] ? "pending" : "suppressed",
  });
}

function unsubscribeFooter(topic: NotificationTopic, token: string): string {
  const origin = serverEnv().APP_ORIGIN;
  return [
    "--",
    `You receive this because “${notificationTopicDetails[topic].label}” is switched on in your Benchplate e-mail settings.`,
    `Stop these e-mails: ${origin}/unsubscribe/${token}?topic=${topic}`,
    `All e-mail settings: ${origin}/account#notifications`,
  ].join("\n");
}

export type DeliveryTally = { sent: number; retrying: number; failed: number };

/**
 * Sends what is due, one message per transaction: the row stays locked (FOR UPDATE SKIP LOCKED) from claim to
 * "sent", so a second sender skips it and no message goes out twice. A failure records the attempt and leaves the
 * message pending for a later run. If the process dies after the mail server accepted a message but before the commit,
 * that one message is sent again on the next run: a mail server cannot take part in our transaction.
 */
export async function deliverPendingMail({
  send = sendMail,
  now = new Date(),
  onlyIds,
  limit = 200,
}: { send?: (mail: OutgoingMail) => Promise<unknown>; now?: Date; onlyIds?: readonly string[]; limit?: number } = {}) {
  const tally: DeliveryTally = { sent: 0, retrying: 0, failed: 0 };
  for (let handled = 0; handled < limit; handled++) {
    const outcome = await db.transaction(async (tx) => {
      const message = await claimDueOutboxMessage(tx, { now, onlyIds });
      if (!message) return null;
      try {
        await send({ to: message.toAddress, subject: message.subject, text: message.text });
      } catch (error) {
        const giveUp = message.attempts + 1 >= maxDeliveryAttempts;
        await recordOutboxFailure(tx, { id: message.id, error: error instanceof Error ? error.message : String(error), giveUp });
        return giveUp ? "failed" : "retrying";
      }
      // Account mail can carry a one-time link; its text is not kept once it is delivered.
      await markOutboxMessageSent(tx, { id: message.id, sentAt: new Date(), keepText: message.topic !== "account" });
      return "sent";
    });
    if (!outcome) break;
    tally[outcome]++;
  }
  return tally;
}

/**
 * For mail a person is waiting for (a welcome, a reset link): tries the given messages at once, after the transaction
 * that queued them committed. Whatever fails stays pending for the worker; nothing here reaches the caller.
 */
export async function deliverMailNow(ids: readonly string[]): Promise<void> {
  if (ids.length === 0) return;
  try {
    await deliverPendingMail({ onlyIds: ids });
  } catch (error) {
    console.error("outbox: immediate delivery failed; the worker will retry", error);
  }
}

/**
 * Asks the worker to send what was just queued. Call after the commit. A lost wake-up costs only time: the worker also
 * sweeps the outbox every minute.
 */
export async function wakeMailSender(): Promise<void> {
  try {
    await requestMailDelivery();
  } catch (error) {
    console.error("outbox: could not wake the mail sender; the minutely sweep will send it", error);
  }
}
