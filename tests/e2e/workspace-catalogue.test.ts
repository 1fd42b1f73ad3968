import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { DESKTOP_VIEWPORT, browserForSuite, launchBrowser, openHydrated, signIn, url, visible } from "../support/e2e";

const reviewer = demoPeople.find((person) => person.role === "reviewer")!;
const reader = demoPeople.find((person) => person.role === "reader")!;
const mark = randomUUID().slice(0, 6);


describe("a reviewer fills the workspace catalogue", () => {
  const suite = browserForSuite(DESKTOP_VIEWPORT, { signInAs: { email: reviewer.email, password: demoPassword } });
  let page: Page;
  beforeAll(() => {
    page = suite.page;
  });

  it("adds a tool after being told what to fix, then a photo that the public page serves in web sizes", async () => {
    const model = `Aeris E2E ${mark}`;
    await openHydrated(page, "/workspace/tools/new");
    await page.getByLabel("Maker", { exact: true }).selectOption({ label: "Quillfern Thermal" });
    await page.getByLabel("Kind of tool").selectOption({ label: "Hot-air rework station" });
    await page.getByLabel("Rated power input (W)").fill("650");
    await page.getByLabel("Rated voltage, or the lower end of a range (V)").fill("240");
    await page.getByLabel("Upper end of the voltage range (V)").fill("220");
    await page.getByLabel("Rated frequency").selectOption("50/60");
    await page.getByRole("button", { name: "Add tool" }).click();
    await visible(page, "Enter the model as the maker names it.");
    await visible(page, "The upper end of the voltage range cannot be below the lower end.");
    await expect.poll(() => page.getByLabel("Model", { exact: true }).getAttribute("aria-invalid")).toBe("true");

    await page.getByLabel("Model", { exact: true }).fill(model);
    await page.getByLabel("Upper end of the voltage range (V)").fill("");
    await page.getByRole("button", { name: "Add an accessory" }).click();
    await page.getByLabel("Name", { exact: true }).fill("Round nozzle");
    await page.getByLabel("Size", { exact: true }).fill("8 mm");
    await Promise.all([page.waitForURL(/\/workspace\/tools\/[a-z0-9-]+\/edit\?created=1$/, { timeout: 30_000 }), page.getByRole("button", { name: "Add tool" }).click()]);
    const slug = /\/workspace\/tools\/([a-z0-9-]+)\/edit/.exec(page.url())![1]!;
    expect(slug).toBe(`quillfern-thermal-aeris-e2e-${mark}`);

    const photo = await sharp({ create: { width: 1800, height: 1200, channels: 3, background: "#a5481f" } })
      .jpeg()
      .withMetadata({ exif: { IFD0: { Artist: "Someone Private" } } })
      .toBuffer();
    await page.getByLabel("Photo", { exact: true }).setInputFiles({ name: "front.jpg", mimeType: "image/jpeg", buffer: photo });
    await page.getByRole("button", { name: "Upload photo" }).click();
    await visible(page, "Describe the photo for readers who cannot see it.");
    await page.getByLabel("Photo", { exact: true }).setInputFiles({ name: "front.jpg", mimeType: "image/jpeg", buffer: photo });
    await page.getByLabel("Alt text").fill("Front panel of the test station with its handle in the cradle");
    await page.getByRole("button", { name: "Upload photo" }).click();
    await visible(page, "Photo added.");

    await page.goto(url(`/tools/${slug}`));
    const image = page.getByRole("img", { name: "Front panel of the test station with its handle in the cradle" });
    const srcset = await image.getAttribute("srcset");
    expect(srcset).toMatch(/\/api\/tool-photos\/[0-9a-f-]+\/480 480w, .*\/960 960w, .*\/1600 1600w$/);
    const largest = await suite.context.request.get(url(srcset!.split(", ").at(-1)!.split(" ")[0]!));
    expect(largest.headers()["content-type"]).toBe("image/webp");
    const stored = await sharp(await largest.body()).metadata();
    expect(stored).toMatchObject({ format: "webp", width: 1600, height: 1067 });
    expect(stored.exif).toBeUndefined();
    await visible(page, "Round nozzle");
  });

  it("registers an instrument with its accuracy line", async () => {
    const serial = `E2E-${mark}`;
    await openHydrated(page, "/workspace/instruments/new");
    await page.getByLabel("Kind", { exact: true }).selectOption({ label: "Current clamp" });
    await page.getByLabel("Maker", { exact: true }).fill("Halvard Instruments");
    await page.getByLabel("Model", { exact: true }).fill("HC-40 AC/DC clamp");
    await page.getByLabel("Serial number").fill(serial);
    await page.getByLabel("Quantity").selectOption("current");
    await page.getByLabel("Unit", { exact: true }).fill("A");
    await page.getByLabel("Range maximum").fill("40");
    await page.getByLabel("Accuracy ±(% + offset)").fill("1.5 A");
    await page.getByLabel("Calibrated on").fill("2026-03-01");
    await page.getByLabel("Calibration due on").fill("2027-03-01");
    await page.getByRole("button", { name: "Add instrument" }).click();
    await visible(page, /is not a plain number or percentage/);

    await page.getByLabel("Accuracy ±(% + offset)").fill("1.5% + 0.05");
    await Promise.all([page.waitForURL(/\/workspace\/instruments\?saved=1$/, { timeout: 30_000 }), page.getByRole("button", { name: "Add instrument" }).click()]);
    await page.getByLabel("Filter instruments").fill(serial);
    const row = page.getByRole("row").filter({ hasText: serial });
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.innerText()).toMatch(/Current ≤ 40 A: ±\(1\.5% \+ 0\.05 A\)/);
  });

  it("writes a protocol, revises it, and both versions stay readable", async () => {
    const name = `E2E bench protocol ${mark}`;
    await openHydrated(page, "/workspace/protocols/new");
    expect(await page.getByLabel("Safety cautions").inputValue()).toMatch(/Never float an oscilloscope's ground/);
    await page.getByLabel("Name", { exact: true }).fill(name);
    await page.getByLabel("Summary").fill("Power input and airflow of a hot-air station at 230 V.");
    await page.getByLabel("Supply voltage (V)").fill("230");
    await page.getByLabel("Supply frequency").selectOption("50");
    await page.getByLabel("Power input at full demand (W)").check();
    await page.getByLabel("Airflow (L/min)").check();
    await page.getByLabel("Steps (MDX)").fill("## Set-up\n\n1. Fit the 6 mm nozzle.\n\n<script>window.__ran = true</script>");
    await Promise.all([page.waitForURL(/\/workspace\/protocols\/e2e-bench-protocol-[a-z0-9-]+$/, { timeout: 30_000 }), page.getByRole("button", { name: "Create protocol" }).click()]);
    await visible(page, "Safety cautions: read before you start");
    await visible(page, "Fit the 6 mm nozzle.");
    expect(await page.evaluate(() => (window as unknown as { __ran?: boolean }).__ran)).toBeUndefined();
    const protocolUrl = page.url();

    await page.getByRole("link", { name: "Revise (adds version 2)" }).click();
    await page.waitForURL(`${protocolUrl}/edit`);
    await page.getByLabel("Repeats of each measurement").fill("5");
    await Promise.all([page.waitForURL(`${protocolUrl}?version=2`, { timeout: 30_000 }), page.getByRole("button", { name: "Save as a new version" }).click()]);
    const history = page.getByRole("region", { name: "Version history" });
    await expect.poll(() => history.getByRole("listitem").count()).toBe(2);
    await history.getByRole("link", { name: "v1" }).click();
    await page.waitForURL(`${protocolUrl}?version=1`);
    await visible(page, "An older version:");
    expect(await page.getByText(/Each repeated/).innerText()).toMatch(/Each repeated 3 times/);
  });
});

describe("a reader", () => {
  it("is refused the catalogue pages by the server", async () => {
    const browser = await launchBrowser();
    try {
      await signIn(await browser.newPage(), reader.email, demoPassword);
      for (const path of ["/workspace/tools", "/workspace/tools/new", "/workspace/instruments", "/workspace/instruments/new", "/workspace/protocols", "/workspace/protocols/new"]) {
        const response = await browser.context.request.get(url(path), { maxRedirects: 0 });
        expect(response.status(), path).toBe(403);
      }
    } finally {
      await browser.close();
    }
  });
});
