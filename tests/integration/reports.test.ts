import { eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import {
  citeAnalysis,
  createReport,
  deleteReportImage,
  removeCitation,
  submitReport,
  updateReport,
  uploadReportImage,
} from "@/app/(workspace)/workspace/reports/actions";
import { GET as getReportImage } from "@/app/api/report-images/[imageId]/route";
import { POST as postPreview } from "@/app/api/reports/[id]/preview/route";
import { db } from "@/db";
import { analyses, reportAnalyses, reportImages, reports, reportTools } from "@/db/schema";
import { idleActionState, type ActionState } from "@/lib/action-state";
import { statObject } from "@/lib/object-storage";
import { createAccount } from "../support/factories";
import { analyseFixtureCapture, createRun, createTool } from "../support/report-fixtures";
import { actAs } from "../support/session-mock";
import { form } from "../support/actions";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));

type Account = Awaited<ReturnType<typeof createAccount>>;


/** createReport answers with a redirect to the new report's page; the id is read from where it points. */
async function newReport(fields: Record<string, string>): Promise<string> {
  const error = await createReport(idleActionState, form(fields)).then(
    () => null,
    (thrown: unknown) => thrown as { digest?: string },
  );
  const id = /\/workspace\/reports\/([0-9a-f-]{36})/.exec(error?.digest ?? "")?.[1];
  if (!id) throw new Error(`no redirect to a new report: ${JSON.stringify(error)}`);
  return id;
}

function preview(reportId: string, body: unknown) {
  return postPreview(new Request(`http://localhost/api/reports/${reportId}/preview`, { method: "POST", body: JSON.stringify(body) }), {
    params: Promise.resolve({ id: reportId }),
  });
}

async function pngFile(name = "setup.png") {
  const bytes = await sharp({ create: { width: 640, height: 480, channels: 3, background: "#a5481f" } })
    .withMetadata({ exif: { IFD0: { Artist: "Someone", Copyright: "Somebody" } } })
    .png()
    .toBuffer();
  return new File([new Uint8Array(bytes)], name, { type: "image/png" });
}

let reviewer: Account;
let otherReviewer: Account;
let editor: Account;
let reader: Account;
let tool: { id: string; slug: string };
let analysisId: string;
let captureId: string;

beforeAll(async () => {
  [reviewer, otherReviewer, editor, reader] = await Promise.all([
    createAccount({ role: "reviewer", name: "Ines Kettleby" }),
    createAccount({ role: "reviewer" }),
    createAccount({ role: "editor" }),
    createAccount({ role: "reader" }),
  ]);
  tool = await createTool();
  const run = await createRun({ reviewerId: reviewer.id, toolId: tool.id });
  ({ analysisId, captureId } = await analyseFixtureCapture({ runId: run.id }));
});
afterAll(() => actAs(null));

describe("creating a report", () => {
  it("names each invalid field", async () => {
    actAs(reviewer);
    const result = await createReport(idleActionState, form({ title: " ", toolId: "not-a-tool", secondToolId: "" }));
    expect(result.status).toBe("error");
    expect(result.fieldErrors?.title).toEqual(["Give the report a title."]);
    expect(result.fieldErrors?.toolId).toEqual(["Choose the tool this report is about."]);
    const same = await createReport(idleActionState, form({ title: "Twice", toolId: tool.id, secondToolId: tool.id }));
    expect(same.fieldErrors?.secondToolId).toEqual(["A head-to-head needs two different tools."]);
  });

  it("refuses a reader and an anonymous visitor before reading the form", async () => {
    actAs(reader);
    expect((await createReport(idleActionState, form({ title: "Mine", toolId: tool.id }))).status).toBe("forbidden");
    actAs(null);
    expect((await createReport(idleActionState, form({ title: "Mine", toolId: tool.id }))).status).toBe("unauthenticated");
  });

  it("starts a draft by the reviewer on the chosen tool", async () => {
    actAs(reviewer);
    const id = await newReport({ title: "A hot-air station on the bench", toolId: tool.id });
    const [row] = await db.select().from(reports).where(eq(reports.id, id));
    expect(row).toMatchObject({ status: "draft", authorId: reviewer.id, title: "A hot-air station on the bench" });
    expect(row!.slug).toMatch(/^a-hot-air-station-on-the-bench/);
    expect(await db.select().from(reportTools).where(eq(reportTools.reportId, id))).toEqual([{ reportId: id, toolId: tool.id, position: 0 }]);
  });
});

