import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BASE_URL, launchBrowser, type E2eBrowser } from "../support/e2e";

describe("smoke", () => {
  let browser: E2eBrowser;

  beforeAll(async () => {
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("serves the home page", async () => {
    const page = await browser.newPage();
    const response = await page.goto(`${BASE_URL}/`);
    expect(response?.status()).toBe(200);
    expect(await page.title()).toContain("Benchplate");
  });
});
