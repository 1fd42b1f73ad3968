import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { makers, tools } from "@/db/schema";
import { reportSearchPageSize, searchPublishedReports } from "@/db/queries/search";
import { matchEnd, matchStart, splitSnippet } from "@/lib/search-snippet";
import { reportSearchSchema } from "@/lib/validations/search";
import { createAccount } from "../support/factories";
import { insertReport, uniqueWord, type FixtureTool } from "../support/search-fixtures";

vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn(), updateTag: vi.fn(), unstable_cache: (load: () => unknown) => load }));

// Each test searches for made-up words that only its own reports contain, so the shared test database's other
// reports never match.
const words = {
  published: uniqueWord(),
  draftOnly: uniqueWord(),
  submittedOnly: uniqueWord(),
  superseded: uniqueWord(),
  corrected: uniqueWord(),
  pendingOnly: uniqueWord(),
  ranked: uniqueWord(),
  retracted: uniqueWord(),
  many: uniqueWord(),
  phraseA: uniqueWord(),
  phraseB: uniqueWord(),
  hostile: uniqueWord(),
  toolWord: uniqueWord(),
};

let tool: FixtureTool;
let namedTool: FixtureTool;
const slugs: Record<string, string> = {};

async function slugsFound(q: string, page = 1) {
  return (await searchPublishedReports({ q, page })).hits.map((hit) => hit.slug);
}

/** The words a snippet marks as matched. */
function marked(text: string) {
  return splitSnippet(text)
    .filter((part) => part.matched)
    .map((part) => part.text);
}

beforeAll(async () => {
  const author = await createAccount({ role: "reviewer" });
  const suffix = randomUUID().slice(0, 8);
  const [maker] = await db.insert(makers).values({ slug: `search-maker-${suffix}`, name: `Searchworks ${suffix}`, country: "Nowhere" }).returning({ id: makers.id });
  const makeTool = async (model: string) => {
    const slug = `search-tool-${randomUUID().slice(0, 8)}`;
    const [row] = await db
      .insert(tools)
      .values({ slug, makerId: maker!.id, model, category: "hot_air_station", ratedPowerW: 600, ratedVoltageMin: 230, ratedVoltageMax: 230, ratedFrequenciesHz: [50] })
      .returning({ id: tools.id });
    return { id: row!.id, slug, name: `Searchworks ${suffix} ${model}` };
  };
  tool = await makeTool("HA-1");
  namedTool = await makeTool(`Model ${words.toolWord}`);
  const published = (title: string, bodyMdx: string, extra: Partial<Parameters<typeof insertReport>[0]> = {}) =>
    insertReport({ authorId: author.id, status: "published", tools: [tool], revisions: [{ number: 1, status: "published", title, bodyMdx }], current: 1, ...extra });

  slugs.published = (
    await published(
      "A hot-air station on the bench",
      `## In short\n\nThe station's controller switches the heater in whole cycles; **${words.published}** keeps the harmonic currents low.\n\n<VerdictTable analysis="full-power" />\n`,
    )
  ).slug;

  // Words that readers cannot see must not be found: a draft's working copy, a submission waiting on the desk.
  await insertReport({ authorId: author.id, status: "draft", tools: [tool], revisions: [], current: null, workingBody: `Draft text with ${words.draftOnly}.` });
  await insertReport({
    authorId: author.id,
    status: "submitted",
    tools: [tool],
    revisions: [{ number: 1, status: "pending", title: `Waiting ${words.submittedOnly}`, bodyMdx: `Waiting on the desk: ${words.submittedOnly}.` }],
    current: null,
  });

  // A corrected report: revision 1 said one thing, revision 2 (current) says another, revision 3 waits on the desk.
  slugs.corrected = (
    await insertReport({
      authorId: author.id,
      status: "published",
      tools: [tool],
      revisions: [
        { number: 1, status: "published", title: "Power input measured", bodyMdx: `It meets its rating ${words.superseded} at any voltage.` },
        { number: 2, status: "published", kind: "correction", title: "Power input measured", bodyMdx: `It meets its rating at 230 V only, ${words.corrected}.` },
        { number: 3, status: "pending", title: "Power input measured", bodyMdx: `A proposed change: ${words.pendingOnly}.` },
      ],
      current: 2,
      workingBody: `A proposed change: ${words.pendingOnly}.`,
    })
  ).slug;

  // Ranking: the same word in one title, in one tool's name, in one body.
  slugs.inBody = (await published("Heat-up of a small station", `The iron settles quickly; ${words.ranked} was steady.`)).slug;
  slugs.inTitle = (await published(`The ${words.ranked} question`, "Nothing about it in the text.")).slug;
  slugs.inToolName = (await published("A named station", `Measured ${words.toolWord} once.`, { tools: [namedTool] })).slug;
  slugs.toolOnly = (await published("Another named station", "Only the tool carries the word.", { tools: [namedTool] })).slug;

  slugs.retracted = (
    await insertReport({
      authorId: author.id,
      status: "retracted",
      tools: [tool],
      revisions: [{ number: 1, status: "published", title: "Withdrawn figures", bodyMdx: `The clamp read ${words.retracted} wrong.` }],
      current: 1,
    })
  ).slug;

  for (let index = 0; index < reportSearchPageSize + 1; index += 1) {
    await published(`Batch report ${index}`, `One of many: ${words.many}.`);
  }
  slugs.phrase = (await published("Phrases", `First ${words.phraseA} ${words.phraseB} together.`)).slug;
  slugs.apart = (await published("Phrases apart", `Here ${words.phraseB} comes first and ${words.phraseA} later.`)).slug;
  slugs.hostile = (
    await published("Markup in the body", `<script>alert("x")</script> The <b>bold</b> claim ${words.hostile} & more < less > nothing.`)
  ).slug;
});

