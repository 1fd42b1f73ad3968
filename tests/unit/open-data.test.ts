import { parse } from "csv-parse/sync";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { escapeXml, renderAtomFeed } from "@/lib/atom-feed";
import { openDataColumns, openDataCsv, openDataFileName, openDataRecords, unitSuffix } from "@/lib/open-data";
import { flattenPublishedResults } from "@/lib/published-results";
import { reportFeedEntries, type RevisionEvent } from "@/lib/report-feed";
import { countVerdicts, describeVerdicts } from "@/lib/verdict-summary";
import { frozenContent, frozenMeasurement, frozenRun, publishedSource } from "../support/frozen-content";

describe("open-data columns", () => {
  it("names each unit in ASCII for column names", () => {
    expect(["W", "A", "L/min", "s", "°C", "Ω", "mV", "m/s²"].map(unitSuffix)).toEqual(["W", "A", "L_per_min", "s", "degC", "ohm", "mV", "m_s"]);
  });

  it("gives each unit that occurs its own group of figures, in the order the units first appear", () => {
    const results = flattenPublishedResults(publishedSource());
    const names = openDataColumns(results).map((column) => column.name);
    expect(names.filter((name) => name.startsWith("value_"))).toEqual(["value_W", "value_L_per_min", "value_s"]);
    expect(names).toContain("expanded_uncertainty_k2_L_per_min");
    expect(names).not.toContain("value_A");
  });

  it("fills only the figures in the row's own unit, and nulls what was not judged", () => {
    const records = openDataRecords(flattenPublishedResults(publishedSource()));
    const [power, airflow] = records;
    expect(power).toMatchObject({ quantity_kind: "power_input_full_demand", value_W: 700.65, rated_W: 720, normalized_W: 700.65, normalized_to_V: 230, value_L_per_min: null });
    expect(power).toMatchObject({ nozzle: "6 mm round nozzle", airflow_setpoint: "Maximum", ambient_degC: 22.5, measured_supply_voltage_V: 229.2, verdict: "meets rating" });
    expect(airflow).toMatchObject({ quantity_kind: "airflow", value_L_per_min: 119.6, expanded_uncertainty_k2_L_per_min: 1.5, verdict: null, value_W: null });
    // Nothing in L/min was judged, so no rating or limit column in L/min stands empty all the way down.
    expect(Object.keys(airflow!).filter((name) => name.endsWith("_L_per_min"))).toEqual(["value_L_per_min", "expanded_uncertainty_k2_L_per_min"]);
    expect(new Set(records.map((record) => Object.keys(record).join()))).toHaveProperty("size", 1);
  });

  it("writes CSV that a standard parser reads back cell for cell: quotes, commas, line breaks, flags and full precision", () => {
    const run = frozenRun({ labName: 'Bench "North", room 2', conditions: { ...frozenRun().conditions, nozzle: "6 mm\nround", airflowSetpoint: null } });
    const content = frozenContent({ runs: [run], measurements: [frozenMeasurement({ value: 0.1 + 0.2, expandedUncertainty: 1e-7 })] });
    const results = flattenPublishedResults(publishedSource(content, { status: "retracted", retractionReason: "Wrong unit." }));
    const columns = openDataColumns(results);
    const records = openDataRecords(results);
    const csv = openDataCsv(columns, records);
    expect(csv.split("\r\n")[0]).toBe(columns.map((column) => column.name).join(","));
    const [header, row] = parse(csv) as string[][];
    const cell = (name: string) => row![header!.indexOf(name)];
    expect(cell("lab")).toBe('Bench "North", room 2');
    expect(cell("nozzle")).toBe("6 mm\nround");
    expect(cell("airflow_setpoint")).toBe("");
    expect(cell("report_retracted")).toBe("true");
    expect(Number(cell("value_W"))).toBe(0.1 + 0.2);
    expect(Number(cell("expanded_uncertainty_k2_W"))).toBe(1e-7);
  });

  it("names the file by report, revision and retraction", () => {
    const revision = { number: 3, kind: "correction", publishedAt: "", url: "" };
    expect(openDataFileName({ slug: "aeris-720", retracted: false, revision }, "csv")).toBe("aeris-720-revision-3-measurements.csv");
    expect(openDataFileName({ slug: "aeris-720", retracted: true, revision }, "json")).toBe("aeris-720-revision-3-retracted-measurements.json");
  });
});

