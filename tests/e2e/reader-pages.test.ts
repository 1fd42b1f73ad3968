import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { pageAccess, type Access } from "@/lib/authz";
import { expectNoSeriousAxeViolations } from "../support/axe";
import { DESKTOP_VIEWPORT, PHONE_VIEWPORT, launchBrowser, signIn, url, type E2eBrowser } from "../support/e2e";
import { readerPages, scrollThrough } from "../support/reader-pages";

const readerAccess: Access[] = ["public", "requests:ask"];

const reader = demoPeople.find((person) => person.role === "reader")!;

/** True when the page is wider than the window, i.e. the reader would have to scroll the whole page sideways. */
function overflowsSideways(page: Page): Promise<{ scrollWidth: number; innerWidth: number; widest: string | null }> {
  return page.evaluate(() => {
    const { scrollWidth } = document.documentElement;
    // Names the element reaching furthest right, so a failure says what to fix.
    let widest: string | null = null;
    let furthest = window.innerWidth;
    for (const element of Array.from(document.body.querySelectorAll("*"))) {
      const right = element.getBoundingClientRect().right;
      if (right > furthest + 0.5) {
        furthest = right;
        widest = `${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ""}.${String(element.getAttribute("class") ?? "").split(" ").slice(0, 4).join(".")}`;
      }
    }
    return { scrollWidth, innerWidth: window.innerWidth, widest };
  });
}

type FocusStop = { label: string; shown: boolean; onScreen: boolean };

/** Tabs through the first stops from the top of the page and reports, for each, whether a focus indicator is drawn. */
async function firstTabStops(page: Page, count: number): Promise<FocusStop[]> {
  const stops: FocusStop[] = [];
  for (let index = 0; index < count; index += 1) {
    await page.keyboard.press("Tab");
    stops.push(
      await page.evaluate(() => {
        const element = document.activeElement as HTMLElement | null;
        if (!element || element === document.body) return { label: "(body)", shown: false, onScreen: false };
        const style = getComputedStyle(element);
        const outlined = style.outlineStyle !== "none" && parseFloat(style.outlineWidth) > 0;
        const ringed = style.boxShadow !== "none";
        const box = element.getBoundingClientRect();
        return {
          label: `${element.tagName.toLowerCase()} “${(element.textContent ?? element.getAttribute("aria-label") ?? "").trim().slice(0, 40)}”`,
          shown: outlined || ringed,
          onScreen: box.width > 1 && box.height > 1 && box.bottom > 0 && box.right > 0 && box.left < window.innerWidth,
        };
      }),
    );
  }
  return stops;
}

describe("every public page pattern is on this list", () => {
  it("names each reader page of the role map", () => {
    const listed = new Set(readerPages.map((entry) => entry.pattern));
    const missing = Object.entries(pageAccess)
      .filter(([pattern, access]) => readerAccess.includes(access) && !listed.has(pattern as keyof typeof pageAccess))
      .map(([pattern]) => pattern);
    expect(missing).toEqual([]);
  });
});

describe.each([
  ["phone", PHONE_VIEWPORT],
  ["desktop", DESKTOP_VIEWPORT],
])("reader pages at %s width", (width, viewport) => {
  let anonymous: E2eBrowser;
  let signedIn: E2eBrowser;

  beforeAll(async () => {
    [anonymous, signedIn] = await Promise.all([launchBrowser({ viewport }), launchBrowser({ viewport })]);
    await signIn(await signedIn.newPage(), reader.email, demoPassword);
  });
  afterAll(async () => {
    await Promise.all([anonymous?.close(), signedIn?.close()]);
  });

  it.each(readerPages.map((entry) => [`${entry.path}${entry.signedIn ? " (signed in)" : ""}`, entry] as const))("%s", async (name, entry) => {
    const page = await (entry.signedIn ? signedIn : anonymous).newPage();
    try {
      const response = await page.goto(url(entry.path), { waitUntil: "networkidle" });
      expect(response?.status(), name).toBe(200);
      // Charts are drawn once scrolled near; axe then sees the page as a reader who scrolled through it would.
      await scrollThrough(page);

      await expectNoSeriousAxeViolations(page, `${name} at ${width} width`);

      const overflow = await overflowsSideways(page);
      expect(overflow.scrollWidth, `${name} is wider than the ${width} window; widest: ${overflow.widest}`).toBeLessThanOrEqual(overflow.innerWidth);

      const stops = await firstTabStops(page, 4);
      expect(stops[0]?.label, `${name}: the first tab stop skips to the content`).toMatch(/Skip to content/);
      for (const stop of stops) {
        expect(stop, `${name}: focus indicator on ${stop.label}`).toMatchObject({ shown: true, onScreen: true });
      }
    } finally {
      await page.close();
    }
  });
});

describe("a report on paper", () => {
  let browser: E2eBrowser;

  beforeAll(async () => {
    browser = await launchBrowser({ viewport: DESKTOP_VIEWPORT });
    await signIn(await browser.newPage(), reader.email, demoPassword);
  });
  afterAll(async () => browser?.close());

  it("prints without navigation or controls, every table within the page and each chart's data shown", async () => {
    const page = await browser.newPage();
    const report = readerPages.find((entry) => entry.pattern === "/reports/[slug]")!;
    await page.goto(url(report.path), { waitUntil: "networkidle" });
    await page.emulateMedia({ media: "print" });
    // A4's printable width at the stylesheet's margins, in CSS pixels.
    await page.setViewportSize({ width: 686, height: 1000 });
    const printed = await page.evaluate(() => {
      const shown = (element: Element) => getComputedStyle(element).display !== "none" && (element as HTMLElement).offsetParent !== null;
      const controls = Array.from(document.querySelectorAll("body nav, form, button, select, textarea, input")).filter(shown);
      const dataTables = Array.from(document.querySelectorAll("figure details table"));
      const pageWidth = document.documentElement.clientWidth;
      return {
        controls: controls.map((element) => element.outerHTML.slice(0, 80)),
        dataTables: dataTables.length,
        hiddenDataTables: dataTables.filter((table) => table.getBoundingClientRect().height === 0).length,
        tooWide: Array.from(document.querySelectorAll("table"))
          .filter((table) => table.getBoundingClientRect().right > pageWidth + 0.5)
          .map((table) => table.querySelector("caption")?.textContent ?? "a table"),
        paper: getComputedStyle(document.body).backgroundColor,
        ink: getComputedStyle(document.querySelector("h1")!).color,
      };
    });
    expect(printed.controls).toEqual([]);
    expect(printed.dataTables).toBeGreaterThan(0);
    expect(printed.hiddenDataTables).toBe(0);
    expect(printed.tooWide).toEqual([]);
    expect(printed.ink).toBe("rgb(0, 0, 0)");
    const pdf = await page.pdf({ format: "A4" });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    await page.close();
  });
});
