import type { Page } from "playwright-core";
import { demoRuns } from "@/db/seeds/bench-runs-data";
import { seededRequestIds } from "@/db/seeds/community-data";
import { demoPublications } from "@/db/seeds/editorial-data";
import { demoTools } from "@/db/seeds/people-and-catalogue-data";
import type { pageAccess } from "@/lib/authz";

export type ReaderPage = { pattern: keyof typeof pageAccess; path: string; signedIn?: boolean };

const report = demoPublications[0]!;

/**
 * Every reader page with the demo data, some in more than one state (filtered, with a query, with the comment form a
 * signed-in reader sees). The browser tests check each for accessibility and fit; `npm run bench:route-js` weighs each.
 */
export const readerPages: ReaderPage[] = [
  { pattern: "/", path: "/" },
  { pattern: "/tools", path: "/tools" },
  { pattern: "/tools", path: "/tools?category=hot_air_station&published=yes&sort=ratedPower&order=desc" },
  { pattern: "/tools/[slug]", path: `/tools/${demoTools[0]!.slug}` },
  { pattern: "/reports", path: "/reports" },
  { pattern: "/reports/[slug]", path: `/reports/${report.slug}` },
  { pattern: "/reports/[slug]", path: `/reports/${report.slug}`, signedIn: true },
  { pattern: "/reports/[slug]/revisions/[number]", path: `/reports/${report.slug}/revisions/1` },
  { pattern: "/reports/[slug]/diff", path: `/reports/${report.slug}/diff?from=1&to=2` },
  { pattern: "/requests", path: "/requests" },
  { pattern: "/requests/[id]", path: `/requests/${seededRequestIds.mostWanted}` },
  { pattern: "/requests/new", path: "/requests/new", signedIn: true },
  { pattern: "/sign-in", path: "/sign-in" },
  { pattern: "/sign-up", path: "/sign-up" },
  { pattern: "/reset-password", path: "/reset-password" },
  { pattern: "/reset-password/[token]", path: `/reset-password/${"x".repeat(43)}` },
  { pattern: "/unsubscribe/[token]", path: `/unsubscribe/${"x".repeat(32)}?topic=request_update` },
  { pattern: "/account-deleted", path: "/account-deleted" },
  // Two tools measured under different supplies, so the comparability warnings show.
  { pattern: "/compare", path: `/compare?a=${demoRuns[0]!.toolSlug}&b=${demoRuns[1]!.toolSlug}` },
  { pattern: "/compare", path: "/compare" },
  { pattern: "/search", path: "/search?q=station" },
];

/**
 * Scrolls down a window at a time to the end and back to the top, so every drawing that waits until it is near the
 * window has been asked for, then waits until the network is quiet again.
 */
export async function scrollThrough(page: Page): Promise<void> {
  const steps = await page.evaluate(() => Math.ceil(document.documentElement.scrollHeight / window.innerHeight));
  for (let step = 1; step <= steps; step += 1) {
    await page.evaluate((at) => window.scrollTo(0, at * window.innerHeight), step);
    await page.waitForTimeout(50);
  }
  await page.waitForLoadState("networkidle");
  await page.evaluate(() => window.scrollTo(0, 0));
}
