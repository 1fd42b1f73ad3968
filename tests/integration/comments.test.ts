import { randomUUID } from "node:crypto";
import { and, eq, like } from "drizzle-orm";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { moderateComment, setCommenterTrust } from "@/app/(desk)/desk/comments/actions";
import { postComment } from "@/app/(public)/reports/actions";
import { CommentText } from "@/components/comment-text";
import { db } from "@/db";
import { listCommentsForModeration, listReportComments } from "@/db/queries/comments";
import { auditLog, comments, outboxMessages, reports, users } from "@/db/schema";
import { idleActionState, type ActionState } from "@/lib/action-state";
import { form, type ServerAction } from "../support/actions";
import { createAccount } from "../support/factories";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn() }));
vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));

type Account = Awaited<ReturnType<typeof createAccount>>;

function call(action: ServerAction, fields: Record<string, string>): Promise<ActionState> {
  return action(idleActionState, form(fields));
}

let author: Account;
let editor: Account;
let secondEditor: Account;
let reader: Account;
let reportId: string;

/** A published report is all comments need; its figures are tested elsewhere. */
async function publishedReport(status: "published" | "retracted" = "published") {
  const suffix = randomUUID().slice(0, 8);
  const [row] = await db
    .insert(reports)
    .values({ slug: `commented-${suffix}`, title: `Commented report ${suffix}`, authorId: author.id, status, firstPublishedAt: new Date() })
    .returning({ id: reports.id });
  return row!.id;
}

async function commentRow(body: string) {
  const [row] = await db.select().from(comments).where(eq(comments.body, body));
  return row!;
}

beforeAll(async () => {
  [author, editor, secondEditor, reader] = await Promise.all([
    createAccount({ role: "reviewer", name: "Report Author" }),
    createAccount({ role: "editor" }),
    createAccount({ role: "editor" }),
    createAccount({ role: "reader", name: "Curious Reader" }),
  ]);
  reportId = await publishedReport();
});
afterAll(() => actAs(null));

