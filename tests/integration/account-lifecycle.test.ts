import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { changeUserRole } from "@/app/(admin)/actions";
import { deleteAccount, updateNotificationPreferences } from "@/app/(account)/actions";
import UnsubscribePage from "@/app/(public)/unsubscribe/[token]/page";
import { db } from "@/db";
import { ensureNotificationPreferences, getNotificationSettings } from "@/db/queries/notifications";
import { auditLog, comments, measurementRequests, outboxMessages, reports, requestVotes, users } from "@/db/schema";
import { idleActionState } from "@/lib/action-state";
import { enqueueMail } from "@/lib/outbox";
import { createAccount } from "../support/factories";
import { actAs, authMock } from "../support/session-mock";
import { form } from "../support/actions";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));


async function auditEntriesAbout(subjectId: string) {
  return db.select({ action: auditLog.action, actorId: auditLog.actorId, details: auditLog.details }).from(auditLog).where(eq(auditLog.subjectId, subjectId));
}

afterAll(() => actAs(null));

describe("e-mail settings", () => {
  it("switch topics off and on, and only the topics the role is offered", async () => {
    const reader = await createAccount({ role: "reader" });
    actAs(reader);
    // A reader is offered request updates only; a crafted form cannot touch the editors' topics.
    expect(await updateNotificationPreferences(idleActionState, form({ submission: "on" }))).toMatchObject({ status: "ok" });
    expect(await getNotificationSettings({ userId: reader.id })).toEqual({ submission: true, decision: true, moderation: true, request_update: false });
    await updateNotificationPreferences(idleActionState, form({ request_update: "on" }));
    expect((await getNotificationSettings({ userId: reader.id })).request_update).toBe(true);
  });

  it("an editor may switch the moderation mail off", async () => {
    const editor = await createAccount({ role: "editor" });
    actAs(editor);
    await updateNotificationPreferences(idleActionState, form({ submission: "on", decision: "on", request_update: "on" }));
    expect(await getNotificationSettings({ userId: editor.id })).toEqual({ submission: true, decision: true, moderation: false, request_update: true });
  });
});

describe("the unsubscribe link", () => {
  async function visit(token: string, topic: string) {
    await UnsubscribePage({ params: Promise.resolve({ token }), searchParams: Promise.resolve({ topic }) } as never);
  }

  it("switches its topic off without signing in, and only that topic", async () => {
    const reviewer = await createAccount({ role: "reviewer" });
    actAs(null);
    const { unsubscribeToken } = await db.transaction((tx) => ensureNotificationPreferences(tx, { userId: reviewer.id }));
    await visit(unsubscribeToken, "decision");
    await visit(unsubscribeToken, "decision");
    expect(await getNotificationSettings({ userId: reviewer.id })).toEqual({ submission: true, decision: false, moderation: true, request_update: true });

    const queued = await db.transaction((tx) =>
      enqueueMail(tx, { topic: "decision", recipientId: reviewer.id, toAddress: reviewer.email, dedupeKey: `test:${randomUUID()}`, subject: "Approved", text: "Approved." }),
    );
    expect(queued?.status).toBe("suppressed");
  });

  it("changes nothing for an unknown token or topic", async () => {
    const reader = await createAccount({ role: "reader" });
    const { unsubscribeToken } = await db.transaction((tx) => ensureNotificationPreferences(tx, { userId: reader.id }));
    await visit("A".repeat(32), "request_update");
    await visit(unsubscribeToken, "everything");
    expect((await getNotificationSettings({ userId: reader.id })).request_update).toBe(true);
  });
});

