import { and, desc, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { attachMakerReply, publishReport, retractReport, scheduleReport, sendBackReport } from "@/app/(desk)/desk/reports/actions";
import { proposeRevision } from "@/app/(workspace)/workspace/reports/[id]/revise/actions";
import { citeAnalysis, createReport, submitReport, updateReport } from "@/app/(workspace)/workspace/reports/actions";
import { db } from "@/db";
import { getReadableReport, getLatestDecisionNotes, listDeskQueue, listMakerReplies, listPublishedRevisions } from "@/db/queries/editorial";
import { analyses, auditLog, editorialDecisions, outboxMessages, reportRevisions, reports } from "@/db/schema";
import { idleActionState, type ActionState } from "@/lib/action-state";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { runCaptureAnalysis } from "@/lib/capture-analysis";
import { publishDueRevisions } from "@/lib/editorial";
import { storedCompilationCount } from "@/lib/mdx/stored";
import { loadRevisionForReaders } from "@/lib/published-reports";
import { bodyChanges, changedFigures, figureLines } from "@/lib/revision-diff";
import { form, redirectOf, type ServerAction } from "../support/actions";
import { createAccount } from "../support/factories";
import { analyseFixtureCapture, createRun, createTool } from "../support/report-fixtures";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
// Reader pages cache a published revision; here every call reads the database, which is what the counts below need.
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn(), unstable_cache: (load: () => unknown) => load }));
vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));

type Account = Awaited<ReturnType<typeof createAccount>>;

let reviewer: Account;
let otherReviewer: Account;
let editor: Account;
let reader: Account;
let tool: { id: string; slug: string; name: string };
let analysisId: string;
let captureId: string;

const body = (label: string) => `## Power input\n\n<VerdictTable analysis="${label}" />\n\n<ConductionMap analysis="${label}" />\n\nThe station draws close to its rating.\n`;

function call(action: ServerAction, fields: Record<string, string>): Promise<ActionState> {
  return action(idleActionState, form(fields));
}

/** A report by the reviewer citing the fixture analysis as "full-power", submitted to the desk. */
async function submittedReport(title: string): Promise<string> {
  actAs(reviewer);
  const location = await redirectOf(createReport, form({ title, toolId: tool.id }));
  const reportId = location.split("/").pop()!;
  expect((await call(citeAnalysis, { reportId, analysisId, label: "full-power" })).status).toBe("ok");
  expect((await call(updateReport, { reportId, title, toolId: tool.id, disclosure: "Bought at retail.", bodyMdx: body("full-power") })).status).toBe("ok");
  expect(await call(submitReport, { reportId })).toMatchObject({ status: "ok" });
  return reportId;
}

async function readerView(reportId: string) {
  const [report] = await db.select({ slug: reports.slug }).from(reports).where(eq(reports.id, reportId));
  const readable = await getReadableReport({ slug: report!.slug });
  if (!readable) return null;
  const shown = await loadRevisionForReaders({ slug: readable.slug, reportId, revisionId: readable.publishedRevisionId });
  return { readable, shown: shown! };
}

async function mailsTo(address: string, subjectStart: string) {
  return db
    .select({ subject: outboxMessages.subject, text: outboxMessages.text, topic: outboxMessages.topic, dedupeKey: outboxMessages.dedupeKey })
    .from(outboxMessages)
    .where(and(eq(outboxMessages.toAddress, address), like(outboxMessages.subject, `${subjectStart}%`)));
}

/** A second analysis of the same capture with the clamp's scale read differently: every current and power figure moves. */
async function reanalyse(scale: number): Promise<string> {
  const [first] = await db.select({ options: analyses.options }).from(analyses).where(eq(analyses.id, analysisId));
  const options = structuredClone(first!.options) as Extract<StoredAnalysisOptions, { kind: "waveform" }>;
  options.analysis = { ...options.analysis, current: { column: "CH1", scale } };
  const [row] = await db.insert(analyses).values({ captureId, options, instrumentSnapshots: [] }).returning({ id: analyses.id });
  expect(await runCaptureAnalysis({ analysisId: row!.id })).toBe("done");
  return row!.id;
}