describe("posting comments", () => {
  it("needs an account and a body", async () => {
    actAs(null);
    expect((await call(postComment, { reportId, body: "Anonymous words." })).status).toBe("unauthenticated");
    actAs(reader);
    expect((await call(postComment, { reportId, body: "   " })).fieldErrors?.body).toEqual(["Write your comment."]);
    expect((await call(postComment, { reportId: "nope", body: "Hello" })).fieldErrors?.reportId).toEqual(["Unknown report."]);
  });

  it("holds a reader's comment for moderation, tells each editor once, and shows it only to its writer", async () => {
    actAs(reader);
    const text = `Was the nozzle the 6 mm one? ${randomUUID()}`;
    expect(await call(postComment, { reportId, body: text })).toMatchObject({ status: "ok", message: expect.stringMatching(/waiting for an editor/) });
    const row = await commentRow(text);
    expect(row).toMatchObject({ status: "pending", authorId: reader.id, parentId: null });

    const mails = await db
      .select({ toAddress: outboxMessages.toAddress, topic: outboxMessages.topic, text: outboxMessages.text })
      .from(outboxMessages)
      .where(like(outboxMessages.dedupeKey, `moderation:${row.id}:%`));
    expect(mails.map((mail) => mail.toAddress).sort()).toEqual(expect.arrayContaining([editor.email, secondEditor.email]));
    expect(new Set(mails.map((mail) => mail.toAddress)).size).toBe(mails.length);
    expect(mails.every((mail) => mail.topic === "moderation" && mail.text.includes(text))).toBe(true);

    expect((await listReportComments({ reportId, viewerId: reader.id })).map((comment) => comment.body)).toContain(text);
    expect((await listReportComments({ reportId, viewerId: null })).map((comment) => comment.body)).not.toContain(text);
    expect((await listReportComments({ reportId, viewerId: editor.id })).map((comment) => comment.body)).not.toContain(text);
  });

  it("limits each person to five comments in ten minutes, with a clear message", async () => {
    const chatty = await createAccount({ role: "reader" });
    actAs(chatty);
    for (let index = 1; index <= 5; index++) expect((await call(postComment, { reportId, body: `Point ${index} of many.` })).status).toBe("ok");
    const sixth = await call(postComment, { reportId, body: "Point 6 of many." });
    expect(sixth.status).toBe("error");
    expect(sixth.fieldErrors?.body?.[0]).toMatch(/5 comments in the last 10 minutes/);
    expect(sixth.values?.body).toBe("Point 6 of many.");
  });

  it("publishes a trusted reader's comment at once; an editor grants and withdraws trust", async () => {
    actAs(reader);
    expect((await call(setCommenterTrust, { userId: reader.id, trusted: "on" })).status).toBe("forbidden");
    actAs(editor);
    expect((await call(setCommenterTrust, { userId: reader.id, trusted: "on" })).status).toBe("ok");
    actAs(reader);
    const text = `Trusted remark ${randomUUID()}`;
    expect((await call(postComment, { reportId, body: text })).message).toBe("Posted.");
    expect((await commentRow(text)).status).toBe("approved");
    actAs(editor);
    expect((await call(setCommenterTrust, { userId: reader.id })).status).toBe("ok");
    const [account] = await db.select({ trusted: users.trustedCommenter }).from(users).where(eq(users.id, reader.id));
    expect(account!.trusted).toBe(false);
    const entries = await db.select({ details: auditLog.details }).from(auditLog).where(and(eq(auditLog.subjectId, reader.id), eq(auditLog.action, "user.commenter_trust_changed")));
    expect(entries.map((entry) => entry.details)).toEqual([
      { from: false, to: true },
      { from: true, to: false },
    ]);
  });

  it("lets only the report's author reply, and their reply needs no moderation", async () => {
    const question = `Which clamp range? ${randomUUID()}`;
    actAs(editor);
    await call(setCommenterTrust, { userId: reader.id, trusted: "on" });
    actAs(reader);
    await call(postComment, { reportId, body: question });
    const parent = await commentRow(question);
    expect((await call(postComment, { reportId, parentId: parent.id, body: "I can answer that too." })).message).toMatch(/Only the report's author/);
    actAs(author);
    const answer = `The 40 A range, stated in the method. ${randomUUID()}`;
    expect((await call(postComment, { reportId, parentId: parent.id, body: answer })).message).toBe("Posted.");
    const reply = await commentRow(answer);
    expect(reply).toMatchObject({ parentId: parent.id, status: "approved", authorId: author.id });
    const listed = await listReportComments({ reportId, viewerId: null });
    expect(listed.find((comment) => comment.id === reply.id)).toMatchObject({ byReportAuthor: true, authorName: "Report Author" });
    actAs(editor);
    await call(setCommenterTrust, { userId: reader.id });
  });

  it("refuses comments on a retracted report", async () => {
    const retracted = await publishedReport("retracted");
    actAs(reader);
    expect((await call(postComment, { reportId: retracted, body: "Still here?" })).message).toMatch(/not open for comments/);
  });
});

describe("moderation", () => {
  it("approves, rejects and marks spam, for editors only, each step in the audit log", async () => {
    // A reader of its own: the others used up their allowance above.
    const commenter = await createAccount({ role: "reader" });
    actAs(commenter);
    const texts = ["A fair question about the duty cycle.", "Rude remark.", "Buy cheap watches at http://spam.example"].map((text) => `${text} ${randomUUID()}`);
    for (const text of texts) await call(postComment, { reportId, body: text });
    const [fair, rude, spam] = await Promise.all(texts.map(commentRow));

    actAs(reader);
    expect((await call(moderateComment, { commentId: fair!.id, status: "approved" })).status).toBe("forbidden");
    actAs(author);
    expect((await call(moderateComment, { commentId: fair!.id, status: "approved" })).status).toBe("forbidden");
    actAs(editor);
    expect((await call(moderateComment, { commentId: fair!.id, status: "published" })).fieldErrors?.status?.[0]).toMatch(/approve, reject or spam/);
    expect((await call(moderateComment, { commentId: randomUUID(), status: "approved" })).message).toMatch(/no longer exists/);
    expect((await call(moderateComment, { commentId: fair!.id, status: "approved" })).status).toBe("ok");
    expect((await call(moderateComment, { commentId: rude!.id, status: "rejected" })).status).toBe("ok");
    expect((await call(moderateComment, { commentId: spam!.id, status: "spam" })).status).toBe("ok");

    expect((await commentRow(fair!.body)).status).toBe("approved");
    expect((await commentRow(rude!.body)).moderatedById).toBe(editor.id);
    const visible = (await listReportComments({ reportId, viewerId: null })).map((comment) => comment.body);
    expect(visible).toContain(fair!.body);
    expect(visible).not.toContain(rude!.body);
    expect(visible).not.toContain(spam!.body);
    for (const status of ["approved", "rejected", "spam"] as const) {
      const { comments: listed, tally } = await listCommentsForModeration({ status, limit: 500 });
      expect(listed.length).toBeGreaterThan(0);
      expect(tally[status]).toBeGreaterThanOrEqual(listed.length);
    }
    const [entry] = await db.select().from(auditLog).where(and(eq(auditLog.subjectId, spam!.id), eq(auditLog.action, "comment.moderated")));
    expect(entry).toMatchObject({ actorId: editor.id, subjectType: "comment", details: { from: "pending", to: "spam" } });
  });

  it("keeps a deleted reader's comments, without their name", async () => {
    const leaving = await createAccount({ role: "reader", name: "Soon Gone" });
    actAs(editor);
    await call(setCommenterTrust, { userId: leaving.id, trusted: "on" });
    actAs(leaving);
    const text = `Parting thought ${randomUUID()}`;
    await call(postComment, { reportId, body: text });
    await db.delete(users).where(eq(users.id, leaving.id));
    const listed = (await listReportComments({ reportId, viewerId: null })).find((comment) => comment.body === text);
    expect(listed).toMatchObject({ authorId: null, authorName: null });
  });
});

describe("comment text", () => {
  it("is shown as text, never markup, with addresses as links search engines do not credit", () => {
    const html = renderToStaticMarkup(CommentText({ body: 'See <script>alert(1)</script> and https://example.test/a?b=1.\nNext line <img src=x onerror="alert(2)">' }));
    expect(html).not.toContain("<script>");
    expect(html).not.toContain("<img");
    expect(html).toContain("&lt;script&gt;");
    expect(html).toContain('<a href="https://example.test/a?b=1" rel="nofollow ugc noopener"');
    expect(html).toContain("</a>.\nNext line");
    expect(renderToStaticMarkup(CommentText({ body: "javascript:alert(1) is not a link" }))).not.toContain("<a");
  });
});
