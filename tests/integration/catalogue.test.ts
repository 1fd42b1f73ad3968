import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET } from "@/app/api/tools/route";
import { db } from "@/db";
import { listTools } from "@/db/queries/catalogue";
import { makers, tools, type NewTool } from "@/db/schema";
import { catalogueQuerySchema, type CatalogueRequest } from "@/lib/validations/catalogue";
import { createAccount } from "../support/factories";
import { insertReport, type FixtureTool } from "../support/search-fixtures";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
// Every call reads the database: the point here is the query and the handler, not the cache.
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn(), unstable_cache: (load: () => unknown) => load }));

// One maker of its own with five tools, so the filters can be read against a known catalogue whatever else the test
// database holds: every query below is narrowed to this maker.
const suffix = randomUUID().slice(0, 8);
const makerSlug = `catalogue-testworks-${suffix}`;
const makerName = `Catalogue Testworks ${suffix}`;

type Key = "gun" | "station" | "iron" | "breeze" | "duo";
const specs: Record<Key, Omit<NewTool, "makerId" | "slug" | "ratedFrequenciesHz">> = {
  gun: { model: "Gun 2000", category: "heat_gun", ratedPowerW: 2000, ratedVoltageMin: 230, ratedVoltageMax: 230, priceMinor: 5900, currency: "GBP" },
  station: { model: "Station 700", category: "hot_air_station", ratedPowerW: 700, ratedVoltageMin: 220, ratedVoltageMax: 240, priceMinor: 18900, currency: "EUR" },
  iron: { model: "Iron 60", category: "soldering_station", ratedPowerW: 60, ratedVoltageMin: 120, ratedVoltageMax: 120, priceMinor: 3800, currency: "USD" },
  breeze: { model: "Breeze 550", category: "hot_air_station", ratedPowerW: 550, ratedVoltageMin: 100, ratedVoltageMax: 120, priceMinor: null, currency: null },
  duo: { model: "Duo 900", category: "rework_station", ratedPowerW: 900, ratedVoltageMin: 100, ratedVoltageMax: 240, priceMinor: 25000, currency: "EUR" },
};
const made = {} as Record<Key, FixtureTool>;

async function models(query: Omit<CatalogueRequest, "page" | "perPage"> & Partial<Pick<CatalogueRequest, "page" | "perPage">>) {
  const { tools: rows } = await listTools({ page: 1, perPage: 24, ...query, maker: makerSlug });
  return rows.map((row) => row.model);
}

function getTools(query: string) {
  return GET(new Request(`http://localhost:3100/api/tools?${query}`));
}

beforeAll(async () => {
  const author = await createAccount({ role: "reviewer" });
  const [maker] = await db.insert(makers).values({ slug: makerSlug, name: makerName, country: "Nowhere" }).returning({ id: makers.id });
  for (const [key, spec] of Object.entries(specs) as [Key, (typeof specs)[Key]][]) {
    const slug = `${makerSlug}-${key}`;
    const [row] = await db.insert(tools).values({ ...spec, slug, makerId: maker!.id, ratedFrequenciesHz: [50, 60] }).returning({ id: tools.id });
    made[key] = { id: row!.id, slug, name: `${makerName} ${spec.model}` };
  }
  const published = (tool: FixtureTool, day: number) =>
    insertReport({
      authorId: author.id,
      status: "published",
      tools: [tool],
      revisions: [{ number: 1, status: "published", title: `${tool.name} measured`, bodyMdx: "Measured.", publishedAt: new Date(Date.UTC(2026, 10, day)) }],
      current: 1,
    });
  await published(made.station, 3);
  await published(made.station, 1);
  await published(made.iron, 5);
  // None of these counts: a retracted report's results no longer stand, a draft or a revision waiting on the desk is not public.
  await insertReport({
    authorId: author.id,
    status: "retracted",
    tools: [made.breeze],
    revisions: [{ number: 1, status: "published", title: "Withdrawn", bodyMdx: "Withdrawn." }],
    current: 1,
  });
  await insertReport({ authorId: author.id, status: "draft", tools: [made.duo], revisions: [], current: null });
  await insertReport({
    authorId: author.id,
    status: "submitted",
    tools: [made.duo],
    revisions: [{ number: 1, status: "pending", title: "Waiting on the desk", bodyMdx: "Waiting." }],
    current: null,
  });
});

