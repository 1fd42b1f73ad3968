import { beforeAll, describe, expect, it } from "vitest";
import { formatMeasured } from "@/components/report-embeds/figure-format";
import { listPublishedResultsForReport } from "@/db/queries/published-results";
import { frozenContentForTool, frozenMeasurement, powerVerdict } from "../support/frozen-content";
import { createToolWithPublishedReports, fixtureRetractionReason, type FixtureTool } from "../support/published-fixtures";
import { browserForSuite, DESKTOP_VIEWPORT, PHONE_VIEWPORT, url } from "../support/e2e";

// A corrected report shows its current revision's figures with the correction notice and the history; a retracted
// one stays readable with its reason, every verdict marked withdrawn. Figures are checked against the query readers'
// downloads and the tool page use, so the page and the data say the same.

let tool: FixtureTool;
let corrected: string;
let retracted: string;

const firstValue = 655.5;
const correctedValue = 702.25;

const squash = (text: string) => text.replace(/\s+/g, " ");

beforeAll(async () => {
  ({ tool, corrected, retracted } = await createToolWithPublishedReports({
    contentOf: (made, report, revision) => {
      const value = report === "corrected" && revision > 1 ? correctedValue : firstValue;
      return frozenContentForTool(made, { measurements: [frozenMeasurement({ value, verdict: powerVerdict({ measured: value - 7, normalized: value }) })] });
    },
  }));
});

describe.each([
  ["phone", PHONE_VIEWPORT],
  ["desktop", DESKTOP_VIEWPORT],
] as const)("the report page at %s width", (_name, viewport) => {
  const suite = browserForSuite(viewport);

  const articleText = async () => squash(await suite.page.locator("main").innerText());

  it("shows a corrected report's current figures with the correction, the history, the runs and the links to its tool", async () => {
    const { page } = suite;
    await page.goto(url(`/reports/${corrected}`));
    const [power] = (await listPublishedResultsForReport({ slug: corrected })).filter((result) => result.kind === "power_input_full_demand");
    expect(power?.value).toBe(correctedValue);
    const text = await articleText();
    expect(text).toContain(squash(formatMeasured(power!.value, power!.expandedUncertainty, power!.unit)));
    expect(text).not.toContain(squash(formatMeasured(firstValue, power!.expandedUncertainty, power!.unit)));
    expect(await page.getByRole("note", { name: "Correction" }).innerText()).toContain("Correction 2.");
    expect(text).toContain(`Protocol: ${power!.run.protocol.name}, version ${power!.run.protocol.version}`);
    expect(text).toMatch(/Revision 1: Original/);
    expect(text).toMatch(/Revision 2: Correction/);
    expect(await page.getByRole("link", { name: tool.name, exact: true }).getAttribute("href")).toBe(`/tools/${tool.slug}`);
    expect(await page.getByRole("link", { name: `Every published result for ${tool.name}, across reports and protocol versions` }).getAttribute("href")).toBe(
      `/tools/${tool.slug}#results-heading`,
    );
    expect(await page.getByRole("heading", { name: "Safety" }).isVisible()).toBe(true);
    expect(await page.getByRole("heading", { name: "Every verdict", exact: true }).isVisible()).toBe(true);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  });

  it("keeps a retracted report readable with its reason, every verdict marked withdrawn", async () => {
    const { page } = suite;
    await page.goto(url(`/reports/${retracted}`));
    expect(await page.getByRole("alert").filter({ hasText: fixtureRetractionReason }).isVisible()).toBe(true);
    expect(await page.getByText("Retracted bench report").isVisible()).toBe(true);
    expect(await page.getByRole("heading", { name: "Every verdict (retracted)" }).isVisible()).toBe(true);
    expect(await page.getByRole("note").filter({ hasText: "Retracted with the report" }).isVisible()).toBe(true);
    const [power] = await listPublishedResultsForReport({ slug: retracted });
    expect(power?.report.retracted).toBe(true);
    expect(await articleText()).toContain(squash(formatMeasured(power!.value, power!.expandedUncertainty, power!.unit)));
  });
});
