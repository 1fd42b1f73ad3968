import { and, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { listPublishedFiguresForTool, listPublishedResultsForReport, listPublishedResultsForTool } from "@/db/queries/published-results";
import { reportRevisions, reports, reportTools, tools, type FrozenReportContent } from "@/db/schema";
import { measurementKindInfo } from "@/lib/measurement-kinds";
import { frozenContentForTool, frozenMeasurement } from "../support/frozen-content";
import { createToolWithPublishedReports, fixtureRetractionReason, insertReportWithRevisions, type FixtureTool } from "../support/published-fixtures";

// The demo seed publishes the Aeris report through the desk and corrects it in a second revision; readers must see
// the second revision's figures only. The tool made here carries one report in every state readers must or must not see.

const seededSlug = "quillfern-aeris-720-measured";

async function currentContent(slug: string) {
  const [row] = await db
    .select({ number: reportRevisions.number, content: reportRevisions.content, status: reports.status })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(eq(reports.slug, slug));
  if (!row) throw new Error(`${slug} is not seeded; run npm run db:seed in the test env`);
  return row;
}

let tool: FixtureTool;
let corrected: string;
let retracted: string;
let waiting: string;

/** Each revision's power input differs, so a row shows which revision it came from. */
const powerOf = (report: "corrected" | "retracted" | "waiting", revision: number) => ({ corrected: 700, retracted: 710, waiting: 720 })[report] + revision;

const contentFor = (made: FixtureTool, value: number): FrozenReportContent =>
  frozenContentForTool(made, { title: `Report with ${value} W`, measurements: [frozenMeasurement({ value })] });

beforeAll(async () => {
  let authorId: string;
  ({ tool, authorId, corrected, retracted } = await createToolWithPublishedReports({
    contentOf: (made, report, revision) => contentFor(made, powerOf(report, revision)),
  }));
  ({ slug: waiting } = await insertReportWithRevisions({
    toolIds: [tool.id],
    authorId,
    status: "submitted",
    revisions: [{ number: 1, status: "scheduled" }],
    current: null,
    contentOf: (revision) => contentFor(tool, powerOf("waiting", revision)),
  }));
});

describe("listPublishedResultsForReport", () => {
  it("gives the seeded corrected report's current revision, measurement by measurement", async () => {
    const { number, content } = await currentContent(seededSlug);
    expect(number).toBeGreaterThan(1);
    const rows = await listPublishedResultsForReport({ slug: seededSlug });
    expect(rows).toHaveLength(content.measurements.length);
    const expected = content.measurements.map((measurement) => [measurement.kind, measurement.value, measurement.unit, measurement.expandedUncertainty]);
    expect(rows.map((row) => [row.kind, row.value, row.unit, row.expandedUncertainty])).toEqual(expect.arrayContaining(expected));
    for (const row of rows) {
      expect(row.report).toMatchObject({ slug: seededSlug, revisionNumber: number, retracted: false, title: content.title });
      expect(row.quantity).toBe(measurementKindInfo[row.kind].label);
      const run = content.runs.find((candidate) => candidate.id === row.run.id);
      expect(row.run).toMatchObject({ testedOn: run?.testedOn, labName: run?.labName, protocol: { version: run?.protocol.version }, conditions: run?.conditions });
    }
    const power = rows.find((row) => row.kind === "power_input_full_demand");
    expect(power?.verdict).toMatchObject({ rated: 720, normalizedTo: 230, rule: expect.any(String), result: expect.any(String) });
    expect(power?.analysis?.label).toBeTruthy();
  });

  it("has nothing for a report readers cannot see", async () => {
    expect(await listPublishedResultsForReport({ slug: waiting })).toEqual([]);
    expect(await listPublishedResultsForReport({ slug: "no-such-report" })).toEqual([]);
  });
});

describe("listPublishedResultsForTool", () => {
  it("takes each readable report's current revision only, and flags the retracted one", async () => {
    const rows = await listPublishedResultsForTool({ toolSlug: tool.slug });
    expect(rows.map((row) => [row.report.slug, row.report.revisionNumber, row.value, row.report.retracted]).sort()).toEqual(
      [
        [corrected, 2, powerOf("corrected", 2), false],
        [retracted, 1, powerOf("retracted", 1), true],
      ].sort(),
    );
    expect(rows.find((row) => row.report.retracted)?.report.retractionReason).toBe(fixtureRetractionReason);
  });

  it("lists every seeded result on the seeded tool, each from its report's current revision", async () => {
    const [{ id: toolId } = { id: "" }] = await db.select({ id: tools.id }).from(tools).where(eq(tools.slug, "quillfern-aeris-720"));
    const rows = await listPublishedResultsForTool({ toolSlug: "quillfern-aeris-720" });
    const readable = await db
      .select({ slug: reports.slug, content: reportRevisions.content })
      .from(reports)
      .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
      .innerJoin(reportTools, and(eq(reportTools.reportId, reports.id), eq(reportTools.toolId, toolId)))
      .where(inArray(reports.status, ["published", "retracted"]));
    const expectedCount = readable.reduce((sum, { content }) => {
      const runsOfTool = new Set(content.analyses.filter((analysis) => analysis.toolId === toolId).map((analysis) => analysis.runId));
      return sum + content.measurements.filter((measurement) => runsOfTool.has(measurement.runId)).length;
    }, 0);
    expect(rows.length).toBe(expectedCount);
    expect(rows.some((row) => row.report.slug === seededSlug)).toBe(true);
    expect(rows.every((row) => row.tool.slug === "quillfern-aeris-720")).toBe(true);
  });
});

describe("listPublishedFiguresForTool", () => {
  it("gives the cited analyses of current revisions with their figures", async () => {
    const { analyses } = await listPublishedFiguresForTool({ toolSlug: tool.slug });
    expect(analyses.map((analysis) => analysis.report.slug).sort()).toEqual([corrected, corrected, retracted, retracted].sort());
    const waveform = analyses.find((analysis) => analysis.captureKind === "waveform");
    expect(waveform?.waveform?.current.rms).toBeGreaterThan(0);
    expect(waveform?.flicker?.pst).toBe(1.72);
  });
});
