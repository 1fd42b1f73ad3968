import { parse } from "csv-parse/sync";
import { eq } from "drizzle-orm";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { publishReport, retractReport } from "@/app/(desk)/desk/reports/actions";
import { GET as getFeed } from "@/app/(public)/feed.xml/route";
import { GET as getCsv } from "@/app/(public)/reports/[slug]/measurements.csv/route";
import { GET as getJson } from "@/app/(public)/reports/[slug]/measurements.json/route";
import { proposeRevision } from "@/app/(workspace)/workspace/reports/[id]/revise/actions";
import { citeAnalysis, createReport, submitReport, updateReport } from "@/app/(workspace)/workspace/reports/actions";
import robots from "@/app/robots";
import sitemap from "@/app/sitemap";
import { db } from "@/db";
import { listPublishedRevisionEvents, listRetractionEvents } from "@/db/queries/published-listings";
import { reports } from "@/db/schema";
import { idleActionState, type ActionState } from "@/lib/action-state";
import { serverEnv } from "@/lib/env";
import type { OpenDataColumn, OpenDataDocument, OpenDataValue } from "@/lib/open-data";
import { form, redirectOf, type ServerAction } from "../support/actions";
import { createAccount } from "../support/factories";
import { analyseFixtureCapture, createRun, createTool } from "../support/report-fixtures";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
// Every call reads the database: the point here is what the handlers make of it, not the cache.
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn(), unstable_cache: (load: () => unknown) => load }));
vi.mock("@/lib/jobs", () => ({ requestMailDelivery: vi.fn(async () => undefined) }));

type Account = Awaited<ReturnType<typeof createAccount>>;

let reviewer: Account;
let editor: Account;
let tool: Awaited<ReturnType<typeof createTool>>;
let analysisId: string;
let reportId: string;
let slug: string;

const title = "Open data from a hot-air station";
const body = `## Power input\n\n<VerdictTable analysis="full-power" />\n`;
const origin = () => serverEnv().APP_ORIGIN;

function call(action: ServerAction, fields: Record<string, string>): Promise<ActionState> {
  return action(idleActionState, form(fields));
}

type DownloadHandler = (request: Request, context: { params: Promise<{ slug: string }> }) => Promise<Response>;

function download(handler: DownloadHandler, path: string, headers: Record<string, string> = {}) {
  const [, , reportSlug] = path.split("/");
  return handler(new Request(`${origin()}${path}`, { headers }), { params: Promise.resolve({ slug: reportSlug! }) });
}

/** A CSV cell read back by its column's declared type: empty is null, numbers exactly as written. */
function cellValue(cell: string, column: OpenDataColumn): OpenDataValue {
  if (cell === "") return null;
  if (column.type === "number") return Number(cell);
  if (column.type === "boolean") return cell === "true" ? true : cell === "false" ? false : cell;
  return cell;
}

async function fetchBoth() {
  const csvResponse = await download(getCsv, `/reports/${slug}/measurements.csv`);
  const jsonResponse = await download(getJson, `/reports/${slug}/measurements.json`);
  expect(csvResponse.status).toBe(200);
  expect(jsonResponse.status).toBe(200);
  return { csvResponse, jsonResponse, csv: await csvResponse.text(), json: (await jsonResponse.json()) as OpenDataDocument };
}

/** The CSV parsed back with a standard parser equals the JSON download, record by record and field by field. */
function expectCsvEqualsJson(csv: string, json: OpenDataDocument) {
  const rows = parse(csv, { columns: false, skip_empty_lines: true }) as string[][];
  const [header, ...cells] = rows;
  const columns = json.metadata.columns;
  expect(header).toEqual(columns.map((column) => column.name));
  expect(cells).toHaveLength(json.records.length);
  cells.forEach((row, index) => {
    const record = json.records[index]!;
    expect(Object.keys(record)).toEqual(header);
    columns.forEach((column, position) => {
      expect(cellValue(row[position]!, column), `${column.name} of record ${index}`).toStrictEqual(record[column.name]);
    });
  });
}

async function feedEntries() {
  const response = await getFeed();
  expect(response.status).toBe(200);
  expect(response.headers.get("content-type")).toMatch(/^application\/atom\+xml/);
  const xml = await response.text();
  expect(XMLValidator.validate(xml)).toBe(true);
  const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "", isArray: (name) => ["entry", "link"].includes(name) }).parse(xml) as {
    feed: {
      xmlns: string;
      id: string;
      title: string;
      updated: string;
      author: { name: string };
      link: { rel: string; href: string }[];
      entry?: { id: string; title: string; updated: string; summary: { "#text": string }; author: { name: string }; link: { rel: string; href: string }[]; category: { term: string } }[];
    };
  };
  return parsed.feed;
}

