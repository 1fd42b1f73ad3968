import { mkdtemp, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Locator, type Page } from "playwright-core";
import { afterAll, beforeAll, expect } from "vitest";

// Not BASE_URL: vitest fills process.env.BASE_URL with Vite's public base path ("/").
export const BASE_URL = (process.env.E2E_BASE_URL ?? "http://localhost:3100").replace(/\/$/, "");

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

// Headless Debian chromium as root in a container; the last rule stops it from resolving anything beyond loopback.
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE localhost, EXCLUDE 127.0.0.1",
];

export type E2eBrowser = {
  context: BrowserContext;
  newPage: () => Promise<Page>;
  close: () => Promise<void>;
};

/**
 * A fresh browser profile per call (so sessions never leak between tests); `close` removes it again.
 * launchPersistentContext because passing --user-data-dir to launch() fails.
 */
export async function launchBrowser(options: { viewport?: { width: number; height: number } } = {}): Promise<E2eBrowser> {
  const profileDir = await mkdtemp(path.join(os.tmpdir(), "benchplate-e2e-"));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: options.viewport ?? { width: 1280, height: 800 },
  });
  return {
    context,
    newPage: () => context.newPage(),
    close: async () => {
      await context.close();
      await rm(profileDir, { recursive: true, force: true });
    },
  };
}

/**
 * One browser at this size for the tests of a describe block: opened before them (signed in when `signInAs` is given),
 * closed (profile removed) after.
 */
export function browserForSuite(
  viewport: { width: number; height: number },
  { signInAs }: { signInAs?: { email: string; password: string } } = {},
): { readonly page: Page; readonly context: BrowserContext } {
  let browser: E2eBrowser | undefined;
  let page: Page | undefined;
  beforeAll(async () => {
    browser = await launchBrowser({ viewport });
    page = await browser.newPage();
    if (signInAs) await signIn(page, signInAs.email, signInAs.password);
  });
  afterAll(async () => {
    await browser?.close();
  });
  const open = () => {
    if (!browser || !page) throw new Error("the suite's browser is not open yet");
    return { browser, page };
  };
  return {
    get page() {
      return open().page;
    },
    get context() {
      return open().browser.context;
    },
  };
}

export const PHONE_VIEWPORT = { width: 390, height: 844 };
export const DESKTOP_VIEWPORT = { width: 1280, height: 800 };

export function url(pathname: string): string {
  return `${BASE_URL}${pathname.startsWith("/") ? pathname : `/${pathname}`}`;
}

/** Signs in through the real form and waits until the app has navigated away from the sign-in page. */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(url("/sign-in"));
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await Promise.all([
    page.waitForURL((current) => !current.pathname.startsWith("/sign-in"), { timeout: 15_000 }),
    page.getByRole("button", { name: "Sign in" }).click(),
  ]);
}

/**
 * Waits until React has hydrated this element. A change made before then reaches no handler and is lost, as it would
 * be for a reader quicker than the page's JavaScript, so a test that acts at once on a fresh page waits for this.
 */
export async function hydrated(locator: Locator, timeout = 20_000): Promise<void> {
  await expect
    .poll(() => locator.evaluate((element) => Object.keys(element).some((key) => key.startsWith("__reactProps$"))), { timeout })
    .toBe(true);
}

/** Opens a page and waits until React has hydrated it, for a test that acts on its client-side controls at once. */
export async function openHydrated(page: Page, pathname: string): Promise<void> {
  await page.goto(url(pathname));
  await hydrated(page.locator("body"));
}

/** Waits until the first element with this text is visible. */
export async function visible(page: Page, text: string | RegExp, timeout = 20_000): Promise<void> {
  await expect.poll(() => page.getByText(text).first().isVisible(), { timeout }).toBe(true);
}
