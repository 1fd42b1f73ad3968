import { randomUUID } from "node:crypto";
import { and, eq, inArray, like } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { changeRequestStatus, mergeMeasurementRequests } from "@/app/(desk)/actions";
import { createMeasurementRequest, markRequestMeasured, toggleRequestVote } from "@/app/(public)/actions";
import { db } from "@/db";
import { auditLog, measurementRequests, outboxMessages, reports, requestVotes, tools, type ReportStatus } from "@/db/schema";
import { idleActionState } from "@/lib/action-state";
import { deliverPendingMail } from "@/lib/outbox";
import { requestLimits } from "@/lib/validations/measurement-requests";
import { createAccount } from "../support/factories";
import { listMessages, waitForMessage } from "../support/mail";
import { actAs } from "../support/session-mock";
import { form } from "../support/actions";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));

type Account = Awaited<ReturnType<typeof createAccount>>;


const asking = {
  whatToMeasure: "Real power at the highest setpoint on 230 V.",
  why: "I want to size the circuit it shares with my scope.",
};

/** Posts through the action as `account` and returns the new request's id from the redirect. */
async function postRequest(account: Account, fields: Record<string, string> = {}) {
  actAs(account);
  const error = await createMeasurementRequest(idleActionState, form({ proposedToolName: `Test station ${randomUUID()}`, ...asking, ...fields })).then(
    (result) => {
      throw new Error(`expected a redirect, got ${JSON.stringify(result)}`);
    },
    (thrown: unknown) => thrown as { digest?: string },
  );
  const id = /\/requests\/([0-9a-f-]{36})/.exec(error.digest ?? "")?.[1];
  if (!id) throw error;
  return id;
}

async function vote(account: Account, requestId: string) {
  actAs(account);
  return toggleRequestVote(idleActionState, form({ requestId }));
}

async function requestRow(id: string) {
  const [row] = await db.select().from(measurementRequests).where(eq(measurementRequests.id, id));
  return row!;
}

async function votersOf(id: string) {
  const rows = await db.select({ userId: requestVotes.userId }).from(requestVotes).where(eq(requestVotes.requestId, id));
  return rows.map((row) => row.userId).sort();
}

async function createReport(author: Account, status: ReportStatus) {
  const [row] = await db
    .insert(reports)
    .values({ slug: `test-report-${randomUUID()}`, title: `Bench report ${randomUUID().slice(0, 8)}`, authorId: author.id, status })
    .returning({ id: reports.id, title: reports.title });
  return row!;
}

/** Sends whatever the request's events queued, as the worker would, and returns the messages' ids. */
async function deliverRequestMail(requestId: string) {
  const rows = await db.select({ id: outboxMessages.id }).from(outboxMessages).where(like(outboxMessages.dedupeKey, `request:${requestId}:%`));
  const ids = rows.map((row) => row.id);
  await deliverPendingMail({ onlyIds: ids });
  return ids;
}

let readers: Account[];
let editor: Account;
let reviewer: Account;

beforeAll(async () => {
  editor = await createAccount({ role: "editor" });
  reviewer = await createAccount({ role: "reviewer" });
});
// Fresh readers per test: each posts under their own daily limit and receives only this test's mail.
beforeEach(async () => {
  readers = await Promise.all([1, 2, 3, 4].map(() => createAccount({ role: "reader" })));
});
afterAll(() => actAs(null));

describe("posting a request", () => {
  it("names each field that needs attention and writes nothing", async () => {
    actAs(readers[0]!);
    const result = await createMeasurementRequest(idleActionState, form({ toolId: "", proposedToolName: "", whatToMeasure: "power", why: "" }));
    expect(result.status).toBe("error");
    expect(result.fieldErrors).toMatchObject({
      toolId: [expect.stringMatching(/Choose a catalogued tool, or name one/)],
      whatToMeasure: [expect.stringMatching(/at least 10 characters/)],
      why: [expect.stringMatching(/Say why/)],
    });
  });

  it("refuses a catalogued tool and a new name at once, and an unknown tool", async () => {
    actAs(readers[0]!);
    const [tool] = await db.select({ id: tools.id }).from(tools).limit(1);
    const both = await createMeasurementRequest(idleActionState, form({ toolId: tool!.id, proposedToolName: "Another station", ...asking }));
    expect(both.fieldErrors?.proposedToolName?.[0]).toMatch(/not both/);
    const unknown = await createMeasurementRequest(idleActionState, form({ toolId: randomUUID(), ...asking }));
    expect(unknown.fieldErrors?.toolId?.[0]).toMatch(/no longer in the catalogue/);
  });

  it("starts with the requester's own vote, for a catalogued tool or a new one", async () => {
    const [tool] = await db.select({ id: tools.id }).from(tools).limit(1);
    const catalogued = await postRequest(readers[0]!, { proposedToolName: "", toolId: tool!.id });
    expect(await requestRow(catalogued)).toMatchObject({ toolId: tool!.id, proposedToolName: null, status: "open", voteCount: 1, requesterId: readers[0]!.id });
    expect(await votersOf(catalogued)).toEqual([readers[0]!.id]);
  });

  it(`takes at most ${requestLimits.perDay} requests a day from one person`, async () => {
    const eager = await createAccount({ role: "reader" });
    for (let count = 0; count < requestLimits.perDay; count++) await postRequest(eager);
    actAs(eager);
    const refused = await createMeasurementRequest(idleActionState, form({ proposedToolName: "One too many", ...asking }));
    expect(refused).toMatchObject({ status: "error", message: expect.stringMatching(/as many as we take in a day/) });
    const mine = await db.select({ id: measurementRequests.id }).from(measurementRequests).where(eq(measurementRequests.requesterId, eager.id));
    expect(mine).toHaveLength(requestLimits.perDay);
  });
});

