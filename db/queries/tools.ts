import "server-only";
import { asc, count, eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { toolSpecColumns } from "@/db/queries/catalogue";
import { claimFreeSlug } from "@/db/queries/slugs";
import { makers, toolPhotos, tools } from "@/db/schema";
import { UserFacingError } from "@/lib/errors";
import { slugify } from "@/lib/slug";
import { newMakerChoice, type ToolForm } from "@/lib/validations/tool";

/** The workspace's list of tools: enough to find one and open it for editing. */
export async function listToolsForEditing() {
  return db
    .select({
      slug: tools.slug,
      maker: makers.name,
      model: tools.model,
      category: tools.category,
      ratedPowerW: tools.ratedPowerW,
      ratedVoltageMin: tools.ratedVoltageMin,
      ratedVoltageMax: tools.ratedVoltageMax,
      photoCount: count(toolPhotos.id),
      updatedAt: tools.updatedAt,
    })
    .from(tools)
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .leftJoin(toolPhotos, eq(toolPhotos.toolId, tools.id))
    .groupBy(tools.id, makers.name)
    .orderBy(asc(makers.name), asc(tools.model));
}

/** Every rated field as the edit form shows it. */
export async function getToolForEditing({ slug }: { slug: string }) {
  const [row] = await db
    .select({ ...toolSpecColumns, id: tools.id, makerId: tools.makerId })
    .from(tools)
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .where(eq(tools.slug, slug))
    .limit(1);
  return row ?? null;
}

export type ToolForEditing = NonNullable<Awaited<ReturnType<typeof getToolForEditing>>>;

export async function listMakers() {
  return db.select({ id: makers.id, name: makers.name }).from(makers).orderBy(asc(makers.name));
}

/** The chosen maker, or the new one typed in; a "new" maker whose name is already listed is that maker. */
async function resolveMaker(tx: Transaction, tool: ToolForm): Promise<{ id: string; name: string }> {
  if (tool.makerId !== newMakerChoice) {
    const [existing] = await tx.select({ id: makers.id, name: makers.name }).from(makers).where(eq(makers.id, tool.makerId));
    if (!existing) throw new UserFacingError("That maker is no longer listed.", 422, { makerId: ["That maker is no longer listed; choose again."] });
    return existing;
  }
  const name = tool.newMakerName ?? "";
  const slug = slugify(name);
  if (!slug) throw new UserFacingError("The maker's name needs letters or digits.", 422, { newMakerName: ["Use letters or digits in the maker's name."] });
  await tx.insert(makers).values({ slug, name, country: tool.newMakerCountry ?? "" }).onConflictDoNothing({ target: makers.slug });
  const [maker] = await tx.select({ id: makers.id, name: makers.name }).from(makers).where(eq(makers.slug, slug));
  if (!maker) throw new Error(`maker ${slug} vanished after insert`);
  return maker;
}

function ratedColumns(tool: ToolForm) {
  return {
    model: tool.model,
    category: tool.category,
    applianceType: tool.applianceType,
    motorShareAboveHalf: tool.motorShareAboveHalf,
    ratedPowerW: tool.ratedPowerW,
    ratedVoltageMin: tool.ratedVoltageMin,
    ratedVoltageMax: tool.ratedVoltageMax,
    ratedFrequenciesHz: tool.ratedFrequenciesHz,
    ratedAirflowLpm: tool.ratedAirflowLpm,
    temperatureMinC: tool.temperatureMinC,
    temperatureMaxC: tool.temperatureMaxC,
    claimedHeatUpSeconds: tool.claimedHeatUpSeconds,
    priceMinor: tool.priceMinor,
    currency: tool.currency,
    accessories: tool.accessories.map(({ kind, name, size }) => (size ? { kind, name, size } : { kind, name })),
    summary: tool.summary,
  };
}

/** Slug from maker and model, made unique with a numeric suffix. */
export async function insertTool(tx: Transaction, { tool }: { tool: ToolForm }) {
  const maker = await resolveMaker(tx, tool);
  const base = slugify(`${maker.name} ${tool.model}`);
  if (!base) throw new UserFacingError("The model needs letters or digits.", 422, { model: ["Use letters or digits in the model."] });
  const slug = await claimFreeSlug(tx, { table: tools, column: tools.slug, base });
  const [row] = await tx
    .insert(tools)
    .values({ slug, makerId: maker.id, ...ratedColumns(tool) })
    .returning({ id: tools.id, slug: tools.slug });
  if (!row) throw new Error("tool not inserted");
  return row;
}

/** The slug stays as it was: links to the tool page keep working after a correction to the model name. */
export async function updateTool(tx: Transaction, { slug, tool }: { slug: string; tool: ToolForm }) {
  const maker = await resolveMaker(tx, tool);
  const [row] = await tx
    .update(tools)
    .set({ makerId: maker.id, ...ratedColumns(tool) })
    .where(eq(tools.slug, slug))
    .returning({ id: tools.id, slug: tools.slug });
  return row ?? null;
}
