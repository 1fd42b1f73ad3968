import { sql } from "drizzle-orm";
import type { Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { DESKTOP_VIEWPORT, launchBrowser, PHONE_VIEWPORT, url, type E2eBrowser } from "../support/e2e";

// The home page's three lists against what the database says, read here with plain SQL rather than through the
// page's own queries, so a wrong ordering or filter in those queries fails too. The page caches its report and tool
// lists for up to a minute (tests elsewhere insert published reports straight into the database, which clears no
// cache), so the comparison is retried until it holds or that minute has passed.

const listLengths = { reports: 4, requests: 5, tools: 6 };
const cacheCeiling = { timeout: 75_000, interval: 2_000 };

type Expected = { reports: { title: string; verdicts: string[]; retracted: boolean }[]; requests: { toolName: string; votes: number }[]; tools: string[] };

async function expectedLists(): Promise<Expected> {
  const reports = await db.execute<{ title: string; status: string; verdicts: string[] | null }>(sql`
    select rr.content->>'title' as title, r.status,
      (select array_agg(m->'verdict'->>'result') from jsonb_array_elements(rr.content->'measurements') m where m->'verdict'->>'result' is not null) as verdicts
    from reports r join report_revisions rr on rr.id = r.published_revision_id
    where r.status in ('published', 'retracted')
    order by r.first_published_at desc, r.slug
    limit ${listLengths.reports}`);
  const requests = await db.execute<{ tool_name: string; vote_count: number }>(sql`
    select coalesce(mk.name || ' ' || t.model, q.proposed_tool_name, 'an unnamed tool') as tool_name, q.vote_count
    from measurement_requests q left join tools t on t.id = q.tool_id left join makers mk on mk.id = t.maker_id
    where q.status in ('open', 'planned')
    order by q.vote_count desc, q.created_at desc
    limit ${listLengths.requests}`);
  // A tool's results are those of the current revisions of its reports that are not retracted, as frozen at approval.
  const tools = await db.execute<{ name: string }>(sql`
    select mk.name || ' ' || t.model as name
    from tools t join makers mk on mk.id = t.maker_id
    join (
      select (jsonb_array_elements(rr.content->'tools')->>'id')::uuid as tool_id, max(rr.published_at) as newest
      from reports r join report_revisions rr on rr.id = r.published_revision_id
      where r.status = 'published' and rr.status = 'published'
      group by 1
    ) results on results.tool_id = t.id
    order by results.newest desc, mk.name, t.model, t.id
    limit ${listLengths.tools}`);
  return {
    reports: [...reports].map((row) => ({ title: row.title, verdicts: row.verdicts ?? [], retracted: row.status === "retracted" })),
    requests: [...requests].map((row) => ({ toolName: row.tool_name, votes: Number(row.vote_count) })),
    tools: [...tools].map((row) => row.name),
  };
}

async function headingsIn(section: Locator): Promise<string[]> {
  return (await section.getByRole("heading", { level: 3 }).allInnerTexts()).map((text) => text.trim());
}

/** What the page lists, in the same shape as the expectation. */
async function shownLists(page: Page): Promise<Expected> {
  await page.goto(url("/"));
  const reportsSection = page.getByRole("region", { name: "Latest reports" });
  const requestsSection = page.getByRole("region", { name: "Most-wanted measurements" });
  const toolsSection = page.getByRole("region", { name: "Tools with the newest results" });
  const reports = await Promise.all(
    (await reportsSection.getByRole("listitem").filter({ has: page.getByRole("heading", { level: 3 }) }).all()).map(async (card) => {
      const badges = await card.locator("li").allInnerTexts();
      return {
        title: (await card.getByRole("heading", { level: 3 }).innerText()).trim(),
        // Each badge reads "✓ meets rating × 2": the result once per count.
        verdicts: badges.flatMap((text) => {
          const match = /(meets rating|above rating|below rating|inconclusive)\D*(\d+)/.exec(text.replace(/\s+/g, " "));
          return match ? Array.from({ length: Number(match[2]) }, () => match[1]!) : [];
        }),
        retracted: (await card.getByText("Withdrawn verdicts:").count()) > 0 || (await card.getByText("Retracted", { exact: true }).count()) > 0,
      };
    }),
  );
  const requests = await Promise.all(
    (await requestsSection.getByRole("listitem").all()).map(async (item) => ({
      toolName: (await item.getByRole("heading", { level: 3 }).innerText()).trim(),
      votes: Number((await item.locator(".figure").first().innerText()).trim()),
    })),
  );
  return { reports, requests, tools: await headingsIn(toolsSection) };
}

const sortedVerdicts = (lists: Expected): Expected => ({ ...lists, reports: lists.reports.map((report) => ({ ...report, verdicts: [...report.verdicts].sort() })) });

describe.each([
  ["phone", PHONE_VIEWPORT],
  ["desktop", DESKTOP_VIEWPORT],
] as const)("the home page at %s width", (_name, viewport) => {
  let browser: E2eBrowser;
  let page: Page;

  beforeAll(async () => {
    browser = await launchBrowser({ viewport });
    page = await browser.newPage();
  });
  afterAll(() => browser.close());

  it("lists the latest reports with their verdicts, the most-wanted requests and the tools with the newest results, as the database has them", async () => {
    await expect
      .poll(async () => {
        const [shown, expected] = await Promise.all([shownLists(page), expectedLists()]);
        return JSON.stringify(sortedVerdicts(shown)) === JSON.stringify(sortedVerdicts(expected)) ? "same" : JSON.stringify({ shown, expected });
      }, cacheCeiling)
      .toBe("same");
    const expected = await expectedLists();
    expect(expected.reports.length).toBeGreaterThan(0);
    expect(expected.requests.length).toBeGreaterThan(0);
    expect(expected.tools.length).toBeGreaterThan(0);
  });

  it("fits the width, and links each section to its full list and the feed", async () => {
    await page.goto(url("/"));
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await expect.poll(() => page.getByRole("link", { name: "All reports" }).getAttribute("href")).toBe("/reports");
    expect(await page.getByRole("link", { name: "All requests" }).getAttribute("href")).toBe("/requests");
    expect(await page.getByRole("link", { name: "All tested tools" }).getAttribute("href")).toBe("/tools?published=yes&sort=newestResult");
    expect(await page.getByRole("link", { name: /Atom feed/ }).getAttribute("href")).toBe("/feed.xml");
    expect(await page.locator('link[rel="alternate"][type="application/atom+xml"]').getAttribute("href")).toMatch(/\/feed\.xml$/);
    const feed = await browser.context.request.get(url("/feed.xml"));
    expect(feed.status()).toBe(200);
    expect(await feed.text()).toContain('<feed xmlns="http://www.w3.org/2005/Atom">');
  });
});
