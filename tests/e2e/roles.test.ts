import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seededRequestIds } from "@/db/seeds/community-data";
import { demoRuns } from "@/db/seeds/bench-runs-data";
import { demoPublications } from "@/db/seeds/editorial-data";
import { seededReportIds } from "@/db/seeds/reports-data";
import { demoPassword, demoPeople, demoTools } from "@/db/seeds/people-and-catalogue-data";
import { demoInstruments, demoProtocols } from "@/db/seeds/workspace-catalogue-data";
import { can, pageAccess, roleNavigation, roles, type Access, type Role } from "@/lib/authz";
import { DESKTOP_VIEWPORT, PHONE_VIEWPORT, launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";

// Concrete paths for each page pattern; unknown ids still exercise the role check before the lookup.
const samplePaths: Record<keyof typeof pageAccess, string> = {
  "/": "/",
  "/tools": "/tools",
  "/tools/[slug]": `/tools/${demoTools[0]!.slug}`,
  "/sign-in": "/sign-in",
  "/sign-up": "/sign-up",
  "/reset-password": "/reset-password",
  "/reset-password/[token]": `/reset-password/${"x".repeat(43)}`,
  "/account": "/account",
  "/workspace": "/workspace",
  "/desk": "/desk",
  "/admin": "/admin",
  "/admin/mail": "/admin/mail",
  // workspace: tools catalogue, instruments, protocols (the demo reviewer keeps the first lab's register and wrote the first protocol)
  "/workspace/tools": "/workspace/tools",
  "/workspace/tools/new": "/workspace/tools/new",
  "/workspace/tools/[slug]/edit": `/workspace/tools/${demoTools[0]!.slug}/edit`,
  "/workspace/instruments": "/workspace/instruments",
  "/workspace/instruments/new": "/workspace/instruments/new",
  "/workspace/instruments/[id]/edit": `/workspace/instruments/${demoInstruments[0]!.id}/edit`,
  "/workspace/protocols": "/workspace/protocols",
  "/workspace/protocols/new": "/workspace/protocols/new",
  "/workspace/protocols/[slug]": `/workspace/protocols/${demoProtocols[0]!.slug}`,
  "/workspace/protocols/[slug]/edit": `/workspace/protocols/${demoProtocols[0]!.slug}/edit`,
  // readers' voice, mail, audit
  "/requests": "/requests",
  "/requests/[id]": `/requests/${seededRequestIds.mostWanted}`,
  "/requests/new": "/requests/new",
  "/unsubscribe/[token]": `/unsubscribe/${"x".repeat(32)}?topic=request_update`,
  "/account-deleted": "/account-deleted",
  "/desk/requests": "/desk/requests",
  "/desk/requests/[id]": `/desk/requests/${seededRequestIds.mostWanted}`,
  "/desk/audit": "/desk/audit",
  // editorial desk, publishing, comments (the demo reviewer's published report, corrected in revision 2)
  "/reports": "/reports",
  "/reports/[slug]": `/reports/${demoPublications[0]!.slug}`,
  "/reports/[slug]/revisions/[number]": `/reports/${demoPublications[0]!.slug}/revisions/1`,
  "/reports/[slug]/diff": `/reports/${demoPublications[0]!.slug}/diff?from=1&to=2`,
  "/desk/reports/[id]": `/desk/reports/${demoPublications[0]!.id}`,
  "/desk/comments": "/desk/comments",
  "/workspace/reports/[id]/revise": `/workspace/reports/${demoPublications[0]!.id}/revise`,
  // workspace: reports
  "/workspace/reports": "/workspace/reports",
  "/workspace/reports/new": "/workspace/reports/new",
  "/workspace/reports/[id]": `/workspace/reports/${seededReportIds.wrenford}`,
  "/workspace/reports/[id]/view": `/workspace/reports/${seededReportIds.wrenford}/view`,
  // workspace: runs, captures, analyses (the demo reviewer's own run and its waveform capture)
  "/workspace/runs": "/workspace/runs",
  "/workspace/runs/new": "/workspace/runs/new",
  "/workspace/runs/[id]": `/workspace/runs/${demoRuns[0]!.id}`,
  "/workspace/runs/[id]/captures/[captureId]": `/workspace/runs/${demoRuns[0]!.id}/captures/${demoRuns[0]!.captures[0]!.id}`,
  // readers: compare (the two demo labs' published tools)
  "/compare": `/compare?a=${demoRuns[0]!.toolSlug}&b=${demoRuns[1]!.toolSlug}`,
  // readers: catalogue and search (a word from the demo reports' bodies)
  "/search": "/search?q=station",
};

function demoAccount(role: Role) {
  const person = demoPeople.find((candidate) => candidate.role === role);
  if (!person) throw new Error(`no demo ${role}`);
  return person;
}

describe.each([null, ...roles])("signed in as %s", (role) => {
  let browser: E2eBrowser;

  beforeAll(async () => {
    browser = await launchBrowser({ viewport: DESKTOP_VIEWPORT });
    if (role) await signIn(await browser.newPage(), demoAccount(role).email, demoPassword);
  });
  afterAll(async () => browser?.close());

  it("sees exactly the navigation of the role", async () => {
    const page = await browser.newPage();
    await page.goto(url("/"));
    const nav = page.getByRole("navigation", { name: "Main" });
    for (const link of roleNavigation) {
      await expect
        .poll(() => nav.getByRole("link", { name: link.label, exact: true }).count())
        .toBe(can(role, link.permission) ? 1 : 0);
    }
    await page.close();
  });

  it("is served or refused by the server on every page, as the role map says", async () => {
    for (const [pattern, access] of Object.entries(pageAccess) as [keyof typeof pageAccess, Access][]) {
      const response = await browser.context.request.get(url(samplePaths[pattern]), { maxRedirects: 0 });
      const expected = can(role, access) ? 200 : role ? 403 : 307;
      expect(response.status(), `${pattern} as ${role ?? "anonymous"}`).toBe(expected);
      if (expected === 307) expect(response.headers().location).toContain("/sign-in?callbackUrl=");
    }
  });
});

describe("at phone width", () => {
  it("keeps the role navigation reachable", async () => {
    const browser = await launchBrowser({ viewport: PHONE_VIEWPORT });
    try {
      const page = await browser.newPage();
      await signIn(page, demoAccount("editor").email, demoPassword);
      await page.goto(url("/"));
      const deskLink = page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Editor's desk" });
      await expect.poll(() => deskLink.isVisible()).toBe(true);
      const box = await deskLink.boundingBox();
      expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE_VIEWPORT.width);
    } finally {
      await browser.close();
    }
  });
});
