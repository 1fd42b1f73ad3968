import "server-only";
import { and, asc, count, eq, gte, ilike, isNotNull, isNull, lte, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { makers, reportRevisions, reports, tools } from "@/db/schema";
import { defaultSortOrder, voltageBands, type CatalogueRequest } from "@/lib/validations/catalogue";

/** A tool as readers name it: maker then model. Queries using it join makers. */
export const toolName = sql<string>`${makers.name} || ' ' || ${tools.model}`;

/** The maker's rated figures of a tool: part of its spec below, and what a report's spec table sets beside the measured. */
export const toolRatedSpecColumns = {
  ratedPowerW: tools.ratedPowerW,
  ratedVoltageMin: tools.ratedVoltageMin,
  ratedVoltageMax: tools.ratedVoltageMax,
  ratedFrequenciesHz: tools.ratedFrequenciesHz,
  ratedAirflowLpm: tools.ratedAirflowLpm,
  temperatureMinC: tools.temperatureMinC,
  temperatureMaxC: tools.temperatureMaxC,
  claimedHeatUpSeconds: tools.claimedHeatUpSeconds,
};

/** What the catalogue, the tool page and GET /api/tools show of a tool: its rated specification. */
export const toolSpecColumns = {
  slug: tools.slug,
  maker: makers.name,
  makerSlug: makers.slug,
  model: tools.model,
  category: tools.category,
  applianceType: tools.applianceType,
  motorShareAboveHalf: tools.motorShareAboveHalf,
  ...toolRatedSpecColumns,
  priceMinor: tools.priceMinor,
  currency: tools.currency,
  accessories: tools.accessories,
  summary: tools.summary,
};

export type ToolSpec = Awaited<ReturnType<typeof listTools>>["tools"][number];

/**
 * Each tool's results in current published reports, read from the frozen revisions (the tools a report covered when
 * it was approved); retracted reports are left out, since their results no longer stand.
 */
function publishedResultsByTool() {
  const rows = db
    .select({
      toolId: sql<string>`(jsonb_array_elements(${reportRevisions.content}->'tools')->>'id')::uuid`.as("tool_id"),
      publishedAt: reportRevisions.publishedAt,
    })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(and(eq(reports.status, "published"), eq(reportRevisions.status, "published")))
    .as("published_tool_rows");
  return db
    .select({
      toolId: rows.toolId,
      reportCount: sql<number>`count(*)::int`.as("report_count"),
      newestResultAt: sql<Date>`max(${rows.publishedAt})`.mapWith(reportRevisions.publishedAt).as("newest_result_at"),
    })
    .from(rows)
    .groupBy(rows.toolId)
    .as("published_results");
}

/** One page of the catalogue, filtered and sorted; ties fall back to maker and model so pages never overlap. */
export async function listTools({ q, category, maker, minPowerW, maxPowerW, voltage, published, sort = "name", order, page, perPage }: CatalogueRequest) {
  const results = publishedResultsByTool();
  const filters: (SQL | undefined)[] = [
    category ? eq(tools.category, category) : undefined,
    maker ? eq(makers.slug, maker) : undefined,
    minPowerW === null || minPowerW === undefined ? undefined : gte(tools.ratedPowerW, minPowerW),
    maxPowerW === null || maxPowerW === undefined ? undefined : lte(tools.ratedPowerW, maxPowerW),
    voltage ? and(lte(tools.ratedVoltageMin, voltageBands[voltage]), gte(tools.ratedVoltageMax, voltageBands[voltage])) : undefined,
    published === "yes" ? isNotNull(results.toolId) : published === "no" ? isNull(results.toolId) : undefined,
  ];
  if (q) {
    const pattern = `%${q.replace(/[\\%_]/g, (match) => `\\${match}`)}%`;
    // The full name as shown ("maker model") matches, so a picker finds a tool however much of its name is typed.
    filters.push(or(ilike(toolName, pattern), ilike(tools.summary, pattern)));
  }
  const where = and(...filters);
  const direction = (order ?? defaultSortOrder(sort)) === "desc" ? sql`desc` : sql`asc`;
  // A missing price or result sorts last whichever way the column is turned. Prices are compared within their
  // currency (there are no exchange rates here), so price order groups them by currency first.
  const sortKeys: Record<NonNullable<CatalogueRequest["sort"]>, SQL[]> = {
    name: [sql`${toolName} ${direction}`],
    ratedPower: [sql`${tools.ratedPowerW} ${direction}`],
    price: [sql`${tools.currency} asc nulls last`, sql`${tools.priceMinor} ${direction} nulls last`],
    newestResult: [sql`${results.newestResultAt} ${direction} nulls last`],
  };
  const [rows, [total]] = await Promise.all([
    db
      .select({ ...toolSpecColumns, publishedReports: sql<number>`coalesce(${results.reportCount}, 0)`.mapWith(Number), newestResultAt: results.newestResultAt })
      .from(tools)
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .leftJoin(results, eq(results.toolId, tools.id))
      .where(where)
      .orderBy(...sortKeys[sort], asc(makers.name), asc(tools.model), asc(tools.id))
      .limit(perPage)
      .offset((page - 1) * perPage),
    db.select({ value: count() }).from(tools).innerJoin(makers, eq(makers.id, tools.makerId)).leftJoin(results, eq(results.toolId, tools.id)).where(where),
  ]);
  return {
    // Dates as text: the first page travels to the browser inside the page, later pages as JSON, and both must agree.
    tools: rows.map((row) => ({ ...row, newestResultAt: row.newestResultAt ? row.newestResultAt.toISOString() : null })),
    total: total?.value ?? 0,
    page,
    perPage,
  };
}

/** Makers with at least one tool in the catalogue, for its maker filter. */
export async function listCatalogueMakers() {
  return db
    .selectDistinct({ slug: makers.slug, name: makers.name })
    .from(makers)
    .innerJoin(tools, eq(tools.makerId, makers.id))
    .orderBy(asc(makers.name), asc(makers.slug));
}

export async function getToolBySlug({ slug }: { slug: string }) {
  const [row] = await db
    .select(toolSpecColumns)
    .from(tools)
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .where(eq(tools.slug, slug))
    .limit(1);
  return row ?? null;
}