describe("what can match", () => {
  it("finds a published report by a word of its body, with the word marked in the snippet", async () => {
    const { hits, total } = await searchPublishedReports({ q: words.published, page: 1 });
    expect(total).toBe(1);
    expect(hits[0]).toMatchObject({ slug: slugs.published, title: "A hot-air station on the bench", status: "published", revisionNumber: 1, revisionKind: "original" });
    expect(hits[0]!.toolNames).toEqual([tool.name]);
    expect(marked(hits[0]!.snippet)).toEqual([words.published]);
    // The snippet is the text a reader reads: no Markdown marks or component tags.
    expect(hits[0]!.snippet).not.toMatch(/\*\*|<VerdictTable|##/);
  });

  it("never matches a draft or a submission waiting on the desk", async () => {
    expect(await slugsFound(words.draftOnly)).toEqual([]);
    expect(await slugsFound(words.submittedOnly)).toEqual([]);
  });

  it("matches a correction's new word, and neither a superseded revision's word nor one waiting on the desk", async () => {
    const { hits } = await searchPublishedReports({ q: words.corrected, page: 1 });
    expect(hits.map((hit) => hit.slug)).toEqual([slugs.corrected]);
    expect(hits[0]).toMatchObject({ revisionNumber: 2, revisionKind: "correction" });
    expect(await slugsFound(words.superseded)).toEqual([]);
    expect(await slugsFound(words.pendingOnly)).toEqual([]);
  });

  it("still finds a retracted report, flagged as retracted", async () => {
    const { hits } = await searchPublishedReports({ q: words.retracted, page: 1 });
    expect(hits.map((hit) => [hit.slug, hit.status])).toEqual([[slugs.retracted, "retracted"]]);
  });
});

describe("ranking and query syntax", () => {
  it("ranks a title match above a body match", async () => {
    const { hits } = await searchPublishedReports({ q: words.ranked, page: 1 });
    expect(hits.map((hit) => hit.slug)).toEqual([slugs.inTitle, slugs.inBody]);
    expect(marked(hits[0]!.markedTitle)).toEqual([words.ranked]);
  });

  it("ranks a tool-name and body match above a tool-name match alone", async () => {
    expect(await slugsFound(words.toolWord)).toEqual([slugs.inToolName, slugs.toolOnly]);
  });

  it("matches other forms of a word (English stemming)", async () => {
    expect(await slugsFound(`${words.published} switching`)).toEqual([slugs.published]);
  });

  it("reads quotes as a phrase and a minus as leaving a word out", async () => {
    expect((await slugsFound(`${words.phraseA} ${words.phraseB}`)).sort()).toEqual([slugs.phrase, slugs.apart].sort());
    expect(await slugsFound(`"${words.phraseA} ${words.phraseB}"`)).toEqual([slugs.phrase]);
    expect(await slugsFound(`${words.phraseA} -together`)).toEqual([slugs.apart]);
  });

  it("pages ten at a time with the total on every page", async () => {
    const [first, second] = await Promise.all([searchPublishedReports({ q: words.many, page: 1 }), searchPublishedReports({ q: words.many, page: 2 })]);
    expect([first.total, second.total]).toEqual([reportSearchPageSize + 1, reportSearchPageSize + 1]);
    expect([first.hits.length, second.hits.length]).toEqual([reportSearchPageSize, 1]);
    expect(new Set([...first.hits, ...second.hits].map((hit) => hit.slug)).size).toBe(reportSearchPageSize + 1);
  });
});

describe("hostile input", () => {
  it("takes SQL in the search text as words: nothing runs, nothing fails", async () => {
    for (const q of ["'); drop table reports; --", "\\'; select pg_sleep(5); --", "a & | ! : * ( ) <-> b", "station\u0000heater"]) {
      const result = await searchPublishedReports({ q: reportSearchSchema.parse({ q }).q, page: 1 });
      expect(result.total).toBeGreaterThanOrEqual(0);
    }
    const [row] = await db.execute<{ exists: boolean }>(sql`select to_regclass('public.reports') is not null as exists`);
    expect(row?.exists).toBe(true);
  });

  it("finds nothing for markup alone, and shows a body's markup only as plain words", async () => {
    expect(await slugsFound("<script>")).toEqual([]);
    const { hits } = await searchPublishedReports({ q: words.hostile, page: 1 });
    expect(hits.map((hit) => hit.slug)).toEqual([slugs.hostile]);
    const snippet = hits[0]!.snippet;
    expect(snippet).not.toMatch(/<script|<b>|<\/b>/);
    expect(marked(snippet)).toEqual([words.hostile]);
    // Only the two markers ts_headline was told to use set words apart; the text between is the body's own.
    expect(splitSnippet(snippet).map((part) => part.text).join("")).toBe(snippet.replaceAll(matchStart, "").replaceAll(matchEnd, ""));
  });

  it("answers an empty search with nothing, without asking the database", async () => {
    expect(await searchPublishedReports({ q: "", page: 1 })).toEqual({ hits: [], total: 0, page: 1, perPage: reportSearchPageSize });
  });

  it("refuses overlong text and bad pages with a reason", () => {
    expect(reportSearchSchema.safeParse({ q: "x".repeat(201) }).error?.issues[0]?.message).toBe("Search for at most 200 characters.");
    expect(reportSearchSchema.safeParse({ page: "0" }).error?.issues[0]?.message).toBe("page starts at 1");
    expect(reportSearchSchema.parse({ q: "", page: "" })).toEqual({ q: "", page: 1 });
  });
});
