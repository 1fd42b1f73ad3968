import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { listPublishedResultsForTool } from "@/db/queries/published-results";
import { demoPublications } from "@/db/seeds/editorial-data";
import { formatDate } from "@/lib/format";
import { groupResultsByQuantity, type PublishedResult } from "@/lib/published-results";
import { frozenContentForTool, frozenMeasurement, powerVerdict } from "../support/frozen-content";
import { createToolWithPublishedReports, fixtureRetractionReason, type FixtureTool } from "../support/published-fixtures";
import { browserForSuite, DESKTOP_VIEWPORT, PHONE_VIEWPORT, url } from "../support/e2e";

// The tool page against the query it is built from: every published result, in every quantity's table (desktop) or
// card list (phone), with the figures the frozen content holds. A tool made here has a corrected report, a retracted
// one and a revision still waiting, so the page must show exactly the current published revisions.

let tool: FixtureTool;

/** What one result's row or card must say, built from the query's row with the page's own formatting helpers. */
function expectedTexts(result: PublishedResult): string[] {
  const texts = [
    result.report.title,
    `revision ${result.report.revisionNumber}`,
    formatDate(new Date(result.report.publishedAt)),
    result.run.testedOn,
    result.run.labName,
    `version ${result.run.protocol.version}`,
    `${result.run.conditions.supplyVoltage} V ${result.run.conditions.supplyFrequencyHz} Hz`,
    formatMeasured(result.value, result.expandedUncertainty, result.unit),
    result.verdict ? result.verdict.result : "not judged",
  ];
  if (result.verdict) texts.push(`${formatNumber(result.verdict.rated)} ${result.unit}`);
  if (result.verdict?.normalizedTo) texts.push(`normalised to ${result.verdict.normalizedTo} V`);
  if (result.report.retracted) texts.push("Retracted");
  return texts;
}

/** The rows (desktop) or cards (phone) of each quantity, in order, as text; the other layout must be hidden. */
async function shownResults(page: Page, kind: string, layout: "table" | "cards"): Promise<string[]> {
  const section = page.locator(`section[aria-labelledby="results-${kind}"]`);
  const shown = layout === "table" ? section.locator("tbody tr") : section.locator("ol > li");
  const hidden = layout === "table" ? section.locator("ol") : section.getByRole("region");
  expect(await hidden.isVisible()).toBe(false);
  return shown.allInnerTexts();
}

const squash = (text: string) => text.replace(/\s+/g, " ");

/**
 * Each result of the query (or those `only` keeps) must be shown with all its figures. Exactly: every group has as many
 * rows as results, row by row in the query's order; otherwise some row of its quantity must hold them.
 */
async function expectPageMatchesQuery(page: Page, toolSlug: string, layout: "table" | "cards", only?: (result: PublishedResult) => boolean) {
  const results = await listPublishedResultsForTool({ toolSlug });
  expect(results.filter((result) => !only || only(result)).length).toBeGreaterThan(0);
  for (const group of groupResultsByQuantity(results)) {
    const texts = (await shownResults(page, group.kind, layout)).map(squash);
    if (!only) expect(texts, group.quantity).toHaveLength(group.results.length);
    group.results.forEach((result, index) => {
      if (only && !only(result)) return;
      const expected = expectedTexts(result).map(squash);
      const holds = (shown: string | undefined) => shown !== undefined && expected.every((text) => shown.includes(text));
      if (only) expect(texts.some(holds), `${group.quantity}: ${expected.join(" | ")}`).toBe(true);
      else for (const text of expected) expect(texts[index], `${group.quantity} row ${index + 1}`).toContain(text);
    });
  }
  return results;
}

const titleOf = (tool: FixtureTool, report: "corrected" | "retracted", revision: number) =>
  report === "retracted" ? `Withdrawn take on ${tool.slug}` : revision === 1 ? "First take" : `Corrected on the bench ${tool.slug}`;

beforeAll(async () => {
  ({ tool } = await createToolWithPublishedReports({
    contentOf: (made, report, revision) => {
      const value = report === "retracted" ? 733 : 690 + revision;
      return frozenContentForTool(made, {
        title: titleOf(made, report, revision),
        measurements: [
          frozenMeasurement({ value, verdict: powerVerdict({ measured: value - 7, normalized: value }) }),
          frozenMeasurement({ kind: "airflow", source: "manual", analysisId: null, value: 118.4, unit: "L/min", expandedUncertainty: 1.5, verdict: null }),
          frozenMeasurement({ kind: "heat_up_time", analysisId: "analysis-heat-up", value: 17.92, unit: "s", expandedUncertainty: 0.58, verdict: null }),
        ],
      });
    },
  }));
});

describe.each([
  ["phone", PHONE_VIEWPORT, "cards"],
  ["desktop", DESKTOP_VIEWPORT, "table"],
] as const)("the tool page at %s width", (_name, viewport, layout) => {
  const suite = browserForSuite(viewport);

  it("lists every current published result with its figures, the retracted ones marked", async () => {
    const { page } = suite;
    await page.goto(url(`/tools/${tool.slug}`));
    const results = await expectPageMatchesQuery(page, tool.slug, layout);
    expect(results.map((result) => [result.report.title, result.report.revisionNumber, result.report.retracted])).toEqual(
      expect.arrayContaining([
        [titleOf(tool, "corrected", 2), 2, false],
        [titleOf(tool, "retracted", 1), 1, true],
      ]),
    );
    expect(await page.getByText(titleOf(tool, "corrected", 1)).count()).toBe(0);
    expect(await page.getByRole("note").filter({ hasText: fixtureRetractionReason }).isVisible()).toBe(true);
    expect(await page.getByRole("link", { name: "Compare with another tool" }).getAttribute("href")).toBe(`/compare?a=${tool.slug}`);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  });

  it("shows the seeded report's results on the demo tool as the query gives them", async () => {
    const { page } = suite;
    const seeded = demoPublications[0]!;
    const demoTool = "quillfern-aeris-720";
    await page.goto(url(`/tools/${demoTool}`));
    // Other browser tests publish on the demo tool through other servers; the seeded report's rows are the fixed part.
    await expectPageMatchesQuery(page, demoTool, layout, (result) => result.report.slug === seeded.slug);
  });
});