describe("listTools filters", () => {
  it("narrows to one maker, in name order", async () => {
    expect(await models({})).toEqual(["Breeze 550", "Duo 900", "Gun 2000", "Iron 60", "Station 700"]);
  });

  it("filters by kind of tool", async () => {
    expect(await models({ category: "hot_air_station" })).toEqual(["Breeze 550", "Station 700"]);
  });

  it("filters by rated power, bounds included", async () => {
    expect(await models({ minPowerW: 550, maxPowerW: 900 })).toEqual(["Breeze 550", "Duo 900", "Station 700"]);
    expect(await models({ minPowerW: 1000 })).toEqual(["Gun 2000"]);
    expect(await models({ maxPowerW: 60 })).toEqual(["Iron 60"]);
  });

  it("puts a tool in a voltage band when its rated voltage or range includes the nominal", async () => {
    expect(await models({ voltage: "120" })).toEqual(["Breeze 550", "Duo 900", "Iron 60"]);
    expect(await models({ voltage: "230" })).toEqual(["Duo 900", "Gun 2000", "Station 700"]);
  });

  it("counts only current published reports: not retracted ones, drafts or revisions on the desk", async () => {
    expect(await models({ published: "yes" })).toEqual(["Iron 60", "Station 700"]);
    expect(await models({ published: "no" })).toEqual(["Breeze 550", "Duo 900", "Gun 2000"]);
    const { tools: rows } = await listTools({ maker: makerSlug, page: 1, perPage: 24 });
    const counts = Object.fromEntries(rows.map((row) => [row.model, [row.publishedReports, row.newestResultAt]]));
    expect(counts).toEqual({
      "Breeze 550": [0, null],
      "Duo 900": [0, null],
      "Gun 2000": [0, null],
      "Iron 60": [1, "2026-11-05T00:00:00.000Z"],
      "Station 700": [2, "2026-11-03T00:00:00.000Z"],
    });
  });

  it("matches text literally: % and _ are not wildcards", async () => {
    expect(await models({ q: "%" })).toEqual([]);
    expect(await models({ q: "_" })).toEqual([]);
    expect(await models({ q: "iron" })).toEqual(["Iron 60"]);
  });

  it("combines filters", async () => {
    expect(await models({ category: "hot_air_station", voltage: "230", published: "yes" })).toEqual(["Station 700"]);
  });
});

describe("listTools sorting and paging", () => {
  it("sorts by rated power either way", async () => {
    expect(await models({ sort: "ratedPower" })).toEqual(["Iron 60", "Breeze 550", "Station 700", "Duo 900", "Gun 2000"]);
    expect(await models({ sort: "ratedPower", order: "desc" })).toEqual(["Gun 2000", "Duo 900", "Station 700", "Breeze 550", "Iron 60"]);
  });

  it("sorts prices within their currency, a missing price last either way", async () => {
    expect(await models({ sort: "price" })).toEqual(["Station 700", "Duo 900", "Gun 2000", "Iron 60", "Breeze 550"]);
    expect(await models({ sort: "price", order: "desc" })).toEqual(["Duo 900", "Station 700", "Gun 2000", "Iron 60", "Breeze 550"]);
  });

  it("sorts by newest result, newest first by default, untested tools last", async () => {
    expect(await models({ sort: "newestResult" })).toEqual(["Iron 60", "Station 700", "Breeze 550", "Duo 900", "Gun 2000"]);
    expect(await models({ sort: "newestResult", order: "asc" })).toEqual(["Station 700", "Iron 60", "Breeze 550", "Duo 900", "Gun 2000"]);
  });

  it("pages without overlap or gaps, with the total on every page", async () => {
    const pages = await Promise.all([1, 2, 3, 4].map((page) => listTools({ maker: makerSlug, sort: "ratedPower", page, perPage: 2 })));
    expect(pages.map((page) => page.total)).toEqual([5, 5, 5, 5]);
    expect(pages.map((page) => page.tools.map((row) => row.model))).toEqual([["Iron 60", "Breeze 550"], ["Station 700", "Duo 900"], ["Gun 2000"], []]);
  });
});

