import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";
import { expectExactlyOnce, listMessages } from "../support/mail";

const editor = demoPeople.find((person) => person.role === "editor")!;
const run = randomUUID().slice(0, 8);
const toolName = `Halvard TS-${run} hot-air station`;

// Server actions answer in well under a second on a built app; the margin is for a cold dev server.
const patiently = { timeout: 15_000 };

type Reader = { name: string; email: string; browser: E2eBrowser; page: Page };

async function signUpReader(name: string): Promise<Reader> {
  const browser = await launchBrowser();
  const page = await browser.newPage();
  const email = `e2e-requests-${run}-${name.split(" ")[0]!.toLowerCase()}@tests.benchplate.test`;
  await page.goto(url("/sign-up"));
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Password", { exact: true }).fill("e2e-reader-password");
  await page.getByLabel("Password again").fill("e2e-reader-password");
  await page.getByRole("button", { name: "Create reader account" }).click();
  await page.waitForURL(url("/account"));
  return { name, email, browser, page };
}

async function postRequest(reader: Reader, whatToMeasure: string): Promise<string> {
  await reader.page.goto(url("/requests/new"));
  await reader.page.getByLabel("Or a tool not in the catalogue").fill(toolName);
  await reader.page.getByLabel("What to measure").fill(whatToMeasure);
  await reader.page.getByLabel("Why it matters to you").fill("It shares a 10 A circuit with the bench supply and the scope.");
  await reader.page.getByRole("button", { name: "Post the request" }).click();
  await reader.page.waitForURL(/\/requests\/[0-9a-f-]{36}$/);
  return new URL(reader.page.url()).pathname.split("/").pop()!;
}

async function vote(reader: Reader, requestId: string) {
  await reader.page.goto(url(`/requests/${requestId}`));
  await reader.page.getByRole("button", { name: /^Vote for/ }).click();
  await expect.poll(() => reader.page.getByRole("button", { name: /^Withdraw your vote/ }).count(), patiently).toBe(1);
}

describe("a measurement request from posting through votes and a merge to being planned", () => {
  let asker: Reader;
  let duplicateAsker: Reader;
  let voter: Reader;
  let editorBrowser: E2eBrowser;
  let requestId: string;
  let duplicateId: string;

  beforeAll(async () => {
    [asker, duplicateAsker, voter] = await Promise.all([signUpReader("Odile Marsh"), signUpReader("Piet Varga"), signUpReader("Sunniva Holt")]);
    editorBrowser = await launchBrowser();
  });
  afterAll(async () => {
    for (const browser of [asker?.browser, duplicateAsker?.browser, voter?.browser, editorBrowser]) await browser?.close();
  });

  it("a reader posts a request that starts with their own vote; the form names what is missing", async () => {
    await asker.page.goto(url("/requests/new"));
    await asker.page.getByRole("button", { name: "Post the request" }).click();
    await expect.poll(() => asker.page.getByText("Choose a catalogued tool, or name one that is not in the catalogue yet.").isVisible(), patiently).toBe(true);
    await expect.poll(() => asker.page.getByText("Say what you would like measured.").isVisible(), patiently).toBe(true);

    requestId = await postRequest(asker, "Real power at 450 °C and the burst-fire pattern of the heater on 230 V.");
    await expect.poll(() => asker.page.getByRole("heading", { level: 1, name: toolName }).isVisible(), patiently).toBe(true);
    await expect.poll(() => asker.page.getByRole("button", { name: `Withdraw your vote for ${toolName} (1 vote)` }).count(), patiently).toBe(1);
  });

  it("another reader asks the same again, and two readers vote", async () => {
    duplicateId = await postRequest(duplicateAsker, "How does the heater switch? My lamp flickers when it runs.");
    await vote(duplicateAsker, requestId);
    await vote(voter, duplicateId);
    await asker.page.goto(url(`/requests/${duplicateId}`));
    await expect.poll(() => asker.page.getByRole("button", { name: `Vote for ${toolName} (2 votes)` }).count(), patiently).toBe(1);
  });

  it("an editor merges the duplicate: its votes move, and nobody counts twice", async () => {
    const page = await editorBrowser.newPage();
    await signIn(page, editor.email, demoPassword);
    await page.goto(url(`/desk/requests/${duplicateId}`));
    await page.getByLabel("Duplicates this request").selectOption(requestId);
    await page.getByRole("button", { name: "Merge into it" }).click();
    // The duplicate's voters are its asker (who also voted for the original) and one other: one vote moves.
    await page.waitForURL((current) => current.pathname === `/desk/requests/${requestId}`);
    await expect.poll(() => page.getByText("Merged into this request: it gained 1 vote; 2 people told by e-mail.").isVisible(), patiently).toBe(true);
    await expect.poll(() => page.getByText("3 votes", { exact: true }).isVisible(), patiently).toBe(true);
    await page.getByLabel("New status").selectOption("planned");
    await page.getByRole("button", { name: "Change status" }).click();
    await expect.poll(() => page.getByText("Now planned; 3 people told by e-mail.").isVisible(), patiently).toBe(true);
  });

  it("readers see the merge and the plan on the request's page", async () => {
    await voter.page.goto(url(`/requests/${duplicateId}`));
    await expect.poll(() => voter.page.getByText("This request asked for the same as another").isVisible(), patiently).toBe(true);
    await voter.page.getByRole("link", { name: `the request for ${toolName}` }).click();
    await voter.page.waitForURL(url(`/requests/${requestId}`));
    await expect.poll(() => voter.page.getByRole("heading", { name: "Merged into this one" }).isVisible(), patiently).toBe(true);
    await expect.poll(() => voter.page.getByRole("button", { name: `Withdraw your vote for ${toolName} (3 votes)` }).count(), patiently).toBe(1);
    await expect.poll(() => voter.page.getByRole("listitem").filter({ hasText: "Planned" }).count(), patiently).toBeGreaterThan(0);
  });

  it("the requester and the voters each get every mail exactly once", async () => {
    const merged = `Merged with another request: ${toolName}`;
    const planned = `Planned for the bench: ${toolName}`;
    for (const reader of [duplicateAsker, voter]) {
      const mail = await expectExactlyOnce(reader.email, merged);
      expect(mail.text).toContain(`/requests/${requestId}`);
    }
    for (const reader of [asker, duplicateAsker, voter]) {
      const mail = await expectExactlyOnce(reader.email, planned);
      expect(mail.text).toMatch(/\/unsubscribe\/[A-Za-z0-9_-]{32}\?topic=request_update/);
    }
    expect((await listMessages(asker.email)).filter((message) => message.subject === merged)).toHaveLength(0);
  });
});
