import type { Page, Response } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { demoPublications } from "@/db/seeds/editorial-data";
import { DESKTOP_VIEWPORT, PHONE_VIEWPORT, browserForSuite, openHydrated, url } from "../support/e2e";

// The catalogue's filters and sort go through GET /api/tools and into the address; the report search finds a seeded
// published report by a word of its body. Run at a phone's width and a desktop's.

const patiently = { timeout: 15_000 };
// The seeded 120 V report says its figures "come from a loaned retail unit".
const seededReport = demoPublications.find((publication) => publication.slug === "tessaly-rw-6-duet-at-120-v")!;

/** Waits for the catalogue's fetch with these parameters, while `act` triggers it. */
async function catalogueFetch(page: Page, act: () => Promise<unknown>, parameters: Record<string, string>): Promise<Response> {
  const [response] = await Promise.all([
    page.waitForResponse((candidate) => {
      const address = new URL(candidate.url());
      return address.pathname === "/api/tools" && Object.entries(parameters).every(([name, value]) => address.searchParams.get(name) === value);
    }, patiently),
    act(),
  ]);
  expect(response.status()).toBe(200);
  return response;
}

/** The table's rows as the reader sees them: kind and rated power in watts. */
async function rows(page: Page) {
  return page.locator("table tbody tr").evaluateAll((trs) =>
    trs
      .filter((tr) => tr.querySelectorAll("td").length > 1)
      .map((tr) => {
        const cells = [...tr.querySelectorAll("td")].map((cell) => cell.textContent?.trim() ?? "");
        return { kind: cells[0]!, ratedPowerW: Number.parseFloat(cells[1]!) };
      }),
  );
}

/** Waits until the table shows what the last fetch answered (the busy mark is gone). */
async function settled(page: Page) {
  await expect.poll(() => page.locator("table[aria-busy]").count(), patiently).toBe(0);
}

describe.each([
  ["phone", PHONE_VIEWPORT],
  ["desktop", DESKTOP_VIEWPORT],
])("catalogue and search at %s width", (_name, viewport) => {
  const suite = browserForSuite(viewport);
  let page: Page;
  beforeAll(() => {
    page = suite.page;
  });

  it("filters by kind and sorts by rated power through the route handler, keeping both in the address", async () => {
    await openHydrated(page, "/tools");
    const response = await catalogueFetch(page, () => page.getByLabel("Kind of tool").selectOption("heat_gun"), { category: "heat_gun" });
    const answered = (await response.json()) as { category: string }[];
    expect(answered.length).toBeGreaterThan(0);
    expect(answered.every((tool) => tool.category === "heat_gun")).toBe(true);
    await settled(page);
    expect(new URL(page.url()).searchParams.get("category")).toBe("heat_gun");
    expect(new Set((await rows(page)).map((row) => row.kind))).toEqual(new Set(["Heat gun"]));

    await catalogueFetch(page, () => page.getByLabel("Kind of tool").selectOption(""), {});
    await settled(page);
    expect(new URL(page.url()).search).toBe("");
    const header = page.getByRole("columnheader", { name: /Rated power/ });
    await catalogueFetch(page, () => header.getByRole("button").click(), { sort: "ratedPower" });
    await settled(page);
    await expect.poll(() => header.getAttribute("aria-sort"), patiently).toBe("ascending");
    const ascending = (await rows(page)).map((row) => row.ratedPowerW);
    expect(ascending).toEqual([...ascending].sort((a, b) => a - b));

    await catalogueFetch(page, () => header.getByRole("button").click(), { sort: "ratedPower", order: "desc" });
    await settled(page);
    await expect.poll(() => header.getAttribute("aria-sort"), patiently).toBe("descending");
    const descending = (await rows(page)).map((row) => row.ratedPowerW);
    expect(descending).toEqual([...descending].sort((a, b) => b - a));
    expect(new URL(page.url()).search).toBe("?sort=ratedPower&order=desc");
  });

  it("filters by rated power on Apply, and Back returns to the rows before", async () => {
    const before = await rows(page);
    await page.getByLabel("Rated power from (W)").fill("1000");
    await catalogueFetch(page, () => page.getByRole("button", { name: "Apply filters" }).click(), { minPowerW: "1000", sort: "ratedPower", order: "desc" });
    await settled(page);
    const filtered = await rows(page);
    expect(filtered.length).toBeGreaterThan(0);
    expect(filtered.every((row) => row.ratedPowerW >= 1000)).toBe(true);
    expect(new URL(page.url()).searchParams.get("minPowerW")).toBe("1000");

    await catalogueFetch(page, () => page.goBack(), { sort: "ratedPower", order: "desc" });
    await settled(page);
    expect(new URL(page.url()).searchParams.get("minPowerW")).toBeNull();
    await expect.poll(() => page.getByLabel("Rated power from (W)").inputValue(), patiently).toBe("");
    expect(await rows(page)).toEqual(before);
  });

  it("opens a shared address with its filters and sort already applied, rendered on the server", async () => {
    await page.goto(url("/tools?minPowerW=1000&sort=ratedPower&order=desc"));
    expect(await page.getByLabel("Rated power from (W)").inputValue()).toBe("1000");
    expect(await page.getByRole("columnheader", { name: /Rated power/ }).getAttribute("aria-sort")).toBe("descending");
    const shown = await rows(page);
    expect(shown.every((row) => row.ratedPowerW >= 1000)).toBe(true);
  });

  it("says why an address it cannot read shows the whole catalogue", async () => {
    await page.goto(url("/tools?minPowerW=lots&sort=cheapest"));
    await expect.poll(() => page.getByText("Enter a number of watts, such as 600.").isVisible(), patiently).toBe(true);
    await expect.poll(() => page.getByText(/sort must be one of/).isVisible(), patiently).toBe(true);
    expect(await page.getByLabel("Rated power from (W)").getAttribute("aria-invalid")).toBe("true");
  });

  it("finds a published report by a word of its body, with the word marked", async () => {
    await page.goto(url("/"));
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Search" }).click();
    await page.waitForURL(url("/search"), patiently);
    await page.getByLabel("Words to look for").fill("loaned");
    await page.getByRole("button", { name: "Search", exact: true }).click();
    await page.waitForURL((address) => address.searchParams.get("q") === "loaned", patiently);
    const result = page.getByRole("listitem").filter({ has: page.getByRole("link", { name: seededReport.title }) });
    await expect.poll(() => result.count(), patiently).toBe(1);
    expect(await result.locator("mark").allTextContents()).toContain("loaned");
  });
});
