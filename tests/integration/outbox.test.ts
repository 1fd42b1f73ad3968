import { randomUUID } from "node:crypto";
import { createServer } from "node:net";
import { eq, inArray } from "drizzle-orm";
import nodemailer from "nodemailer";
import { describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { outboxMessages } from "@/db/schema";
import { upsertNotificationSettings } from "@/db/queries/notifications";
import { deliverPendingMail, enqueueMail, maxDeliveryAttempts, type MailToQueue } from "@/lib/outbox";
import { createAccount } from "../support/factories";
import { listMessages, waitForMessage } from "../support/mail";

vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));

function accountMail(overrides: Partial<MailToQueue> = {}): MailToQueue {
  const to = `outbox-${randomUUID()}@tests.benchplate.test`;
  return { topic: "account", dedupeKey: `test:${randomUUID()}`, toAddress: to, subject: `Bench note ${randomUUID()}`, text: "Body", ...overrides } as MailToQueue;
}

async function queue(mail: MailToQueue) {
  return db.transaction((tx) => enqueueMail(tx, mail));
}

async function storedMessages(ids: string[]) {
  return db
    .select({ id: outboxMessages.id, status: outboxMessages.status, attempts: outboxMessages.attempts, lastError: outboxMessages.lastError, text: outboxMessages.text })
    .from(outboxMessages)
    .where(inArray(outboxMessages.id, ids));
}

/** A port nothing listens on: what the app sees while the mail server is down. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe("the outbox", () => {
  it("queues one message per event, however often the event is reported", async () => {
    const mail = accountMail();
    const first = await queue(mail);
    const second = await queue(mail);
    await db.transaction(async (tx) => {
      await enqueueMail(tx, mail);
      await enqueueMail(tx, mail);
    });
    expect(first).not.toBeNull();
    expect(second).toBeNull();
    const rows = await db.select({ id: outboxMessages.id }).from(outboxMessages).where(eq(outboxMessages.dedupeKey, mail.dedupeKey));
    expect(rows).toHaveLength(1);
  });

  it("writes nothing when the caller's transaction rolls back", async () => {
    const mail = accountMail();
    await expect(
      db.transaction(async (tx) => {
        await enqueueMail(tx, mail);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, mail.dedupeKey))).toHaveLength(0);
  });

  it("keeps messages pending while the mail server is down, then sends each exactly once", async () => {
    const mails = [accountMail(), accountMail(), accountMail()];
    const ids = [];
    for (const mail of mails) ids.push((await queue(mail))!.id);

    const down = nodemailer.createTransport({ host: "127.0.0.1", port: await closedPort(), ignoreTLS: true });
    const whileDown = await deliverPendingMail({ onlyIds: ids, send: (mail) => down.sendMail({ from: "desk@benchplate.test", ...mail }) });
    expect(whileDown).toEqual({ sent: 0, retrying: 3, failed: 0 });
    for (const row of await storedMessages(ids)) {
      expect(row).toMatchObject({ status: "pending", attempts: 1 });
      expect(row.lastError).toMatch(/ECONNREFUSED/);
    }

    // Backing off: a run straight after the failure leaves them alone.
    expect(await deliverPendingMail({ onlyIds: ids })).toEqual({ sent: 0, retrying: 0, failed: 0 });

    const later = new Date(Date.now() + 60_000);
    expect(await deliverPendingMail({ onlyIds: ids, now: later })).toEqual({ sent: 3, retrying: 0, failed: 0 });
    expect(await deliverPendingMail({ onlyIds: ids, now: later })).toEqual({ sent: 0, retrying: 0, failed: 0 });
    for (const mail of mails) {
      await waitForMessage(mail.toAddress, mail.subject);
      expect(await listMessages(mail.toAddress)).toHaveLength(1);
    }
    expect((await storedMessages(ids)).map((row) => row.status)).toEqual(["sent", "sent", "sent"]);
  });

  it("never sends a message twice when two senders run at once", async () => {
    const mails = Array.from({ length: 6 }, () => accountMail());
    const ids = [];
    for (const mail of mails) ids.push((await queue(mail))!.id);
    const slowSend = async (mail: { to: string | string[]; subject: string; text: string }) => {
      await new Promise((resolve) => setTimeout(resolve, 20));
      const { sendMail } = await import("@/lib/mail");
      return sendMail(mail);
    };
    const [a, b] = await Promise.all([deliverPendingMail({ onlyIds: ids, send: slowSend }), deliverPendingMail({ onlyIds: ids, send: slowSend })]);
    expect(a.sent + b.sent).toBe(6);
    for (const mail of mails) {
      await waitForMessage(mail.toAddress, mail.subject);
      expect(await listMessages(mail.toAddress)).toHaveLength(1);
    }
  });

  it("gives up after the last attempt and marks the message failed", async () => {
    const { id } = (await queue(accountMail()))!;
    await db.update(outboxMessages).set({ attempts: maxDeliveryAttempts - 1 }).where(eq(outboxMessages.id, id));
    const tally = await deliverPendingMail({
      onlyIds: [id],
      now: new Date(Date.now() + 2 * 3600_000),
      send: async () => {
        throw new Error("550 mailbox unavailable");
      },
    });
    expect(tally).toEqual({ sent: 0, retrying: 0, failed: 1 });
    expect(await storedMessages([id])).toEqual([expect.objectContaining({ status: "failed", attempts: maxDeliveryAttempts, lastError: "550 mailbox unavailable" })]);
  });

  it("forgets the text of account mail once it is sent, since it may hold a one-time link", async () => {
    const { id } = (await queue(accountMail({ text: "Your reset link: http://localhost/reset-password/secret" })))!;
    await deliverPendingMail({ onlyIds: [id] });
    expect(await storedMessages([id])).toEqual([expect.objectContaining({ status: "sent", text: "" })]);
  });
});

describe("notifications", () => {
  it("end with an unsubscribe link for their topic, and account mail does not", async () => {
    const reviewer = await createAccount({ role: "reviewer" });
    const notification = await queue({
      topic: "decision",
      recipientId: reviewer.id,
      dedupeKey: `test:${randomUUID()}`,
      toAddress: reviewer.email,
      subject: "Decision",
      text: "Approved.",
    });
    const [stored] = await storedMessages([notification!.id]);
    expect(stored?.status).toBe("pending");
    expect(stored?.text).toMatch(/\/unsubscribe\/[A-Za-z0-9_-]{32}\?topic=decision/);

    const account = await queue(accountMail({ recipientId: reviewer.id }));
    const [plain] = await storedMessages([account!.id]);
    expect(plain?.text).not.toContain("/unsubscribe/");
  });

  it("are stored as suppressed, never sent, when the recipient switched the topic off", async () => {
    const reader = await createAccount({ role: "reader" });
    await db.transaction((tx) => upsertNotificationSettings(tx, { userId: reader.id, settings: { request_update: false } }));
    const queued = await queue({
      topic: "request_update",
      recipientId: reader.id,
      dedupeKey: `test:${randomUUID()}`,
      toAddress: reader.email,
      subject: "Planned",
      text: "Planned.",
    });
    expect(queued?.status).toBe("suppressed");
    expect(await deliverPendingMail({ onlyIds: [queued!.id] })).toEqual({ sent: 0, retrying: 0, failed: 0 });
    expect(await listMessages(reader.email)).toHaveLength(0);
  });
});
