import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoRuns, type DemoRun } from "@/db/seeds/bench-runs-data";
import { comparisonRun } from "@/db/seeds/comparisons-data";
import { demoMakers, demoTools } from "@/db/seeds/people-and-catalogue-data";
import { demoProtocols } from "@/db/seeds/workspace-catalogue-data";
import { compareRunConditions, type ComparedRun } from "@/lib/comparability";
import { DESKTOP_VIEWPORT, PHONE_VIEWPORT, hydrated, launchBrowser, url, visible, type E2eBrowser } from "../support/e2e";

// The seeded runs behind each published demo report: the Wrenford and Cedar Hollow labs' runs differ in protocol and
// supply; the Wrenford lab's second tool was measured under the same protocol version and conditions as its first.
const [wrenfordRun, cedarHollowRun] = demoRuns as [DemoRun, DemoRun];

/** A seeded run as it was frozen at publication: the protocol's latest version's conditions with the day's values. */
function seededConditions(run: DemoRun): ComparedRun {
  const protocol = demoProtocols.find((candidate) => candidate.slug === run.protocolSlug)!;
  const latest = protocol.versions.at(-1)!;
  return { protocol: { name: protocol.name, version: protocol.versions.length }, conditions: { ...latest.conditions, ...run.conditionOverrides } };
}

function toolName(slug: string): string {
  const tool = demoTools.find((candidate) => candidate.slug === slug)!;
  return `${demoMakers.find((maker) => maker.slug === tool.makerSlug)!.name} ${tool.model}`;
}

const differentPair = { a: wrenfordRun, b: cedarHollowRun };
const samePair = { a: wrenfordRun, b: comparisonRun };
const expectedDifferences = compareRunConditions([seededConditions(differentPair.a)], [seededConditions(differentPair.b)]);

const patiently = { timeout: 30_000 };

async function shownWarnings(page: Page) {
  const items = page.locator("[data-condition]");
  const count = await items.count();
  const shown: { condition: string | null; title: string }[] = [];
  for (let index = 0; index < count; index++) {
    const item = items.nth(index);
    shown.push({ condition: await item.getAttribute("data-condition"), title: (await item.locator("strong").innerText()).trim() });
  }
  return shown;
}

const quantitiesText = (page: Page) => page.getByRole("region", { name: "Rated against measured" }).innerText();

/** Types into a picker and waits for the suggestions the route handler answers with. */
async function typeInPicker(page: Page, label: string, text: string) {
  const input = page.getByRole("combobox", { name: label });
  await hydrated(input);
  const answered = page.waitForResponse((response) => {
    const requested = new URL(response.url());
    return requested.pathname === "/api/tools" && requested.searchParams.get("q") === text && response.status() === 200;
  });
  await input.fill(text);
  await answered;
  await expect.poll(() => input.getAttribute("aria-expanded"), patiently).toBe("true");
  return input;
}

describe("the seeded pairs", () => {
  it("differ in some conditions and not in others, so the warnings are exact rather than all or none", () => {
    const conditions = expectedDifferences.map((warning) => warning.condition);
    expect(conditions).toEqual(expect.arrayContaining(["supply-voltage", "supply-frequency"]));
    expect(conditions).not.toContain("temperature-setpoint");
    expect(compareRunConditions([seededConditions(samePair.a)], [seededConditions(samePair.b)])).toEqual([]);
  });
});

describe.each([
  ["phone", PHONE_VIEWPORT],
  ["desktop", DESKTOP_VIEWPORT],
])("comparing at %s width", (_name, viewport) => {
  let browser: E2eBrowser;

  beforeAll(async () => {
    browser = await launchBrowser({ viewport });
  });
  afterAll(async () => browser?.close());

  it("picks two tools as the reader types, puts them in a shareable URL and names exactly the conditions that differ", async () => {
    const page = await browser.newPage();
    await page.goto(url("/compare"));

    // The first picker by keyboard: the arrow moves to the suggestion, Enter chooses it.
    const first = await typeInPicker(page, "First tool", "Aeris 720");
    await page.keyboard.press("ArrowDown");
    const activeId = await first.getAttribute("aria-activedescendant");
    expect(activeId).toBeTruthy();
    expect((await page.locator(`[id="${activeId}"]`).innerText()).trim()).toBe(toolName(differentPair.a.toolSlug));
    await page.keyboard.press("Enter");
    await page.waitForURL((current) => current.searchParams.get("a") === differentPair.a.toolSlug, patiently);

    // The second by pointer, among the suggestions.
    await typeInPicker(page, "Second tool", "Duet");
    await page.getByRole("option", { name: toolName(differentPair.b.toolSlug) }).click();
    await page.waitForURL((current) => current.searchParams.get("b") === differentPair.b.toolSlug && current.searchParams.get("a") === differentPair.a.toolSlug, patiently);
    await visible(page, "Not measured on equal terms");

    const expected = expectedDifferences.map(({ condition, title }) => ({ condition, title }));
    await expect.poll(() => shownWarnings(page), patiently).toEqual(expected);
    const figures = await quantitiesText(page);

    // The address alone gives the same comparison.
    const shared = page.url();
    const fresh = await browser.newPage();
    await fresh.goto(shared);
    await visible(fresh, "Not measured on equal terms");
    expect(await shownWarnings(fresh)).toEqual(expected);
    expect(await quantitiesText(fresh)).toBe(figures);
    expect(await fresh.getByRole("combobox", { name: "First tool" }).inputValue()).toBe(toolName(differentPair.a.toolSlug));
    await fresh.close();
    await page.close();
  });

  it("shows no warning for two tools measured on equal terms", async () => {
    const page = await browser.newPage();
    await page.goto(url(`/compare?a=${samePair.a.toolSlug}&b=${samePair.b.toolSlug}`));
    await visible(page, "Measured on equal terms");
    expect(await page.locator("[data-condition]").count()).toBe(0);
    for (const slug of [samePair.a.toolSlug, samePair.b.toolSlug]) {
      expect(await page.getByRole("heading", { level: 2, name: new RegExp(toolName(slug)) }).count()).toBeGreaterThan(0);
    }
    await page.close();
  });
});

describe("without JavaScript", () => {
  it("resolves the text typed into each picker to the one tool it names, at the shareable address", async () => {
    const browser = await launchBrowser();
    try {
      const response = await browser.context.request.get(url("/compare?qa=Aeris%20720&qb=Spot%20300"), { maxRedirects: 0 });
      expect(response.status()).toBe(307);
      const target = new URL(response.headers().location!, url("/"));
      expect(Object.fromEntries(target.searchParams)).toEqual({ a: samePair.a.toolSlug, b: samePair.b.toolSlug });
    } finally {
      await browser.close();
    }
  });
});