beforeAll(async () => {
  [reviewer, otherReviewer, editor, reader] = await Promise.all([
    createAccount({ role: "reviewer", name: "Ilse Varnham" }),
    createAccount({ role: "reviewer" }),
    createAccount({ role: "editor", name: "Editor Quill" }),
    createAccount({ role: "reader" }),
  ]);
  tool = await createTool();
  const run = await createRun({ reviewerId: reviewer.id, toolId: tool.id });
  ({ analysisId, captureId } = await analyseFixtureCapture({ runId: run.id }));
});
afterAll(() => actAs(null));

describe("the desk's decisions", () => {
  let reportId: string;
  beforeAll(async () => {
    reportId = await submittedReport("Desk decisions on a hot-air station");
  });

  it("e-mails every editor about the submission, once", async () => {
    const mails = await mailsTo(editor.email, "Submitted for review: Desk decisions");
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ topic: "submission" });
    expect(mails[0]!.text).toContain(`/desk/reports/${reportId}`);
  });

  it("shows the submission in the queue", async () => {
    const queue = await listDeskQueue();
    expect(queue.find((item) => item.id === reportId)).toMatchObject({ status: "submitted", openRevision: null, authorName: "Ilse Varnham" });
  });

  it("refuses roles outside the desk, before anything changes", async () => {
    for (const account of [reviewer, reader]) {
      actAs(account);
      expect((await call(publishReport, { reportId })).status).toBe("forbidden");
      expect((await call(sendBackReport, { reportId, notes: "Please add the heat-up run." })).status).toBe("forbidden");
    }
    actAs(null);
    expect((await call(retractReport, { reportId, reason: "x".repeat(30) })).status).toBe("unauthenticated");
    const [row] = await db.select({ status: reports.status }).from(reports).where(eq(reports.id, reportId));
    expect(row!.status).toBe("submitted");
  });

  it("names each invalid field", async () => {
    actAs(editor);
    expect((await call(sendBackReport, { reportId, notes: "" })).fieldErrors?.notes).toEqual(["Tell the reviewer what to change."]);
    expect((await call(sendBackReport, { reportId, notes: "Fix it" })).fieldErrors?.notes?.[0]).toMatch(/at least 10 characters/);
    expect((await call(scheduleReport, { reportId, publishAt: "2020-01-01T10:00" })).fieldErrors?.publishAt?.[0]).toMatch(/in the future/);
    expect((await call(scheduleReport, { reportId, publishAt: "tomorrow" })).fieldErrors?.publishAt?.[0]).toMatch(/date and time/);
    expect((await call(publishReport, { reportId: "not-an-id" })).fieldErrors?.reportId).toEqual(["Unknown report."]);
    expect((await call(retractReport, { reportId, reason: "Because I say so" })).fieldErrors?.reason?.[0]).toMatch(/at least 20/);
    expect((await call(retractReport, { reportId, reason: "The clamp was on the wrong conductor throughout." })).message).toMatch(/Only a published report/);
  });

  it("sends the report back with notes the reviewer sees, recorded and e-mailed", async () => {
    actAs(editor);
    expect(await call(sendBackReport, { reportId, notes: "Say which nozzle the airflow was measured with." })).toMatchObject({ status: "ok" });
    const [row] = await db.select({ status: reports.status }).from(reports).where(eq(reports.id, reportId));
    expect(row!.status).toBe("changes_requested");
    expect(await getLatestDecisionNotes({ reportId })).toMatchObject({ decision: "send_back", notes: "Say which nozzle the airflow was measured with." });
    const mails = await mailsTo(reviewer.email, "Sent back with notes");
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain("Say which nozzle the airflow was measured with.");
    const [entry] = await db.select().from(auditLog).where(and(eq(auditLog.subjectId, reportId), eq(auditLog.action, "report.sent_back")));
    expect(entry).toMatchObject({ actorId: editor.id, subjectType: "report" });
    expect((await call(sendBackReport, { reportId, notes: "Nothing waits, so this is refused." })).message).toMatch(/Nothing on this report waits/);
  });

  it("publishing freezes the exact figures, compiles the body once and e-mails the reviewer", async () => {
    actAs(reviewer);
    expect((await call(submitReport, { reportId })).status).toBe("ok");
    expect(await mailsTo(editor.email, "Submitted for review: Desk decisions")).toHaveLength(2);
    actAs(editor);
    const compiledBefore = storedCompilationCount();
    expect(await call(publishReport, { reportId, notes: "Clear and well sourced." })).toMatchObject({ status: "ok" });
    expect(storedCompilationCount()).toBe(compiledBefore + 1);

    const [revision] = await db.select().from(reportRevisions).where(eq(reportRevisions.reportId, reportId));
    const [analysis] = await db.select({ result: analyses.result, displaySeries: analyses.displaySeries }).from(analyses).where(eq(analyses.id, analysisId));
    expect(revision).toMatchObject({ number: 1, kind: "original", status: "published", approvedById: editor.id });
    expect(revision!.compiledMdx).toContain('"tagName":"VerdictTable"');
    expect(revision!.content.analyses).toEqual([expect.objectContaining({ label: "full-power", analysisId, result: analysis!.result, displaySeries: analysis!.displaySeries })]);
    expect(revision!.content.runs[0]).toMatchObject({ protocol: expect.objectContaining({ version: 1 }), conditions: expect.objectContaining({ supplyVoltage: 230 }) });
    expect(revision!.content).toMatchObject({ title: "Desk decisions on a hot-air station", disclosure: "Bought at retail.", author: { id: reviewer.id, name: "Ilse Varnham" } });

    const [row] = await db.select().from(reports).where(eq(reports.id, reportId));
    expect(row).toMatchObject({ status: "published", publishedRevisionId: revision!.id });
    expect(row!.firstPublishedAt).toBeInstanceOf(Date);
    expect(await mailsTo(reviewer.email, "Published: Desk decisions")).toHaveLength(1);

    // Reading the page many times runs the stored tree: the compiler is not involved.
    for (let index = 0; index < 3; index++) expect((await readerView(reportId))?.shown.body).toBeTruthy();
    expect(storedCompilationCount()).toBe(compiledBefore + 1);
  });

  it("attaches a maker's reply as plain text, with the fields checked", async () => {
    actAs(editor);
    const invalid = await call(attachMakerReply, { reportId, makerName: "", receivedOn: "next week", body: "" });
    expect(invalid.fieldErrors).toMatchObject({
      makerName: ["Name the maker who replied."],
      receivedOn: ["Enter a date as YYYY-MM-DD."],
      body: ["Paste the maker's reply."],
    });
    actAs(reviewer);
    expect((await call(attachMakerReply, { reportId, makerName: "Testmaker", receivedOn: "2026-05-20", body: "We measured otherwise." })).status).toBe("forbidden");
    actAs(editor);
    const text = "Our lab measured 612 W at 230 V.\n<b>We stand by the rating.</b>";
    expect((await call(attachMakerReply, { reportId, makerName: "Testmaker Ltd", receivedOn: "2026-05-20", body: text })).status).toBe("ok");
    expect(await listMakerReplies({ reportId })).toEqual([expect.objectContaining({ makerName: "Testmaker Ltd", receivedOn: "2026-05-20", body: text })]);
  });
});

