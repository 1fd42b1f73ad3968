import { randomUUID } from "node:crypto";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDatabase, db } from "@/db";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { analyses } from "@/db/schema";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { analyzeCapture } from "@/lib/bench/analysis";
import { launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";

const reviewer = demoPeople.find((person) => person.role === "reviewer")!;
const fixture = path.join(import.meta.dirname, "../fixtures/captures/orrery-orm42-hot-air.csv");
const serial = `E2E-${randomUUID().slice(0, 8)}`;

async function visible(page: Page, text: string | RegExp, timeout = 20_000) {
  await expect.poll(() => page.getByText(text).first().isVisible(), { timeout }).toBe(true);
}

/** The number at a dotted path of the analysis object, as the page's data-figure attributes name them. */
function at(result: unknown, dotted: string): unknown {
  return dotted.split(".").reduce<unknown>((value, key) => (value as Record<string, unknown> | null)?.[key], result);
}

describe("a reviewer runs a capture through the bench", () => {
  let browser: E2eBrowser;
  let page: Page;

  beforeAll(async () => {
    browser = await launchBrowser();
    page = await browser.newPage();
    await signIn(page, reviewer.email, demoPassword);
  });
  afterAll(async () => {
    await browser?.close();
    await closeDatabase();
  });

  it("creates a run, uploads a capture with a progress bar, maps it, waits for the worker and sees the CLI's figures", async () => {
    await page.goto(url("/workspace/runs/new"));
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: "Quillfern Thermal Aeris 720" });
    await page.getByLabel("Protocol (latest version)").selectOption({ label: "Hot-air station bench protocol v2" });
    await expect.poll(() => page.getByLabel("Nominal supply voltage (V)").inputValue()).toBe("230");
    await page.getByRole("button", { name: "Create run" }).click();
    await visible(page, "Enter the unit's serial number.");
    await visible(page, "Choose at least one instrument.");

    await page.getByLabel("Serial number").fill(serial);
    await page.getByLabel("Voltage variant").fill("230 V, EU plug");
    await page.getByLabel(/Halvard Instruments HC-40 AC\/DC clamp.*HC40-218770/).check();
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
    const analysisId = /\?analysis=([0-9a-f-]{36})$/.exec(page.url())![1]!;

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
});