describe("deleting an account", () => {
  async function readerWithHistory() {
    const reader = await createAccount({ role: "reader" });
    const reviewer = await createAccount({ role: "reviewer" });
    const [report] = await db
      .insert(reports)
      .values({ slug: `deletion-${randomUUID()}`, title: "Aeris 720 on the bench", authorId: reviewer.id, status: "published" })
      .returning({ id: reports.id });
    const [comment] = await db
      .insert(comments)
      .values({ reportId: report!.id, authorId: reader.id, body: "Which clamp did you use?", status: "approved" })
      .returning({ id: comments.id });
    const [own] = await db
      .insert(measurementRequests)
      .values({ proposedToolName: "Some station", whatToMeasure: "Power at full heat", why: "Curious", requesterId: reader.id, voteCount: 1 })
      .returning({ id: measurementRequests.id });
    const [other] = await db
      .insert(measurementRequests)
      .values({ proposedToolName: "Other station", whatToMeasure: "Airflow at 6 mm", why: "Curious", requesterId: reviewer.id, voteCount: 2 })
      .returning({ id: measurementRequests.id });
    await db.insert(requestVotes).values([
      { requestId: own!.id, userId: reader.id },
      { requestId: other!.id, userId: reader.id },
      { requestId: other!.id, userId: reviewer.id },
    ]);
    const pending = await db.transaction((tx) =>
      enqueueMail(tx, { topic: "request_update", recipientId: reader.id, toAddress: reader.email, dedupeKey: `test:${randomUUID()}`, subject: "Planned", text: "Planned." }),
    );
    return { reader, commentId: comment!.id, ownRequestId: own!.id, otherRequestId: other!.id, pendingMailId: pending!.id };
  }

  it("asks for the account's own address first", async () => {
    const reader = await createAccount({ role: "reader" });
    actAs(reader);
    const result = await deleteAccount(idleActionState, form({ confirmEmail: "someone.else@tests.benchplate.test" }));
    expect(result.fieldErrors?.confirmEmail?.[0]).toMatch(/Type this account's e-mail address exactly/);
    expect(await db.select({ id: users.id }).from(users).where(eq(users.id, reader.id))).toHaveLength(1);
  });

  it("removes the person but keeps their comments anonymised, their requests, and the vote counts true", async () => {
    const { reader, commentId, ownRequestId, otherRequestId, pendingMailId } = await readerWithHistory();
    actAs(reader);
    authMock.signOut.mockClear();
    const result = await deleteAccount(idleActionState, form({ confirmEmail: reader.email.toUpperCase() }));
    expect(result.status).toBe("ok");
    expect(authMock.signOut).toHaveBeenCalledWith({ redirectTo: "/account-deleted" });

    expect(await db.select().from(users).where(eq(users.id, reader.id))).toHaveLength(0);
    expect(await db.select({ authorId: comments.authorId, body: comments.body }).from(comments).where(eq(comments.id, commentId))).toEqual([
      { authorId: null, body: "Which clamp did you use?" },
    ]);
    const [own] = await db.select().from(measurementRequests).where(eq(measurementRequests.id, ownRequestId));
    expect(own).toMatchObject({ requesterId: null, voteCount: 0 });
    const [other] = await db.select().from(measurementRequests).where(eq(measurementRequests.id, otherRequestId));
    expect(other?.voteCount).toBe(1);
    expect(await db.select().from(requestVotes).where(eq(requestVotes.userId, reader.id))).toHaveLength(0);
    const [mail] = await db.select({ status: outboxMessages.status }).from(outboxMessages).where(eq(outboxMessages.id, pendingMailId));
    expect(mail?.status).toBe("suppressed");

    // The session dies with the row: the same token is now anonymous.
    expect((await updateNotificationPreferences(idleActionState, form({}))).status).toBe("unauthenticated");
    expect(await auditEntriesAbout(reader.id)).toEqual([{ action: "account.deleted", actorId: null, details: { role: "reader", votesWithdrawn: 2 } }]);
  });

  it("refuses a reviewer whose runs or reports carry their name", async () => {
    const reviewer = await createAccount({ role: "reviewer" });
    await db.insert(reports).values({ slug: `kept-${randomUUID()}`, title: "Kept", authorId: reviewer.id });
    actAs(reviewer);
    const result = await deleteAccount(idleActionState, form({ confirmEmail: reviewer.email }));
    expect(result).toMatchObject({ status: "error", message: expect.stringMatching(/Ask an editor to hand them to another reviewer/) });
    expect(await db.select({ id: users.id }).from(users).where(eq(users.id, reviewer.id))).toHaveLength(1);
  });

  it("refuses the last admin and leaves no audit entry behind", async () => {
    const admin = await createAccount({ role: "admin" });
    const others = await db.select({ id: users.id }).from(users).where(and(eq(users.role, "admin")));
    const demoted = others.filter((other) => other.id !== admin.id);
    for (const other of demoted) await db.update(users).set({ role: "editor" }).where(eq(users.id, other.id));
    try {
      actAs(admin);
      const result = await deleteAccount(idleActionState, form({ confirmEmail: admin.email }));
      expect(result).toMatchObject({ status: "error", message: expect.stringMatching(/needs at least one admin/) });
      expect(await db.select({ id: users.id }).from(users).where(eq(users.id, admin.id))).toHaveLength(1);
      expect(await auditEntriesAbout(admin.id)).toEqual([]);
    } finally {
      for (const other of demoted) await db.update(users).set({ role: "admin" }).where(eq(users.id, other.id));
    }
  });
});

describe("the audit log", () => {
  it("records a role change in the same transaction, and nothing when the change is refused", async () => {
    const admin = await createAccount({ role: "admin" });
    const reader = await createAccount({ role: "reader" });
    actAs(admin);
    await changeUserRole(idleActionState, form({ userId: reader.id, role: "reviewer" }));
    expect(await auditEntriesAbout(reader.id)).toEqual([{ action: "user.role_changed", actorId: admin.id, details: { from: "reader", to: "reviewer" } }]);

    const others = await db.select({ id: users.id }).from(users).where(eq(users.role, "admin"));
    const demoted = others.filter((other) => other.id !== admin.id);
    for (const other of demoted) await db.update(users).set({ role: "editor" }).where(eq(users.id, other.id));
    try {
      const refused = await changeUserRole(idleActionState, form({ userId: admin.id, role: "reader" }));
      expect(refused.message).toBe("Benchplate needs at least one admin.");
      expect(await auditEntriesAbout(admin.id)).toEqual([]);
    } finally {
      for (const other of demoted) await db.update(users).set({ role: "admin" }).where(eq(users.id, other.id));
    }
  });
});