describe("a correction after a re-analysis", () => {
  let reportId: string;
  let newerAnalysisId: string;
  let publishedFigures: string[];

  beforeAll(async () => {
    reportId = await submittedReport("Corrected after a re-analysis");
    actAs(editor);
    expect((await call(publishReport, { reportId })).status).toBe("ok");
    publishedFigures = figureLines((await readerView(reportId))!.shown.revision.content).map((line) => `${line.label}: ${line.value}`);
  });

  it("leaves the published figures alone when a cited capture is analysed again", async () => {
    newerAnalysisId = await reanalyse(11);
    const view = await readerView(reportId);
    expect(figureLines(view!.shown.revision.content).map((line) => `${line.label}: ${line.value}`)).toEqual(publishedFigures);
  });

  it("refuses a revision from anyone but the author or an editor, and one without a change note", async () => {
    const fields = { reportId, kind: "correction", changeNote: "The clamp scale was read as 10 A/V; it is 11 A/V.", title: "Corrected after a re-analysis", disclosure: "", bodyMdx: body("full-power"), "citations.0.label": "full-power", "citations.0.analysisId": newerAnalysisId };
    actAs(otherReviewer);
    expect((await call(proposeRevision, fields)).message).toMatch(/Only the author or an editor/);
    actAs(reader);
    expect((await call(proposeRevision, fields)).status).toBe("forbidden");
    actAs(reviewer);
    const missing = await call(proposeRevision, { ...fields, changeNote: "", kind: "rewrite" });
    expect(missing.fieldErrors?.changeNote).toEqual(["Say what changed and why; readers see this note."]);
    expect(missing.fieldErrors?.kind?.[0]).toMatch(/correction/);
    const badBody = await call(proposeRevision, { ...fields, bodyMdx: '<VerdictTable analysis="nowhere" />' });
    expect(badBody.fieldErrors?.submission?.[0]).toMatch(/names analysis "nowhere"/);
  });

  it("keeps the page unchanged while the revision waits, and changes it only when the editor approves", async () => {
    actAs(reviewer);
    const proposed = await call(proposeRevision, {
      reportId,
      kind: "correction",
      changeNote: "The clamp scale was read as 10 A/V; it is 11 A/V.",
      title: "Corrected after a re-analysis",
      disclosure: "Bought at retail.",
      bodyMdx: `${body("full-power")}\nCorrected: the clamp's scale.\n`,
      "citations.0.label": "full-power",
      "citations.0.analysisId": newerAnalysisId,
    });
    expect(proposed).toMatchObject({ status: "ok", message: expect.stringMatching(/Revision 2 is with the desk/) });
    expect(await mailsTo(editor.email, "Revision 2 proposed: Corrected after a re-analysis")).toHaveLength(1);
    expect((await call(proposeRevision, { reportId, kind: "amendment", changeNote: "Another change while one waits.", title: "x", bodyMdx: body("full-power") })).message).toMatch(
      /already waits for the desk/,
    );

    const waiting = await readerView(reportId);
    expect(figureLines(waiting!.shown.revision.content).map((line) => `${line.label}: ${line.value}`)).toEqual(publishedFigures);
    expect(waiting!.shown.revision.number).toBe(1);
    expect((await listDeskQueue()).find((item) => item.id === reportId)?.openRevision).toMatchObject({ number: 2, kind: "correction", status: "pending" });

    actAs(editor);
    const compiledBefore = storedCompilationCount();
    expect((await call(publishReport, { reportId })).status).toBe("ok");
    expect(storedCompilationCount()).toBe(compiledBefore + 1);
    const corrected = await readerView(reportId);
    expect(corrected!.shown.revision).toMatchObject({ number: 2, kind: "correction", changeNote: "The clamp scale was read as 10 A/V; it is 11 A/V." });
    expect(corrected!.shown.revision.content.analyses[0]!.analysisId).toBe(newerAnalysisId);
    expect((await listPublishedRevisions({ reportId })).map((revision) => [revision.number, revision.kind])).toEqual([
      [1, "original"],
      [2, "correction"],
    ]);

    // Revision 1 keeps its own numbers at its own address; the diff names what moved.
    const [first] = await listPublishedRevisions({ reportId });
    const original = await loadRevisionForReaders({ slug: corrected!.readable.slug, reportId, revisionId: first!.id });
    expect(figureLines(original!.revision.content).map((line) => `${line.label}: ${line.value}`)).toEqual(publishedFigures);
    const changes = changedFigures(original!.revision.content, corrected!.shown.revision.content);
    expect(changes.map((change) => change.key)).toEqual(expect.arrayContaining(["full-power:current", "full-power:power", "full-power:verdict:Power input at full demand"]));
    expect(bodyChanges(original!.revision.bodyMdx, corrected!.shown.revision.bodyMdx)).toContainEqual({ kind: "added", text: "\nCorrected: the clamp's scale.\n" });
  });

  it("declines a later revision with notes and keeps the published one", async () => {
    actAs(editor);
    expect(
      (
        await call(proposeRevision, {
          reportId,
          kind: "amendment",
          changeNote: "A link to the protocol page added.",
          title: "Corrected after a re-analysis",
          // As a browser posts a textarea: every line ends in CR LF.
          bodyMdx: body("full-power").replace(/\n/g, "\r\n"),
        })
      ).status,
    ).toBe("ok");
    const [pending] = await db.select({ bodyMdx: reportRevisions.bodyMdx }).from(reportRevisions).where(and(eq(reportRevisions.reportId, reportId), eq(reportRevisions.status, "pending")));
    expect(pending!.bodyMdx).toBe(body("full-power"));
    expect((await call(sendBackReport, { reportId, notes: "Not needed: the protocol is linked already." })).status).toBe("ok");
    const [latest] = await db.select({ decision: editorialDecisions.decision }).from(editorialDecisions).where(eq(editorialDecisions.reportId, reportId)).orderBy(desc(editorialDecisions.createdAt)).limit(1);
    expect(latest!.decision).toBe("reject_revision");
    expect((await readerView(reportId))!.shown.revision.number).toBe(2);
    expect(await mailsTo(reviewer.email, "Revision declined: Corrected after a re-analysis")).toHaveLength(1);
  });

  it("retracts with a reason, keeping the report readable", async () => {
    actAs(editor);
    expect(await call(retractReport, { reportId, reason: "The unit tested was a pre-production sample, not the retail model." })).toMatchObject({ status: "ok" });
    const view = await readerView(reportId);
    expect(view!.readable).toMatchObject({ status: "retracted", retractionReason: "The unit tested was a pre-production sample, not the retail model." });
    expect(view!.shown.revision.number).toBe(2);
    expect(await mailsTo(reviewer.email, "Retracted: Corrected after a re-analysis")).toHaveLength(1);
    actAs(reviewer);
    expect((await call(proposeRevision, { reportId, kind: "amendment", changeNote: "Trying after a retraction.", title: "x", bodyMdx: body("full-power") })).message).toMatch(
      /only while it is published/,
    );
  });
});