describe("votes", () => {
  it("count once per reader; pressing again withdraws the vote", async () => {
    const id = await postRequest(readers[0]!);
    expect(await vote(readers[1]!, id)).toMatchObject({ status: "ok", message: "Your vote counts." });
    expect((await requestRow(id)).voteCount).toBe(2);
    expect(await vote(readers[1]!, id)).toMatchObject({ status: "ok", message: "Vote withdrawn." });
    expect((await requestRow(id)).voteCount).toBe(1);
    expect(await votersOf(id)).toEqual([readers[0]!.id]);
  });

  it("stay consistent with the count when many arrive at once", async () => {
    const id = await postRequest(readers[0]!);
    const voters = await Promise.all(Array.from({ length: 8 }, () => createAccount({ role: "reader" })));
    // Each call sets the signed-in account before it runs; run them in parallel through the database, not the mock.
    await Promise.all(
      voters.map(async (voter) => {
        actAs(voter);
        return toggleRequestVote(idleActionState, form({ requestId: id }));
      }),
    );
    const row = await requestRow(id);
    expect(row.voteCount).toBe((await votersOf(id)).length);
  });

  it("are closed on declined requests", async () => {
    const id = await postRequest(readers[0]!);
    actAs(editor);
    await changeRequestStatus(idleActionState, form({ requestId: id, status: "declined", declineReason: "Outside what the bench can measure safely." }));
    expect(await vote(readers[1]!, id)).toMatchObject({ status: "error", message: expect.stringMatching(/Voting has closed/) });
  });
});

