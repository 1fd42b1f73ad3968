import { randomUUID } from "node:crypto";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDatabase, db } from "@/db";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { analyses, reports } from "@/db/schema";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { analyzeCapture } from "@/lib/bench/analysis";
import { DESKTOP_VIEWPORT, browserForSuite, openHydrated, visible } from "../support/e2e";

const reviewer = demoPeople.find((person) => person.role === "reviewer")!;
const fixture = path.join(import.meta.dirname, "../fixtures/captures/orrery-orm42-hot-air.csv");
const mark = randomUUID().slice(0, 8);
const serial = `E2E-${mark}`;


/** The number at a dotted path of the analysis object, as the page's data-figure attributes name them. */
function at(result: unknown, dotted: string): unknown {
  return dotted.split(".").reduce<unknown>((value, key) => (value as Record<string, unknown> | null)?.[key], result);
}

// The whole of a reviewer's job in one browser session, each step using what the one before created:
// a tool with a photo, an instrument, a protocol, a run with a real capture, the figures, then a report.
describe("a reviewer goes from a tool on the bench to a report ready for the editor", () => {
  const suite = browserForSuite(DESKTOP_VIEWPORT, { signInAs: { email: reviewer.email, password: demoPassword } });
  let page: Page;
  beforeAll(() => {
    page = suite.page;
  });
  afterAll(() => closeDatabase());

  const model = `Journey ${mark}`;
  const clamp = { model: "HC-40 journey clamp", serial: `JRN-${mark}` };
  const protocolName = `Journey protocol ${mark}`;
  let analysisId = "";

  it("adds the tool with a photo", async () => {
    await openHydrated(page, "/workspace/tools/new");
    await page.getByLabel("Maker", { exact: true }).selectOption({ label: "Quillfern Thermal" });
    await page.getByLabel("Model", { exact: true }).fill(model);
    await page.getByLabel("Kind of tool").selectOption({ label: "Hot-air rework station" });
    await page.getByLabel("Rated power input (W)").fill("720");
    await page.getByLabel("Rated voltage, or the lower end of a range (V)").fill("230");
    await page.getByLabel("Rated frequency").selectOption("50/60");
    await Promise.all([page.waitForURL(/\/workspace\/tools\/[a-z0-9-]+\/edit\?created=1$/, { timeout: 30_000 }), page.getByRole("button", { name: "Add tool" }).click()]);
    const photo = await sharp({ create: { width: 1200, height: 800, channels: 3, background: "#2c6e68" } }).jpeg().toBuffer();
    await page.getByLabel("Photo", { exact: true }).setInputFiles({ name: "bench.jpg", mimeType: "image/jpeg", buffer: photo });
    await page.getByLabel("Alt text").fill("The station on the bench with the clamp around the live conductor");
    await page.getByRole("button", { name: "Upload photo" }).click();
    await visible(page, "Photo added.");
  });

  it("registers the current clamp in the lab", async () => {
    await openHydrated(page, "/workspace/instruments/new");
    await page.getByLabel("Kind", { exact: true }).selectOption({ label: "Current clamp" });
    await page.getByLabel("Lab", { exact: true }).selectOption({ label: "Wrenford Bench" });
    await page.getByLabel("Maker", { exact: true }).fill("Halvard Instruments");
    await page.getByLabel("Model", { exact: true }).fill(clamp.model);
    await page.getByLabel("Serial number").fill(clamp.serial);
    await page.getByLabel("Quantity").selectOption("current");
    await page.getByLabel("Unit", { exact: true }).fill("A");
    await page.getByLabel("Range maximum").fill("40");
    await page.getByLabel("Accuracy ±(% + offset)").fill("1.5% + 0.05");
    await page.getByLabel("Calibrated on").fill("2026-03-01");
    await page.getByLabel("Calibration due on").fill("2027-03-01");
    await Promise.all([page.waitForURL(/\/workspace\/instruments\?saved=1$/, { timeout: 30_000 }), page.getByRole("button", { name: "Add instrument" }).click()]);
  });

  it("writes the protocol", async () => {
    await openHydrated(page, "/workspace/protocols/new");
    await page.getByLabel("Name", { exact: true }).fill(protocolName);
    await page.getByLabel("Summary").fill("Power input of a hot-air station at 230 V 50 Hz, full demand.");
    await page.getByLabel("Supply voltage (V)").fill("230");
    await page.getByLabel("Supply frequency").selectOption("50");
    await page.getByLabel("Power input at full demand (W)").check();
    await page.getByLabel("Steps (MDX)").fill("## Set-up\n\n1. Clamp the live conductor of the supply lead.");
    await Promise.all([page.waitForURL(/\/workspace\/protocols\/journey-protocol-[a-z0-9-]+$/, { timeout: 30_000 }), page.getByRole("button", { name: "Create protocol" }).click()]);
    await visible(page, "Safety cautions: read before you start");
  });

  it("creates a run, uploads a capture with a progress bar, maps it, waits for the worker and sees the CLI's figures", async () => {
    await openHydrated(page, "/workspace/runs/new");
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: `Quillfern Thermal ${model}` });
    await page.getByLabel("Protocol (latest version)").selectOption({ label: `${protocolName} v1` });
    await expect.poll(() => page.getByLabel("Nominal supply voltage (V)").inputValue()).toBe("230");
    await page.getByRole("button", { name: "Create run" }).click();
    await visible(page, "Enter the unit's serial number.");
    await visible(page, "Choose at least one instrument.");

    await page.getByLabel("Serial number").fill(serial);
    await page.getByLabel("Voltage variant").fill("230 V, EU plug");
    await page.getByLabel(new RegExp(`${clamp.model}.*${clamp.serial}`)).check();
    await page.getByLabel(/Veymouth Test VT-2204 isolated-channel scope/).check();
    await page.getByLabel("Measured supply voltage (V)").fill("229.4");
    await Promise.all([page.waitForURL(/\/workspace\/runs\/[0-9a-f-]{36}$/, { timeout: 30_000 }), page.getByRole("button", { name: "Create run" }).click()]);
    await visible(page, serial);

    // Slow the upload down, so the progress bar is there to be seen on a fast loopback.
    const cdp = await page.context().newCDPSession(page);
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 12 * 1024 });
    await page.getByLabel("Capture file").setInputFiles(fixture);
    await page.getByRole("button", { name: "Upload capture" }).click();
    const progress = page.getByRole("progressbar", { name: "Upload progress" });
    await expect.poll(() => progress.isVisible(), { timeout: 10_000 }).toBe(true);
    await expect.poll(async () => Number(await progress.getAttribute("aria-valuenow")), { timeout: 20_000 }).toBeGreaterThan(0);
    await page.waitForURL(/\/captures\/[0-9a-f-]{36}$/, { timeout: 60_000 });
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    await visible(page, /The file's header names 3 columns: “TIME”, “CH1”, “CH2”/);
    await expect.poll(() => page.getByLabel("Time column").inputValue()).toBe("TIME");
    await page.getByLabel("Current column").selectOption("CH1");
    await page.getByLabel("Current scale (A per unit of the column)").fill("10");
    await page.getByLabel("Voltage column").selectOption("CH2");
    await page.getByLabel("Voltage scale (V per unit of the column)").fill("1");
    await Promise.all([page.waitForURL(/\?analysis=[0-9a-f-]{36}$/, { timeout: 30_000 }), page.getByRole("button", { name: "Start analysis" }).click()]);
    analysisId = /\?analysis=([0-9a-f-]{36})$/.exec(page.url())![1]!;

    const rms = page.locator('[data-figure="current.rms"]');
    await expect.poll(() => rms.isVisible(), { timeout: 90_000 }).toBe(true);

    const [stored] = await db.select({ options: analyses.options }).from(analyses).where(eq(analyses.id, analysisId));
    const options = stored!.options as StoredAnalysisOptions;
    if (options.kind !== "waveform") throw new Error("expected a waveform analysis");
    const expected = await analyzeCapture({ path: fixture }, options.analysis);

    const shown = await page.locator("[data-figure]").evaluateAll((elements) =>
      elements.map((element) => ({ path: element.getAttribute("data-figure")!, value: element.getAttribute("data-value")! })),
    );
    expect(shown.length).toBeGreaterThan(20);
    for (const figure of shown) {
      const value = at(expected, figure.path);
      expect(figure.value, figure.path).toBe(value === null || value === undefined ? "" : String(value));
    }
    const verdict = page.getByRole("table", { name: /Power input against the rating/ });
    await expect.poll(() => verdict.getByText(expected.verdict!.result).isVisible()).toBe(true);
    await expect.poll(() => verdict.getByText("720 W").isVisible()).toBe(true);
    await visible(page, "Conduction map");
    await visible(page, "Harmonic currents against the Class limits");
  });

  it("writes a report embedding those figures, previews it and submits it", async () => {
    await openHydrated(page, "/workspace/reports/new");
    await page.getByLabel("Title").fill(`The ${model} on the bench`);
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: `Quillfern Thermal ${model}` });
    await Promise.all([page.waitForURL(/\/workspace\/reports\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start the draft" }).click()]);
    const reportId = /reports\/([0-9a-f-]{36})/.exec(page.url())![1]!;
    await page.getByLabel("Analysis").selectOption({ value: analysisId });
    await page.getByLabel("Label").fill("full-demand");
    await page.getByRole("button", { name: "Cite" }).click();
    await visible(page, "Cited as “full-demand”.");

    await page.getByLabel("Body (MDX)").fill('## What we measured\n\n<VerdictTable analysis="full-demand" />\n\n<ConductionMap analysis="full-demand" />\n\n<HarmonicChart analysis="full-demand" />');
    const preview = page.getByTestId("report-preview");
    const verdicts = preview.getByRole("table", { name: /Verdicts:/ });
    await expect.poll(() => verdicts.count(), { timeout: 15_000 }).toBe(1);
    const [stored] = await db.select({ result: analyses.result }).from(analyses).where(eq(analyses.id, analysisId));
    const verdict = (stored!.result as { verdict: { result: string } }).verdict;
    expect(await verdicts.getByText(verdict.result).count()).toBe(1);
    await visible(page, "Up to date");
    await page.getByRole("button", { name: "Save draft" }).click();
    await visible(page, "Saved.");
    await page.getByRole("button", { name: "Submit for review" }).click();
    await visible(page, "read-only while the editors have it");
    const [report] = await db.select({ status: reports.status }).from(reports).where(eq(reports.id, reportId));
    expect(report!.status).toBe("submitted");
  });
});
