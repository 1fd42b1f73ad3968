import "server-only";
import { and, asc, count, eq, ilike, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { makers, tools } from "@/db/schema";
import type { CatalogueQuery } from "@/lib/validations/catalogue";

/** A tool as readers name it: maker then model. Queries using it join makers. */
export const toolName = sql<string>`${makers.name} || ' ' || ${tools.model}`;

/** What the catalogue, the tool page and GET /api/tools show of a tool: its rated specification. */
export const toolSpecColumns = {
  slug: tools.slug,
  maker: makers.name,
  makerSlug: makers.slug,
  model: tools.model,
  category: tools.category,
  applianceType: tools.applianceType,
  motorShareAboveHalf: tools.motorShareAboveHalf,
  ratedPowerW: tools.ratedPowerW,
  ratedVoltageMin: tools.ratedVoltageMin,
  ratedVoltageMax: tools.ratedVoltageMax,
  ratedFrequenciesHz: tools.ratedFrequenciesHz,
  ratedAirflowLpm: tools.ratedAirflowLpm,
  temperatureMinC: tools.temperatureMinC,
  temperatureMaxC: tools.temperatureMaxC,
  claimedHeatUpSeconds: tools.claimedHeatUpSeconds,
  priceMinor: tools.priceMinor,
  currency: tools.currency,
  accessories: tools.accessories,
  summary: tools.summary,
};

export type ToolSpec = Awaited<ReturnType<typeof listTools>>["tools"][number];

export async function listTools({ q, category, page, perPage }: CatalogueQuery) {
  const filters: SQL[] = [];
  if (category) filters.push(eq(tools.category, category));
  if (q) {
    const pattern = `%${q.replace(/[\\%_]/g, (match) => `\\${match}`)}%`;
    const textMatch = or(ilike(tools.model, pattern), ilike(makers.name, pattern), ilike(tools.summary, pattern));
    if (textMatch) filters.push(textMatch);
  }
  const where = filters.length ? and(...filters) : undefined;
  const [rows, [total]] = await Promise.all([
    db
      .select(toolSpecColumns)
      .from(tools)
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .where(where)
      .orderBy(asc(makers.name), asc(tools.model))
      .limit(perPage)
      .offset((page - 1) * perPage),
    db.select({ value: count() }).from(tools).innerJoin(makers, eq(makers.id, tools.makerId)).where(where),
  ]);
  return { tools: rows, total: total?.value ?? 0, page, perPage };
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