describe("triage", () => {
  it("is refused to readers and reviewers on the server", async () => {
    const id = await postRequest(readers[0]!);
    for (const account of [readers[1]!, reviewer]) {
      actAs(account);
      expect((await changeRequestStatus(idleActionState, form({ requestId: id, status: "planned" }))).status).toBe("forbidden");
      expect((await mergeMeasurementRequests(idleActionState, form({ duplicateId: id, targetId: randomUUID() }))).status).toBe("forbidden");
    }
    actAs(readers[1]!);
    expect((await markRequestMeasured(idleActionState, form({ requestId: id, reportId: randomUUID() }))).status).toBe("forbidden");
    expect((await requestRow(id)).status).toBe("open");
  });

  it("asks a reason before declining", async () => {
    const id = await postRequest(readers[0]!);
    actAs(editor);
    const result = await changeRequestStatus(idleActionState, form({ requestId: id, status: "declined", declineReason: "" }));
    expect(result.fieldErrors?.declineReason?.[0]).toMatch(/Say why the request is declined/);
    expect((await requestRow(id)).status).toBe("open");
  });

  it("tells the requester and every voter of a status change, exactly once each", async () => {
    const id = await postRequest(readers[0]!);
    await vote(readers[1]!, id);
    await vote(readers[2]!, id);
    actAs(editor);
    expect(await changeRequestStatus(idleActionState, form({ requestId: id, status: "planned" }))).toMatchObject({
      status: "ok",
      message: expect.stringContaining("3 people told"),
    });
    // The same change again is refused, so it cannot queue a second round of mail.
    expect(await changeRequestStatus(idleActionState, form({ requestId: id, status: "planned" }))).toMatchObject({
      status: "error",
      message: "This request is already planned.",
    });
    expect(await deliverRequestMail(id)).toHaveLength(3);
    await deliverRequestMail(id);
    for (const person of readers.slice(0, 3)) {
      const mail = await waitForMessage(person.email, "Planned for the bench");
      expect(mail.text).toContain(`/requests/${id}`);
      expect(mail.text).toMatch(/\/unsubscribe\/[A-Za-z0-9_-]{32}\?topic=request_update/);
      expect((await listMessages(person.email)).filter((message) => message.subject.startsWith("Planned"))).toHaveLength(1);
    }
    expect(await listMessages(readers[3]!.email)).toHaveLength(0);
    const [history] = await db
      .select({ details: auditLog.details, actorId: auditLog.actorId })
      .from(auditLog)
      .where(and(eq(auditLog.subjectId, id), eq(auditLog.action, "request.status_changed")));
    expect(history).toEqual({ details: { from: "open", to: "planned" }, actorId: editor.id });
  });

  it("merges a duplicate: votes carried over without double votes, the duplicate declined and pointing at its target", async () => {
    const target = await postRequest(readers[0]!);
    await vote(readers[1]!, target);
    const duplicate = await postRequest(readers[2]!);
    await vote(readers[1]!, duplicate);
    await vote(readers[3]!, duplicate);

    actAs(editor);
    await expect(mergeMeasurementRequests(idleActionState, form({ duplicateId: duplicate, targetId: target }))).rejects.toMatchObject({
      digest: expect.stringContaining(`/desk/requests/${target}?merged=${duplicate}&gained=2&told=3`),
    });

    expect(await votersOf(target)).toEqual([readers[0]!.id, readers[1]!.id, readers[2]!.id, readers[3]!.id].sort());
    expect((await requestRow(target)).voteCount).toBe(4);
    expect(await requestRow(duplicate)).toMatchObject({ status: "declined", mergedIntoId: target, voteCount: 0, declineReason: expect.stringMatching(/^Merged into/) });
    expect(await votersOf(duplicate)).toEqual([]);

    // A merged request is closed: no votes, no second merge, no status change.
    expect(await vote(readers[0]!, duplicate)).toMatchObject({ status: "error", message: expect.stringMatching(/merged into another/) });
    actAs(editor);
    expect((await mergeMeasurementRequests(idleActionState, form({ duplicateId: duplicate, targetId: target }))).status).toBe("error");

    await deliverRequestMail(duplicate);
    for (const person of [readers[1]!, readers[2]!, readers[3]!]) {
      const mail = await waitForMessage(person.email, "Merged with another request");
      expect(mail.text).toContain(`/requests/${target}`);
    }
    expect((await listMessages(readers[0]!.email)).filter((message) => message.subject.startsWith("Merged"))).toHaveLength(0);
  });

  it("refuses a declined target and leaves both requests and their votes as they were", async () => {
    const target = await postRequest(readers[0]!);
    const duplicate = await postRequest(readers[1]!);
    actAs(editor);
    await changeRequestStatus(idleActionState, form({ requestId: target, status: "declined", declineReason: "Not a mains-powered tool at all." }));
    const auditBefore = await db.select({ id: auditLog.id }).from(auditLog).where(eq(auditLog.subjectId, duplicate));
    const result = await mergeMeasurementRequests(idleActionState, form({ duplicateId: duplicate, targetId: target }));
    expect(result.fieldErrors?.targetId?.[0]).toMatch(/neither declined nor merged/);
    expect(await requestRow(duplicate)).toMatchObject({ status: "open", mergedIntoId: null, voteCount: 1 });
    expect(await votersOf(duplicate)).toEqual([readers[1]!.id]);
    expect(await db.select({ id: auditLog.id }).from(auditLog).where(eq(auditLog.subjectId, duplicate))).toEqual(auditBefore);
  });
});

describe("answering a request with a report", () => {
  it("lets a reviewer link their own submitted report, but not another reviewer's draft", async () => {
    const id = await postRequest(readers[0]!);
    const otherReviewer = await createAccount({ role: "reviewer" });
    const othersSubmitted = await createReport(otherReviewer, "submitted");
    const ownDraft = await createReport(reviewer, "draft");
    const ownSubmitted = await createReport(reviewer, "submitted");

    actAs(reviewer);
    for (const report of [othersSubmitted, ownDraft]) {
      const refused = await markRequestMeasured(idleActionState, form({ requestId: id, reportId: report.id }));
      expect(refused.fieldErrors?.reportId?.[0]).toMatch(/published report, or one of yours that is submitted/);
    }
    const done = await markRequestMeasured(idleActionState, form({ requestId: id, reportId: ownSubmitted.id }));
    expect(done.status).toBe("ok");
    expect(await requestRow(id)).toMatchObject({ status: "measured", answeredByReportId: ownSubmitted.id });

    await deliverRequestMail(id);
    const mail = await waitForMessage(readers[0]!.email, "Measured:");
    // A submitted report is not public yet, so the mail does not name it.
    expect(mail.text).not.toContain(ownSubmitted.title);
  });

  it("lets an editor link any published report", async () => {
    const id = await postRequest(readers[0]!);
    const published = await createReport(reviewer, "published");
    actAs(editor);
    expect((await markRequestMeasured(idleActionState, form({ requestId: id, reportId: published.id }))).status).toBe("ok");
    await deliverRequestMail(id);
    const mails = await listMessages(readers[0]!.email);
    expect(mails.filter((message) => message.text.includes(published.title))).toHaveLength(1);
    const rows = await db.select({ id: outboxMessages.id }).from(outboxMessages).where(inArray(outboxMessages.dedupeKey, [`request:${id}:measured:${readers[0]!.id}`]));
    expect(rows).toHaveLength(1);
  });
});
