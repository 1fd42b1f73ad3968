import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDatabase, db } from "@/db";
import { reports, users } from "@/db/schema";
import { demoPassword } from "@/db/seeds/people-and-catalogue-data";
import { DESKTOP_VIEWPORT, launchBrowser, openHydrated, signIn, url, type E2eBrowser } from "../support/e2e";
import { analyseFixtureCapture, createRun, createTool } from "../support/report-fixtures";

// Runs against a built app with the test database and fakes (the same environment the app was started with).

const reviewerEmail = "nadia.orlen@benchplate.test";

// Each payload would set window.__pwned or open a dialog if anything in it ran.
const hostileBody = [
  "# Hostile body",
  "",
  "<script>window.__pwned = 'script'; alert('script')</script>",
  "",
  '<img src="/does-not-exist.png" onError="window.__pwned = \'img\'; alert(\'img\')" />',
  "",
  'A <a href="javascript:window.__pwned=\'link\';alert(\'link\')">jsx link</a> and a [markdown link](javascript:alert("md")).',
  "",
  '<iframe src="javascript:alert(\'frame\')" />',
  "",
  "<Marquee>unknown element</Marquee>",
  "",
  '<details open onToggle="window.__pwned = \'toggle\'"><summary>More</summary>Inside</details>',
].join("\n");

async function watchForScript(page: Page): Promise<string[]> {
  const dialogs: string[] = [];
  page.on("dialog", async (dialog) => {
    dialogs.push(dialog.message());
    await dialog.dismiss();
  });
  return dialogs;
}

async function expectInert(page: Page, dialogs: string[], region: string) {
  const scope = page.locator(region);
  expect(await page.evaluate(() => (window as unknown as { __pwned?: string }).__pwned)).toBeUndefined();
  expect(dialogs).toEqual([]);
  expect(await scope.locator("script, iframe, img[onerror], [onerror], [ontoggle]").count()).toBe(0);
  expect(await scope.locator('a[href^="javascript" i]').count()).toBe(0);
  expect(await scope.getByText("<Marquee> is not allowed in reports and was removed.", { exact: false }).count()).toBe(1);
  // Clicking what used to be the links must not run anything either.
  for (const name of ["jsx link", "markdown link"]) await scope.getByText(name).click();
  expect(await page.evaluate(() => (window as unknown as { __pwned?: string }).__pwned)).toBeUndefined();
  expect(dialogs).toEqual([]);
}