beforeAll(async () => {
  [reviewer, editor] = await Promise.all([createAccount({ role: "reviewer", name: "Oriel Thane" }), createAccount({ role: "editor" })]);
  tool = await createTool();
  const run = await createRun({ reviewerId: reviewer.id, toolId: tool.id });
  ({ analysisId } = await analyseFixtureCapture({ runId: run.id }));

  actAs(reviewer);
  reportId = (await redirectOf(createReport, form({ title, toolId: tool.id }))).split("/").pop()!;
  expect((await call(citeAnalysis, { reportId, analysisId, label: "full-power" })).status).toBe("ok");
  expect((await call(updateReport, { reportId, title, toolId: tool.id, disclosure: "Bought at retail.", bodyMdx: body })).status).toBe("ok");
  expect((await call(submitReport, { reportId })).status).toBe("ok");
  actAs(editor);
  expect((await call(publishReport, { reportId })).status).toBe("ok");
  const [row] = await db.select({ slug: reports.slug }).from(reports).where(eq(reports.id, reportId));
  slug = row!.slug;
});
afterAll(() => actAs(null));

describe("measurement downloads", () => {
  it("gives the CSV and the JSON the same records, each numeric column named with its unit", async () => {
    const { csv, json, csvResponse, jsonResponse } = await fetchBoth();
    expect(json.records.length).toBeGreaterThanOrEqual(2);
    expectCsvEqualsJson(csv, json);

    const numeric = json.metadata.columns.filter((column) => column.type === "number");
    for (const column of numeric.filter((candidate) => candidate.unit !== null)) {
      expect(column.name.endsWith(`_${column.unit === "°C" ? "degC" : column.unit}`), column.name).toBe(true);
    }
    // Columns without a unit are counts, never quantities.
    expect(numeric.filter((column) => column.unit === null).map((column) => column.name)).toEqual(["report_revision", "protocol_version"]);
    expect(json.metadata.columns.map((column) => column.name)).toEqual(expect.arrayContaining(["value_W", "expanded_uncertainty_k2_W", "rated_W", "value_A"]));

    const power = json.records.find((record) => record.quantity_kind === "power_input_full_demand")!;
    expect(power).toMatchObject({ report_slug: slug, report_revision: 1, report_retracted: false, tool: tool.name, unit: "W", rated_W: 600, value_A: null, supply_voltage_V: 230 });
    expect(typeof power.value_W).toBe("number");
    expect(power.verdict).toMatch(/rating|inconclusive/);
    const current = json.records.find((record) => record.quantity_kind === "current")!;
    expect(current).toMatchObject({ unit: "A", value_W: null });
    expect(typeof current.value_A).toBe("number");

    expect(json.metadata).toMatchObject({
      report: { slug, title, author: "Oriel Thane", url: `${origin()}/reports/${slug}` },
      revision: { number: 1, kind: "original" },
      retracted: false,
      licence: { name: "CC BY 4.0" },
    });
    expect(json.metadata.attribution).toContain(`Oriel Thane, “${title}”, revision 1`);

    expect(csvResponse.headers.get("content-type")).toMatch(/^text\/csv; charset=utf-8/);
    expect(csvResponse.headers.get("content-disposition")).toBe(`attachment; filename="${slug}-revision-1-measurements.csv"`);
    expect(jsonResponse.headers.get("content-disposition")).toBe(`attachment; filename="${slug}-revision-1-measurements.json"`);
    expect(csvResponse.headers.get("cache-control")).toMatch(/public/);
    expect(csvResponse.headers.get("etag")).toBe(jsonResponse.headers.get("etag"));
  });

  it("writes numbers at full precision", async () => {
    const { csv, json } = await fetchBoth();
    const power = json.records.find((record) => record.quantity_kind === "power_input_full_demand")!;
    // The acceptance limits come from the uncertainty budget and carry every digit a double holds.
    expect(String(power.acceptance_upper_W)).toMatch(/\.\d{6,}/);
    expect(csv).toContain(String(power.acceptance_upper_W));
  });

  it("answers 304 to a reader whose copy is current, 404 for an unknown report, 422 for an address that is no slug", async () => {
    const { csvResponse } = await fetchBoth();
    const again = await download(getCsv, `/reports/${slug}/measurements.csv`, { "If-None-Match": csvResponse.headers.get("etag")! });
    expect(again.status).toBe(304);
    expect((await download(getJson, "/reports/no-such-report/measurements.json")).status).toBe(404);
    expect((await download(getJson, "/reports/Not_A_Slug!/measurements.json")).status).toBe(422);
  });

  it("serves nothing for a report that is not published", async () => {
    actAs(reviewer);
    const draftId = (await redirectOf(createReport, form({ title: "An unpublished draft", toolId: tool.id }))).split("/").pop()!;
    const [draft] = await db.select({ slug: reports.slug }).from(reports).where(eq(reports.id, draftId));
    expect((await download(getCsv, `/reports/${draft!.slug}/measurements.csv`)).status).toBe(404);
  });
});

