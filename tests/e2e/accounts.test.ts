import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";
import { waitForMessage } from "../support/mail";

const admin = demoPeople.find((person) => person.role === "admin")!;

describe("a reader's account, end to end", () => {
  let readerBrowser: E2eBrowser;
  let adminBrowser: E2eBrowser;
  const email = `e2e-reader-${Date.now()}@tests.benchplate.test`;
  const name = "Ada Kettering";

  beforeAll(async () => {
    readerBrowser = await launchBrowser();
    adminBrowser = await launchBrowser();
  });
  afterAll(async () => {
    await readerBrowser?.close();
    await adminBrowser?.close();
  });

  it("signs up, lands signed in as a reader and receives the welcome e-mail", async () => {
    const page = await readerBrowser.newPage();
    await page.goto(url("/sign-up"));
    await page.getByLabel("Name").fill(name);
    await page.getByLabel("Email").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("short");
    await page.getByLabel("Password again").fill("short");
    await page.getByRole("button", { name: "Create reader account" }).click();
    await expect.poll(() => page.getByText("Use at least 10 characters.").isVisible()).toBe(true);

    await page.getByLabel("Password", { exact: true }).fill("e2e-reader-password");
    await page.getByLabel("Password again").fill("e2e-reader-password");
    await page.getByRole("button", { name: "Create reader account" }).click();
    await page.waitForURL(url("/account"));
    await expect.poll(() => page.getByText(`${email} · reader`).isVisible()).toBe(true);
    const welcome = await waitForMessage(email, "Welcome to Benchplate");
    expect(welcome.text).toContain(name);
  });

  it("uploads a picture that comes back as a square WebP", async () => {
    const page = await readerBrowser.newPage();
    await page.goto(url("/account"));
    const png = await sharp({ create: { width: 300, height: 200, channels: 3, background: "#2c6e68" } }).png().toBuffer();
    await page.getByLabel("New picture").setInputFiles({ name: "me.png", mimeType: "image/png", buffer: png });
    await page.getByRole("button", { name: "Upload picture" }).click();
    await expect.poll(() => page.getByText("Picture updated.").isVisible()).toBe(true);
    const src = await page.getByRole("img", { name: `${name}'s picture` }).getAttribute("src");
    const response = await readerBrowser.context.request.get(url(src!));
    expect(response.headers()["content-type"]).toBe("image/webp");
    expect(await sharp(await response.body()).metadata()).toMatchObject({ width: 256, height: 256 });
  });

  it("is promoted by an admin and loses the workspace on the very next request after demotion", async () => {
    const adminPage = await adminBrowser.newPage();
    await signIn(adminPage, admin.email, demoPassword);
    const setRole = async (role: string) => {
      await adminPage.goto(url("/admin"));
      await adminPage.getByLabel(`Role of ${name}`).selectOption(role);
      await adminPage.getByRole("row", { name: new RegExp(name) }).getByRole("button", { name: "Save" }).click();
      await expect.poll(() => adminPage.getByText(`Role changed to ${role}.`).isVisible()).toBe(true);
    };

    await setRole("reviewer");
    const readerRequest = readerBrowser.context.request;
    expect((await readerRequest.get(url("/workspace"), { maxRedirects: 0 })).status()).toBe(200);
    await setRole("reader");
    expect((await readerRequest.get(url("/workspace"), { maxRedirects: 0 })).status()).toBe(403);
  });

  it("resets a forgotten password through the e-mailed link, once", async () => {
    const page = await (await launchBrowser()).newPage();
    await page.goto(url("/reset-password"));
    await page.getByLabel("Email").fill(email);
    await page.getByRole("button", { name: "Send a reset link" }).click();
    await expect.poll(() => page.getByText(/a reset link is on its way/).isVisible()).toBe(true);
    const mail = await waitForMessage(email, "Reset your Benchplate password");
    const link = /https?:\/\/\S+\/reset-password\/\S+/.exec(mail.text)![0];

    await page.goto(link);
    await page.getByLabel("New password", { exact: true }).fill("a-fresh-password-2");
    await page.getByLabel("New password again").fill("a-fresh-password-2");
    await page.getByRole("button", { name: "Set the new password" }).click();
    await page.waitForURL(/\/sign-in\?reset=done/);
    await signIn(page, email, "a-fresh-password-2");

    await page.goto(link);
    await page.getByLabel("New password", { exact: true }).fill("yet-another-password");
    await page.getByLabel("New password again").fill("yet-another-password");
    await page.getByRole("button", { name: "Set the new password" }).click();
    await expect.poll(() => page.getByText(/expired or was already used/).isVisible()).toBe(true);
    await page.context().close();
  });

  it("refuses a wrong password with a message, not an error page", async () => {
    const browser = await launchBrowser();
    try {
      const page = await browser.newPage();
      await page.goto(url("/sign-in"));
      await page.getByLabel("Email").fill(email);
      await page.getByLabel("Password", { exact: true }).fill("not-the-password");
      await page.getByRole("button", { name: "Sign in" }).click();
      await expect.poll(() => page.getByText("That e-mail and password do not match an account.").isVisible()).toBe(true);
    } finally {
      await browser.close();
    }
  });
});