describe("GET /api/tools", () => {
  it("answers one page as JSON with the totals in headers", async () => {
    const response = await getTools(`maker=${makerSlug}&sort=ratedPower&order=desc&perPage=2`);
    expect(response.status).toBe(200);
    expect(response.headers.get("X-Total-Count")).toBe("5");
    expect(response.headers.get("X-Page")).toBe("1");
    expect(response.headers.get("X-Per-Page")).toBe("2");
    const rows = (await response.json()) as Record<string, unknown>[];
    expect(rows.map((row) => row.model)).toEqual(["Gun 2000", "Duo 900"]);
    // Explicit columns: the rated specification and the published counts, no database ids.
    expect(Object.keys(rows[0]!)).toEqual(expect.arrayContaining(["slug", "maker", "model", "ratedPowerW", "priceMinor", "publishedReports", "newestResultAt"]));
    expect(Object.keys(rows[0]!)).not.toEqual(expect.arrayContaining(["id"]));
    expect(Object.keys(rows[0]!).some((key) => key.endsWith("Id"))).toBe(false);
  });

  it("still answers the compare picker's ?q=&perPage= as before", async () => {
    const response = await getTools(`q=${encodeURIComponent(makerName)}&perPage=3`);
    expect(response.status).toBe(200);
    expect(response.headers.get("X-Total-Count")).toBe("5");
    expect(((await response.json()) as { model: string }[]).map((row) => row.model)).toEqual(["Breeze 550", "Duo 900", "Gun 2000"]);
  });

  it("finds a tool by its full name as shown, maker and model together", async () => {
    const response = await getTools(`q=${encodeURIComponent(made.station.name)}`);
    expect(((await response.json()) as { slug: string }[]).map((row) => row.slug)).toEqual([made.station.slug]);
  });

  it("reads an empty parameter as not given", async () => {
    const response = await getTools(`maker=${makerSlug}&category=&voltage=&minPowerW=&q=`);
    expect(response.status).toBe(200);
    expect(response.headers.get("X-Total-Count")).toBe("5");
  });

  it("reads control characters in the search text as spaces, instead of failing in the database", async () => {
    const response = await getTools(`maker=${makerSlug}&q=Iron%0060`);
    expect(response.status).toBe(200);
    expect(((await response.json()) as { model: string }[]).map((row) => row.model)).toEqual(["Iron 60"]);
  });

  it.each([
    ["sort=cheapest", "sort", "sort must be one of: name, ratedPower, price, newestResult"],
    ["order=up", "order", "order must be asc or desc"],
    ["voltage=240", "voltage", "voltage must be one of: 120, 230"],
    ["published=maybe", "published", "published must be one of: yes, no"],
    ["category=toaster", "category", "category must be one of: hot_air_station, soldering_station, rework_station, heat_gun"],
    ["maker=Not%20A%20Slug!", "maker", "maker is a maker's short name as in its address, such as quillfern-thermal"],
    ["minPowerW=lots", "minPowerW", "Enter a number of watts, such as 600."],
    ["maxPowerW=-5", "maxPowerW", "Enter watts from 0 to 100000."],
    ["minPowerW=900&maxPowerW=100", "maxPowerW", "The upper rated power must be at least the lower one."],
    ["perPage=500", "perPage", "perPage is at most 100"],
    ["page=0", "page", "page starts at 1"],
  ])("refuses %s with 422 and the reason beside the parameter", async (query, field, message) => {
    const response = await getTools(query);
    expect(response.status).toBe(422);
    const body = (await response.json()) as { error: { fieldErrors: Record<string, string[]> } };
    expect(body.error.fieldErrors[field]).toEqual([message]);
  });

  it("parses the same parameters the page does", () => {
    expect(catalogueQuerySchema.parse({ sort: "newestResult", minPowerW: " 500 " })).toMatchObject({ sort: "newestResult", minPowerW: 500, maxPowerW: null, page: 1, perPage: 24 });
  });
});