describe("verdict summaries", () => {
  it("counts known results in a fixed order and ignores anything else", () => {
    const counts = countVerdicts(["above rating", "meets rating", "meets rating", null, "bogus", "inconclusive"]);
    expect(counts).toEqual([
      { result: "meets rating", count: 2 },
      { result: "above rating", count: 1 },
      { result: "inconclusive", count: 1 },
    ]);
    expect(describeVerdicts(counts)).toBe("meets rating 2, above rating 1, inconclusive 1");
    expect(describeVerdicts([])).toBe("no rating judged");
  });
});

describe("the Atom feed document", () => {
  const origin = "https://bench.example";
  const revision = (overrides: Partial<RevisionEvent>): RevisionEvent => ({
    slug: "aeris-720",
    number: 1,
    kind: "original",
    changeNote: "First publication.",
    publishedAt: new Date("2026-11-01T10:00:00Z"),
    title: "Aeris 720 on the desk",
    authorName: "Nadia Orlen",
    toolNames: ["Quillfern Thermal Aeris 720"],
    verdictResults: ["meets rating"],
    ...overrides,
  });

  it("merges revisions and retractions newest first, each with a permanent id and its own wording", () => {
    const entries = reportFeedEntries({
      origin,
      limit: 10,
      revisions: [
        revision({}),
        revision({ number: 2, kind: "correction", changeNote: "The clamp scale was 11 A/V.", publishedAt: new Date("2026-11-05T10:00:00Z"), verdictResults: ["above rating"] }),
      ],
      retractions: [{ slug: "aeris-720", retractedAt: new Date("2026-11-09T10:00:00Z"), reason: "Pre-production sample.", title: "Aeris 720 on the desk", authorName: "Nadia Orlen" }],
    });
    expect(entries.map((entry) => [entry.id, entry.category.term])).toEqual([
      [`${origin}/reports/aeris-720#retraction`, "retraction"],
      [`${origin}/reports/aeris-720/revisions/2`, "correction"],
      [`${origin}/reports/aeris-720/revisions/1`, "publication"],
    ]);
    expect(entries[1]).toMatchObject({ title: "Correction to “Aeris 720 on the desk” (revision 2)", summary: "The clamp scale was 11 A/V. Verdicts: above rating 1." });
    expect(entries[2]).toMatchObject({ link: `${origin}/reports/aeris-720`, summary: "New report on Quillfern Thermal Aeris 720. Verdicts: meets rating 1." });
    expect(reportFeedEntries({ origin, limit: 1, revisions: [revision({})], retractions: [] })).toHaveLength(1);
  });

  it("escapes markup and drops characters XML cannot hold", () => {
    expect(escapeXml(`a < b & "c" > 'd'\u0007`)).toBe("a &lt; b &amp; &quot;c&quot; &gt; &apos;d&apos;");
    const [entry] = reportFeedEntries({ origin, limit: 5, revisions: [revision({ title: "<script>alert(1)</script> & more\u0001" })], retractions: [] });
    const xml = renderAtomFeed({
      id: `${origin}/feed.xml`,
      title: "Feed",
      subtitle: "Sub",
      selfLink: `${origin}/feed.xml`,
      alternateLink: `${origin}/reports`,
      authorName: "Benchplate",
      rights: "CC BY 4.0",
      entries: [entry!],
    });
    expect(XMLValidator.validate(xml)).toBe(true);
    const feed = new XMLParser().parse(xml) as { feed: { updated: string; entry: { title: string } } };
    expect(feed.feed.entry.title).toBe("<script>alert(1)</script> & more");
    expect(feed.feed.updated).toBe("2026-11-01T10:00:00.000Z");
  });
});
