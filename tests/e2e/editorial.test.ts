import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDatabase, db } from "@/db";
import { reportAnalyses, reports, reportTools, users } from "@/db/schema";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { seededReportIds } from "@/db/seeds/reports-data";
import { DESKTOP_VIEWPORT, PHONE_VIEWPORT, launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";
import { expectExactlyOnce } from "../support/mail";

const editor = demoPeople.find((person) => person.role === "editor")!;
const reviewer = demoPeople.find((person) => person.email === "nadia.orlen@benchplate.test")!;
const run = randomUUID().slice(0, 8);
const title = `Aeris 720 on the desk ${run}`;
const slug = `aeris-720-on-the-desk-${run}`;

const patiently = { timeout: 15_000 };

/**
 * The reviewer's draft, written straight into the database from the seeded draft's tools and citations: what is under
 * test starts at "Submit for review". The body embeds the cited analysis so publishing has figures to freeze.
 */
async function writeDraft(): Promise<string> {
  const [author] = await db.select({ id: users.id }).from(users).where(eq(users.email, reviewer.email));
  const [tools, citations] = await Promise.all([
    db.select({ toolId: reportTools.toolId, position: reportTools.position }).from(reportTools).where(eq(reportTools.reportId, seededReportIds.wrenford)),
    db.select({ analysisId: reportAnalyses.analysisId, label: reportAnalyses.label }).from(reportAnalyses).where(eq(reportAnalyses.reportId, seededReportIds.wrenford)),
  ]);
  const label = citations.find((citation) => citation.label === "full-power")?.label ?? citations[0]!.label;
  const [row] = await db
    .insert(reports)
    .values({
      slug,
      title,
      authorId: author!.id,
      disclosure: "Bought at retail by the reviewer.",
      bodyMdx: `## Power input\n\n<VerdictTable analysis="${label}" />\n\nThe station draws close to its rating.\n`,
    })
    .returning({ id: reports.id });
  await db.insert(reportTools).values(tools.map((tool) => ({ ...tool, reportId: row!.id })));
  await db.insert(reportAnalyses).values(citations.map((citation) => ({ ...citation, reportId: row!.id })));
  return row!.id;
}

async function statusSays(page: Page, text: string | RegExp) {
  await expect.poll(() => page.getByRole("status").filter({ hasText: text }).count(), patiently).toBeGreaterThan(0);
}

describe("a report from submission through publication and a correction, and a comment through moderation", () => {
  let reviewerBrowser: E2eBrowser;
  let editorBrowser: E2eBrowser;
  let readerBrowser: E2eBrowser;
  let reviewerPage: Page;
  let editorPage: Page;
  let reportId: string;

  beforeAll(async () => {
    reportId = await writeDraft();
    [reviewerBrowser, editorBrowser, readerBrowser] = await Promise.all([
      launchBrowser({ viewport: DESKTOP_VIEWPORT }),
      launchBrowser({ viewport: DESKTOP_VIEWPORT }),
      launchBrowser({ viewport: PHONE_VIEWPORT }),
    ]);
    reviewerPage = await reviewerBrowser.newPage();
    editorPage = await editorBrowser.newPage();
    await signIn(reviewerPage, reviewer.email, demoPassword);
    await signIn(editorPage, editor.email, demoPassword);
  });
  afterAll(async () => {
    for (const browser of [reviewerBrowser, editorBrowser, readerBrowser]) await browser?.close();
    await closeDatabase();
  });

  it("the reviewer submits; the editors are told once", async () => {
    await reviewerPage.goto(url(`/workspace/reports/${reportId}`));
    await reviewerPage.getByRole("button", { name: "Submit for review" }).click();
    await statusSays(reviewerPage, "Submitted for review");
    const mail = await expectExactlyOnce(editor.email, `Submitted for review: ${title}`);
    expect(mail.text).toContain(`/desk/reports/${reportId}`);
  });

  it("the editor finds it in the queue, reads it as readers would and publishes it; the reviewer is told once", async () => {
    await editorPage.goto(url("/desk"));
    await editorPage.getByRole("link", { name: title }).click();
    await editorPage.waitForURL(url(`/desk/reports/${reportId}`));
    await expect.poll(() => editorPage.getByText("As readers would see it once approved").isVisible(), patiently).toBe(true);
    await editorPage.getByRole("button", { name: "Approve and publish" }).click();
    // The decision forms go once nothing waits; the page's status line says what happened.
    await statusSays(editorPage, "This report is published");
    await expectExactlyOnce(reviewer.email, `Published: ${title}`);

    const reader = await readerBrowser.newPage();
    await reader.goto(url(`/reports/${slug}`));
    await expect.poll(() => reader.getByRole("heading", { level: 1, name: title }).isVisible(), patiently).toBe(true);
    expect(await reader.getByRole("note", { name: "Correction" }).count()).toBe(0);
    await reader.close();
  });

  it("a correction goes to the desk, leaves the page alone until approved, then shows its notice and the history", async () => {
    await reviewerPage.goto(url(`/workspace/reports/${reportId}`));
    await reviewerPage.getByRole("link", { name: "Propose a correction or amendment" }).click();
    await reviewerPage.waitForURL(url(`/workspace/reports/${reportId}/revise`));
    await reviewerPage.getByLabel("Kind of revision").selectOption("correction");
    await reviewerPage.getByLabel("Change note").fill("The rating was judged without stating the 229 V supply; it is stated now.");
    const body = reviewerPage.getByLabel("Body (MDX)");
    await body.fill(`${await body.inputValue()}\nMeasured on a 229 V supply.\n`);
    await reviewerPage.getByRole("button", { name: "Send the revision to the desk" }).click();
    await statusSays(reviewerPage, /Revision 2 .*with the desk/);
    await expectExactlyOnce(editor.email, `Revision 2 proposed: ${title}`);

    const reader = await readerBrowser.newPage();
    await reader.goto(url(`/reports/${slug}`));
    await expect.poll(() => reader.getByRole("heading", { level: 1, name: title }).isVisible(), patiently).toBe(true);
    expect(await reader.getByText("Measured on a 229 V supply.").count()).toBe(0);

    await editorPage.goto(url(`/desk/reports/${reportId}`));
    await expect.poll(() => editorPage.getByRole("heading", { name: "What revision 2 changes" }).isVisible(), patiently).toBe(true);
    await editorPage.getByRole("button", { name: "Approve and publish the revision" }).click();
    await expect.poll(() => editorPage.getByRole("status").filter({ hasText: "waits for a decision" }).count(), patiently).toBe(0);
    await expectExactlyOnce(reviewer.email, `Revision 2 published: ${title}`);

    await reader.reload();
    const notice = reader.getByRole("note", { name: "Correction" });
    await expect.poll(() => notice.isVisible(), patiently).toBe(true);
    expect(await notice.textContent()).toContain("The rating was judged without stating the 229 V supply");
    expect(await reader.getByText("Measured on a 229 V supply.").isVisible()).toBe(true);
    const history = reader.getByRole("region", { name: "Revision history" });
    expect(await history.getByRole("link", { name: "Revision 1: Original" }).isVisible()).toBe(true);
    expect(await history.getByRole("link", { name: "Revision 2: Correction" }).isVisible()).toBe(true);
    const overflow = await reader.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);

    await history.getByRole("link", { name: "Revision 1: Original" }).click();
    await reader.waitForURL(url(`/reports/${slug}/revisions/1`));
    expect(await reader.getByText("An earlier revision.").isVisible()).toBe(true);
    expect(await reader.getByText("Measured on a 229 V supply.").count()).toBe(0);
    await reader.close();
  });

  it("a reader's comment waits for moderation, the editors are told once, and it shows once approved", async () => {
    const page = await readerBrowser.newPage();
    const email = `e2e-editorial-${run}@tests.benchplate.test`;
    await page.goto(url("/sign-up"));
    await page.getByLabel("Name").fill("Wenna Thorold");
    await page.getByLabel("Email").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("e2e-reader-password");
    await page.getByLabel("Password again").fill("e2e-reader-password");
    await page.getByRole("button", { name: "Create reader account" }).click();
    await page.waitForURL(url("/account"));

    const comment = `Which clamp range did you use? ${run}`;
    await page.goto(url(`/reports/${slug}`));
    await page.getByLabel("Your comment").fill(comment);
    await page.getByRole("button", { name: "Post the comment" }).click();
    await statusSays(page, "waiting for an editor");
    await expectExactlyOnce(editor.email, `Comment waiting for moderation: ${title}`);

    const anonymous = await launchBrowser({ viewport: PHONE_VIEWPORT });
    try {
      const visitor = await anonymous.newPage();
      await visitor.goto(url(`/reports/${slug}`));
      expect(await visitor.getByText(comment).count()).toBe(0);

      await editorPage.goto(url("/desk/comments"));
      const card = editorPage.getByRole("listitem").filter({ hasText: comment });
      await card.getByRole("button", { name: "Approve" }).click();
      // Approved, it leaves the waiting list.
      await expect.poll(() => card.count(), patiently).toBe(0);

      await visitor.reload();
      await expect.poll(() => visitor.getByText(comment).isVisible(), patiently).toBe(true);
    } finally {
      await anonymous.close();
      await page.close();
    }
  });
});
