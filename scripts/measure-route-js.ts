// E2E_BASE_URL=http://localhost:3100 npm run bench:route-js: the JavaScript each reader page makes Chromium fetch, against
// a running app (E2E_BASE_URL, as for the browser tests; the test app on :3100 when unset). Each page opens in a fresh
// browser profile with the cache disabled, and the script counts every response Chromium classes as a script through
// the DevTools protocol: "transferred" is Network.loadingFinished's encodedDataLength (bytes on the wire, response
// headers included, compressed as served: `next start` gzips), "decoded" the sum of Network.dataReceived's dataLength
// (the scripts' own size). First load is everything fetched until the network is quiet after the load event; "after
// scrolling" adds what the page fetches as the reader scrolls through it (charts are fetched only near the window).
import type { CDPSession, Page } from "playwright-core";
import { demoPassword, demoPeople } from "@/db/seeds/people-and-catalogue-data";
import { BASE_URL, DESKTOP_VIEWPORT, launchBrowser, signIn, url } from "../tests/support/e2e";
import { readerPages, scrollThrough } from "../tests/support/reader-pages";

const reader = demoPeople.find((person) => person.role === "reader")!;

type ScriptTally = { count: number; transferred: number; decoded: number };
type RouteWeight = { route: string; firstLoad: ScriptTally; afterScrolling: ScriptTally };

/** Follows every script response on the page from now on; `tally()` adds up those finished so far. */
async function watchScripts(cdp: CDPSession) {
  const scripts = new Map<string, { transferred: number; decoded: number; finished: boolean }>();
  cdp.on("Network.responseReceived", (event) => {
    if (event.type === "Script") scripts.set(event.requestId, { transferred: 0, decoded: 0, finished: false });
  });
  cdp.on("Network.dataReceived", (event) => {
    const script = scripts.get(event.requestId);
    if (script) script.decoded += event.dataLength;
  });
  cdp.on("Network.loadingFinished", (event) => {
    const script = scripts.get(event.requestId);
    if (script) Object.assign(script, { transferred: event.encodedDataLength, finished: true });
  });
  await cdp.send("Network.enable");
  await cdp.send("Network.setCacheDisabled", { cacheDisabled: true });
  return {
    tally: (): ScriptTally => {
      const finished = [...scripts.values()].filter((script) => script.finished);
      return {
        count: finished.length,
        transferred: finished.reduce((sum, script) => sum + script.transferred, 0),
        decoded: finished.reduce((sum, script) => sum + script.decoded, 0),
      };
    },
  };
}

async function weigh(path: string, signedIn: boolean): Promise<RouteWeight> {
  const browser = await launchBrowser({ viewport: DESKTOP_VIEWPORT });
  try {
    if (signedIn) await signIn(await browser.newPage(), reader.email, demoPassword);
    const page: Page = await browser.newPage();
    const watcher = await watchScripts(await browser.context.newCDPSession(page));
    const response = await page.goto(url(path), { waitUntil: "networkidle" });
    if (response?.status() !== 200) throw new Error(`${path} answered ${response?.status()}`);
    const firstLoad = watcher.tally();
    await scrollThrough(page);
    return { route: `${path}${signedIn ? " (signed in)" : ""}`, firstLoad, afterScrolling: watcher.tally() };
  } finally {
    await browser.close();
  }
}

const kilobytes = (bytes: number) => (bytes / 1024).toFixed(1);

const weights: RouteWeight[] = [];
for (const entry of readerPages) weights.push(await weigh(entry.path, entry.signedIn ?? false));

console.log(`Script fetched on first load, ${BASE_URL}, cache disabled\n`);
console.log("| route | KB transferred | KB decoded | scripts | after scrolling: KB transferred | scripts |");
console.log("|---|---:|---:|---:|---:|---:|");
for (const { route, firstLoad, afterScrolling } of weights) {
  console.log(
    `| ${route} | ${kilobytes(firstLoad.transferred)} | ${kilobytes(firstLoad.decoded)} | ${firstLoad.count} | ${kilobytes(afterScrolling.transferred)} | ${afterScrolling.count} |`,
  );
}