describe("editing, citing and submitting", () => {
  let reportId: string;
  const save = (fields: Record<string, string>) =>
    updateReport(idleActionState, form({ reportId, title: "Bench report", toolId: tool.id, disclosure: "Loaned by the maker.", ...fields }));

  beforeAll(async () => {
    actAs(reviewer);
    reportId = await newReport({ title: "Bench report", toolId: tool.id });
  });

  it("lets only the author and editors change a draft", async () => {
    actAs(otherReviewer);
    const refused = await save({ bodyMdx: "Hijacked" });
    expect(refused).toMatchObject({ status: "error", message: expect.stringMatching(/not one you can change/) });
    actAs(reader);
    expect((await save({ bodyMdx: "Hijacked" })).status).toBe("forbidden");
    actAs(editor);
    expect((await save({ bodyMdx: "Edited by the desk." })).status).toBe("ok");
    actAs(reviewer);
    expect((await save({ bodyMdx: "# Findings\n\nThe station draws its rating." })).status).toBe("ok");
    const [row] = await db.select({ bodyMdx: reports.bodyMdx }).from(reports).where(eq(reports.id, reportId));
    expect(row!.bodyMdx).toContain("The station draws its rating.");
  });

  it("refuses an over-long body beside the field", async () => {
    actAs(reviewer);
    const result = await save({ bodyMdx: "x".repeat(100_001) });
    expect(result.fieldErrors?.bodyMdx?.[0]).toMatch(/limited to 100000 characters/);
  });

  it("cites a finished analysis by label and refuses what it may not cite", async () => {
    actAs(reviewer);
    expect((await citeAnalysis(idleActionState, form({ reportId, analysisId, label: "Full Power!" }))).fieldErrors?.label?.[0]).toMatch(/lower-case letters/);
    const cited = await citeAnalysis(idleActionState, form({ reportId, analysisId, label: "full-power" }));
    expect(cited).toMatchObject({ status: "ok", message: "Cited as “full-power”." });

    const strangersRun = await createRun({ reviewerId: otherReviewer.id, toolId: tool.id });
    const strangers = await analyseFixtureCapture({ runId: strangersRun.id });
    const refused = await citeAnalysis(idleActionState, form({ reportId, analysisId: strangers.analysisId, label: "borrowed" }));
    expect(refused.fieldErrors?.analysisId?.[0]).toMatch(/by the report's author/);

    actAs(otherReviewer);
    expect((await citeAnalysis(idleActionState, form({ reportId, analysisId, label: "mine-now" }))).message).toMatch(/not one you can change/);
  });

  it("keeps citing the same analysis after a re-analysis until the label is repointed", async () => {
    actAs(reviewer);
    const before = await db.select().from(analyses).where(eq(analyses.id, analysisId));
    const again = await analyseFixtureCapture({ runId: "", captureId });
    const citation = () => db.select({ analysisId: reportAnalyses.analysisId }).from(reportAnalyses).where(eq(reportAnalyses.reportId, reportId));
    expect(await citation()).toEqual([{ analysisId }]);
    expect((await citeAnalysis(idleActionState, form({ reportId, analysisId: again.analysisId, label: "full-power" }))).status).toBe("ok");
    expect(await citation()).toEqual([{ analysisId: again.analysisId }]);
    expect(await db.select().from(analyses).where(eq(analyses.id, analysisId))).toEqual(before);
    // Back to the first, which the rest of these tests embed.
    await citeAnalysis(idleActionState, form({ reportId, analysisId, label: "full-power" }));
    expect((await removeCitation(idleActionState, form({ reportId, label: "no-such-label" }))).message).toMatch(/No citation is labelled/);
  });

  it("previews unsaved MDX through the sanitiser, with the cited data and problems by line", async () => {
    actAs(reviewer);
    const response = await preview(reportId, {
      source: '# Result\n\n<script>window.pwned = 1</script>\n\n<VerdictTable analysis="full-power" />\n\n<WaveformChart analysis="missing" />\n\n[x](javascript:alert(1))',
    });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { tree: unknown; problems: { line: number; message: string }[]; embeds: { analyses: Record<string, unknown> } };
    const tree = JSON.stringify(body.tree);
    expect(tree).not.toMatch(/"tagName":"script"|"href":"javascript|pwned/i);
    expect(tree).toContain("<script> is not allowed in reports and was removed. (line 3)");
    expect(body.problems.map((problem) => problem.line)).toEqual([3, 7, 9]);
    expect(body.problems[1]!.message).toMatch(/names analysis "missing"/);
    expect(body.embeds.analyses["full-power"]).toMatchObject({
      analysisId,
      status: "done",
      verdicts: [expect.objectContaining({ quantity: "Power input at full demand", unit: "W" })],
      waveform: expect.objectContaining({ frequencyHz: expect.any(Number) }),
    });
  });

  it("answers the preview with 422, 401, 403 and 404 where it must", async () => {
    actAs(reviewer);
    expect((await preview(reportId, { nothing: true })).status).toBe(422);
    actAs(null);
    expect((await preview(reportId, { source: "x" })).status).toBe(401);
    actAs(reader);
    expect((await preview(reportId, { source: "x" })).status).toBe(403);
    actAs(otherReviewer);
    expect((await preview(reportId, { source: "x" })).status).toBe(404);
    actAs(editor);
    expect((await preview(reportId, { source: "x" })).status).toBe(200);
  });

  it("stores images re-encoded without metadata, with alt text required, visible only to those who may see the draft", async () => {
    actAs(reviewer);
    const missingAlt = await uploadReportImage(idleActionState, form({ reportId, name: "bench-setup", altText: "", image: await pngFile() }));
    expect(missingAlt.fieldErrors?.altText?.[0]).toMatch(/Describe the picture/);
    const notImage = await uploadReportImage(
      idleActionState,
      form({ reportId, name: "bench-setup", altText: "The bench with the station", image: new File(["hello"], "x.png", { type: "image/png" }) }),
    );
    expect(notImage.fieldErrors?.image).toEqual(["That file could not be read as an image."]);

    const uploaded = await uploadReportImage(idleActionState, form({ reportId, name: "bench-setup", altText: "The bench with the station", image: await pngFile() }));
    expect(uploaded.status).toBe("ok");
    const [image] = await db.select().from(reportImages).where(eq(reportImages.reportId, reportId));
    expect(image).toMatchObject({ name: "bench-setup", width: 640, height: 480 });
    expect(await statObject(image!.objectKey)).toMatchObject({ contentType: "image/webp" });

    const duplicate = await uploadReportImage(idleActionState, form({ reportId, name: "bench-setup", altText: "Another picture", image: await pngFile() }));
    expect(duplicate.fieldErrors?.name?.[0]).toMatch(/already has an image named/);

    const fetchImage = () => getReportImage(new Request("http://localhost"), { params: Promise.resolve({ imageId: image!.id }) });
    const served = await fetchImage();
    expect(served.status).toBe(200);
    const metadata = await sharp(Buffer.from(await served.arrayBuffer())).metadata();
    expect(metadata.format).toBe("webp");
    expect(metadata.exif).toBeUndefined();
    actAs(otherReviewer);
    expect((await fetchImage()).status).toBe(404);
    actAs(null);
    expect((await fetchImage()).status).toBe(404);
    actAs(editor);
    expect((await fetchImage()).status).toBe(200);

    actAs(reviewer);
    const second = await uploadReportImage(idleActionState, form({ reportId, name: "to-delete", altText: "A picture to delete", image: await pngFile() }));
    expect(second.status).toBe("ok");
    const [doomed] = await db.select().from(reportImages).where(eq(reportImages.name, "to-delete"));
    expect((await deleteReportImage(idleActionState, form({ reportId, imageId: doomed!.id }))).status).toBe("ok");
    expect(await db.select().from(reportImages).where(eq(reportImages.id, doomed!.id))).toEqual([]);
    expect(await statObject(doomed!.objectKey)).toBeNull();
  });

  it("refuses submission with the reasons, then submits and locks the report", async () => {
    actAs(reviewer);
    const submit = (): Promise<ActionState> => submitReport(idleActionState, form({ reportId }));
    await save({ bodyMdx: '<Marquee>hi</Marquee>\n\n<Figure image="nowhere" />' });
    const refused = await submit();
    expect(refused.status).toBe("error");
    expect(refused.fieldErrors?.submission).toEqual([
      "Body, line 1, column 1: <Marquee> is not allowed in reports and was removed.",
      'Body, line 3, column 1: <Figure> names image "nowhere", which is not uploaded to this report.',
    ]);
    await save({ bodyMdx: "" });
    expect((await submit()).fieldErrors?.submission).toEqual(["Write the body of the report."]);

    await save({ bodyMdx: '# Findings\n\n<VerdictTable analysis="full-power" />\n\n<Figure image="bench-setup" caption="The bench" />' });
    actAs(otherReviewer);
    expect((await submit()).message).toMatch(/not one you can change/);
    actAs(reviewer);
    expect(await submit()).toMatchObject({ status: "ok" });
    const [row] = await db.select({ status: reports.status, submittedAt: reports.submittedAt }).from(reports).where(eq(reports.id, reportId));
    expect(row!.status).toBe("submitted");
    expect(row!.submittedAt).toBeInstanceOf(Date);

    expect((await save({ bodyMdx: "Changed after submission" })).message).toMatch(/with the editors/);
    expect((await submit()).message).toMatch(/with the editors/);
  });

  it("refuses a report that cites nothing", async () => {
    actAs(reviewer);
    const bare = await newReport({ title: "Nothing cited", toolId: tool.id });
    await updateReport(idleActionState, form({ reportId: bare, title: "Nothing cited", toolId: tool.id, bodyMdx: "Some text." }));
    expect((await submitReport(idleActionState, form({ reportId: bare }))).fieldErrors?.submission).toEqual([
      "Cite at least one finished analysis: a report stands on measured data.",
    ]);
  });
});