describe("the Atom feed", () => {
  it("parses as Atom 1.0 with absolute links and an entry per published revision", async () => {
    const feed = await feedEntries();
    expect(feed.xmlns).toBe("http://www.w3.org/2005/Atom");
    expect(feed.id).toBe(`${origin()}/feed.xml`);
    expect(feed.author.name).toBe("Benchplate");
    expect(feed.link).toContainEqual(expect.objectContaining({ rel: "self", href: `${origin()}/feed.xml` }));
    const entries = feed.entry ?? [];
    for (const entry of entries) {
      expect(entry.id.startsWith(origin())).toBe(true);
      expect(entry.link[0]!.href.startsWith(`${origin()}/reports/`)).toBe(true);
      expect(Number.isNaN(Date.parse(entry.updated))).toBe(false);
    }
    // Newest first, and the feed is as new as its newest entry.
    const times = entries.map((entry) => entry.updated);
    expect([...times].sort().reverse()).toEqual(times);
    expect(feed.updated).toBe(times[0]);

    const first = entries.find((entry) => entry.id === `${origin()}/reports/${slug}/revisions/1`);
    expect(first).toMatchObject({ title, author: { name: "Oriel Thane" }, category: { term: "publication" } });
    expect(first!.summary["#text"]).toContain(`New report on ${tool.name}`);
  });

  it("adds an entry with the change note for a correction, and one with the reason for a retraction", async () => {
    actAs(reviewer);
    const note = "The supply voltage is stated now <and> the rating is judged at 230 V & 50 Hz.";
    expect(
      (
        await call(proposeRevision, {
          reportId,
          kind: "correction",
          changeNote: note,
          title,
          disclosure: "Bought at retail.",
          bodyMdx: `${body}\nThe supply was 229.4 V.\n`,
          "citations.0.label": "full-power",
          "citations.0.analysisId": analysisId,
        })
      ).status,
    ).toBe("ok");
    actAs(editor);
    expect((await call(publishReport, { reportId })).status).toBe("ok");
    const reason = "The unit tested was a pre-production sample, not the retail model.";
    expect((await call(retractReport, { reportId, reason })).status).toBe("ok");

    const entries = (await feedEntries()).entry ?? [];
    const ours = entries.filter((entry) => entry.id.startsWith(`${origin()}/reports/${slug}`));
    expect(ours.map((entry) => entry.category.term)).toEqual(["retraction", "correction", "publication"]);
    expect(ours[1]).toMatchObject({ title: `Correction to “${title}” (revision 2)`, id: `${origin()}/reports/${slug}/revisions/2` });
    expect(ours[1]!.summary["#text"]).toContain(note);
    expect(ours[0]).toMatchObject({ title: `Retracted: “${title}”`, id: `${origin()}/reports/${slug}#retraction` });
    expect(ours[0]!.summary["#text"]).toContain(reason);

    // Entry for entry, what the database holds as published revisions and retractions.
    const [revisions, retractions] = await Promise.all([listPublishedRevisionEvents({ limit: 50 }), listRetractionEvents({ limit: 50 })]);
    const expected = [
      ...revisions.map((event) => ({ id: `${origin()}/reports/${event.slug}/revisions/${event.number}`, updated: event.publishedAt.toISOString() })),
      ...retractions.map((event) => ({ id: `${origin()}/reports/${event.slug}#retraction`, updated: event.retractedAt.toISOString() })),
    ]
      .sort((a, b) => b.updated.localeCompare(a.updated) || a.id.localeCompare(b.id))
      .slice(0, 50);
    expect(entries.map((entry) => ({ id: entry.id, updated: entry.updated }))).toEqual(expected);
  });

  it("keeps the downloads of a retracted report, marked retracted and still equal to each other", async () => {
    const { csv, json, csvResponse } = await fetchBoth();
    expect(json.metadata).toMatchObject({ retracted: true, retractionReason: expect.stringContaining("pre-production"), revision: { number: 2, kind: "correction" } });
    expect(json.records.every((record) => record.report_retracted === true && record.report_revision === 2)).toBe(true);
    expect(csvResponse.headers.get("content-disposition")).toBe(`attachment; filename="${slug}-revision-2-retracted-measurements.csv"`);
    expectCsvEqualsJson(csv, json);
  });
});

describe("sitemap and robots", () => {
  it("lists the reader pages with absolute addresses, every readable report and every tool", async () => {
    const entries = await sitemap();
    const urls = entries.map((entry) => entry.url);
    for (const path of ["/", "/tools", "/reports", "/requests"]) expect(urls).toContain(`${origin()}${path}`);
    expect(urls).toContain(`${origin()}/reports/${slug}`);
    expect(urls).toContain(`${origin()}/tools/${tool.slug}`);
    const ours = entries.find((entry) => entry.url === `${origin()}/reports/${slug}`)!;
    expect(ours.lastModified).toBeTruthy();
    const readable = await db.select({ slug: reports.slug, status: reports.status }).from(reports);
    const unreadable = readable.filter((report) => report.status !== "published" && report.status !== "retracted").map((report) => `${origin()}/reports/${report.slug}`);
    expect(urls.filter((url) => unreadable.includes(url))).toEqual([]);
  });

  it("points crawlers at the sitemap and keeps them out of the working areas", () => {
    const rules = robots();
    expect(rules.sitemap).toBe(`${origin()}/sitemap.xml`);
    expect(rules.rules).toMatchObject({ userAgent: "*", allow: "/", disallow: expect.arrayContaining(["/workspace", "/desk", "/admin"]) });
  });
});