describe("scheduled publication", () => {
  it("approves and freezes now, and the job publishes when the time comes, once", async () => {
    const reportId = await submittedReport("Scheduled for a later morning");
    actAs(editor);
    const at = new Date(Date.now() + 2 * 3600_000);
    const local = at.toISOString().slice(0, 16);
    const compiledBefore = storedCompilationCount();
    expect(await call(scheduleReport, { reportId, publishAt: local })).toMatchObject({ status: "ok" });
    expect(storedCompilationCount()).toBe(compiledBefore + 1);
    const [revision] = await db.select().from(reportRevisions).where(eq(reportRevisions.reportId, reportId));
    expect(revision).toMatchObject({ status: "scheduled", publishedAt: null });
    expect(revision!.scheduledFor?.toISOString().slice(0, 16)).toBe(local);
    expect(await readerView(reportId)).toBeNull();
    expect(await mailsTo(reviewer.email, "Scheduled: Scheduled for a later morning")).toHaveLength(1);
    expect((await call(publishReport, { reportId })).message).toMatch(/already scheduled/);

    expect(await publishDueRevisions({ now: new Date() })).not.toContain(revision!.id);
    expect(await readerView(reportId)).toBeNull();
    const published = await publishDueRevisions({ now: new Date(at.getTime() + 60_000) });
    expect(published).toContain((await db.select({ slug: reports.slug }).from(reports).where(eq(reports.id, reportId)))[0]!.slug);
    expect(await publishDueRevisions({ now: new Date(at.getTime() + 120_000) })).toEqual([]);
    expect(storedCompilationCount()).toBe(compiledBefore + 1);
    const view = await readerView(reportId);
    expect(view!.shown.revision).toMatchObject({ number: 1, kind: "original" });
    expect(view!.readable.status).toBe("published");
    const [entry] = await db.select().from(auditLog).where(and(eq(auditLog.subjectId, reportId), eq(auditLog.action, "report.published")));
    expect(entry).toMatchObject({ actorId: null, details: expect.objectContaining({ scheduled: true }) });
  });

  it("takes a schedule back when the report is sent back, leaving no revision", async () => {
    const reportId = await submittedReport("Scheduled, then taken back");
    actAs(editor);
    expect((await call(scheduleReport, { reportId, publishAt: new Date(Date.now() + 3600_000).toISOString().slice(0, 16) })).status).toBe("ok");
    expect((await call(sendBackReport, { reportId, notes: "Hold it: the maker asked for a right of reply first." })).status).toBe("ok");
    expect(await db.select().from(reportRevisions).where(eq(reportRevisions.reportId, reportId))).toEqual([]);
    const [row] = await db.select({ status: reports.status }).from(reports).where(eq(reports.id, reportId));
    expect(row!.status).toBe("changes_requested");
  });
});