describe("reports in the workspace", () => {
  let browser: E2eBrowser;
  let toolName: string;

  beforeAll(async () => {
    const [reviewer] = await db.select({ id: users.id }).from(users).where(eq(users.email, reviewerEmail));
    const tool = await createTool();
    toolName = tool.name;
    const run = await createRun({ reviewerId: reviewer!.id, toolId: tool.id });
    await analyseFixtureCapture({ runId: run.id });
    browser = await launchBrowser({ viewport: DESKTOP_VIEWPORT });
    await signIn(await browser.newPage(), reviewerEmail, demoPassword);
  });

  afterAll(async () => {
    await browser?.close();
    await closeDatabase();
  });

  it("writes a report with embeds, previews it live and submits it", async () => {
    const page = await browser.newPage();
    const dialogs = await watchForScript(page);
    await openHydrated(page, "/workspace/reports/new");
    await page.getByLabel("Title").fill("The bench station measured");
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: toolName });
    await Promise.all([page.waitForURL(/\/workspace\/reports\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start the draft" }).click()]);
    const reportId = /reports\/([0-9a-f-]{36})/.exec(page.url())![1]!;

    // Cite the finished analysis under a label.
    await page.getByLabel("Analysis").selectOption({ index: 1 });
    await page.getByLabel("Label").fill("full-power");
    await page.getByRole("button", { name: "Cite" }).click();
    await expect.poll(() => page.getByText("Cited as “full-power”.").count(), { timeout: 10_000 }).toBe(1);

    // The body, typed: the preview follows without saving.
    const body = page.getByLabel("Body (MDX)");
    await body.fill('## Findings\n\n<VerdictTable analysis="full-power" />\n\n<WaveformChart analysis="full-power" />\n\n<ConductionMap analysis="full-power" />\n\n<HarmonicChart analysis="full-power" />\n\n<SpecTable />');
    const preview = page.getByTestId("report-preview");
    await expect.poll(() => preview.getByRole("heading", { name: "Findings" }).count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => preview.getByRole("table", { name: /Verdicts:/ }).count()).toBe(1);
    expect(await preview.getByRole("table", { name: /Verdicts:/ }).getByText(/meets rating|above rating|below rating|inconclusive/).count()).toBe(1);
    expect(await preview.getByText(/half-cycles conduct/).count()).toBe(1);
    expect(await preview.getByText(/Harmonic currents against IEC 61000-3-2/).count()).toBe(1);
    // Each drawing loads as it comes near the window.
    for (const figure of await preview.locator("figure").all()) await figure.scrollIntoViewIfNeeded();
    await expect.poll(() => preview.locator(".recharts-surface").count(), { timeout: 15_000 }).toBeGreaterThanOrEqual(2);

    // A syntax error shows with its line while typing.
    await body.fill("Line one\n\n<b>unclosed");
    await expect.poll(() => page.getByText(/Line 3, column \d+:/).count(), { timeout: 15_000 }).toBe(1);

    await body.fill('## Findings\n\n<VerdictTable analysis="full-power" />\n\n<HarmonicChart analysis="full-power" />');
    await expect.poll(() => page.getByText("Up to date").count(), { timeout: 15_000 }).toBe(1);
    await page.getByRole("button", { name: "Save draft" }).click();
    await expect.poll(() => page.getByText("Saved.").count(), { timeout: 10_000 }).toBe(1);

    await page.screenshot({ path: "/tmp/report-editor-desktop.png", fullPage: true });
    await page.getByRole("button", { name: "Submit for review" }).click();
    // Once submitted the page turns read-only; a refusal would list its reasons under the button instead.
    await expect
      .poll(async () => (await page.locator("main").innerText()).match(/read-only while the editors have it|Not submitted yet[\s\S]*/)?.[0], { timeout: 15_000 })
      .toBe("read-only while the editors have it");
    const [row] = await db.select({ status: reports.status }).from(reports).where(eq(reports.id, reportId));
    expect(row!.status).toBe("submitted");
    expect(await page.getByLabel("Body (MDX)").count()).toBe(0);
    expect(dialogs).toEqual([]);
    await page.close();
  });

  it("keeps script, event handlers, javascript: links and unknown elements inert in the preview and the saved report", async () => {
    const page = await browser.newPage();
    const dialogs = await watchForScript(page);
    await openHydrated(page, "/workspace/reports/new");
    await page.getByLabel("Title").fill("Hostile text");
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: toolName });
    await Promise.all([page.waitForURL(/\/workspace\/reports\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start the draft" }).click()]);
    const reportId = /reports\/([0-9a-f-]{36})/.exec(page.url())![1]!;

    await page.getByLabel("Body (MDX)").fill(hostileBody);
    const preview = page.getByTestId("report-preview");
    await expect.poll(() => preview.getByRole("heading", { name: "Hostile body" }).count(), { timeout: 15_000 }).toBe(1);
    await expectInert(page, dialogs, '[data-testid="report-preview"]');
    expect(await page.getByText(/Line 3, column 1: <script> is not allowed/).count()).toBe(1);

    await page.getByRole("button", { name: "Save draft" }).click();
    await expect.poll(() => page.getByText("Saved.").count(), { timeout: 10_000 }).toBe(1);
    await page.goto(url(`/workspace/reports/${reportId}/view`));
    await expect.poll(() => page.getByRole("heading", { name: "Hostile body" }).count()).toBe(1);
    await expectInert(page, dialogs, "article");
    await page.close();
  });
});
