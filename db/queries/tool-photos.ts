import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { toolPhotos, tools } from "@/db/schema";

const photoColumns = {
  id: toolPhotos.id,
  widths: toolPhotos.widths,
  heights: toolPhotos.heights,
  altText: toolPhotos.altText,
};

export type ToolPhotoView = Awaited<ReturnType<typeof listToolPhotos>>[number];

export async function listToolPhotos({ toolSlug }: { toolSlug: string }) {
  return db
    .select(photoColumns)
    .from(toolPhotos)
    .innerJoin(tools, eq(tools.id, toolPhotos.toolId))
    .where(eq(tools.slug, toolSlug))
    .orderBy(asc(toolPhotos.createdAt));
}

/** Where a photo's renditions are stored; for the route handler that serves them. */
export async function getToolPhotoObjects({ photoId }: { photoId: string }) {
  const [row] = await db
    .select({ objectKeyPrefix: toolPhotos.objectKeyPrefix, widths: toolPhotos.widths })
    .from(toolPhotos)
    .where(eq(toolPhotos.id, photoId))
    .limit(1);
  return row ?? null;
}

export async function insertToolPhoto(
  tx: Transaction,
  photo: { id: string; toolId: string; objectKeyPrefix: string; widths: number[]; heights: number[]; altText: string; uploadedById: string | null },
) {
  const [row] = await tx.insert(toolPhotos).values(photo).returning({ id: toolPhotos.id });
  if (!row) throw new Error("tool photo not inserted");
  return row;
}

/** Deletes the photo only if it belongs to that tool; returns where its objects live, or null when nothing matched. */
export async function deleteToolPhoto(tx: Transaction, { toolSlug, photoId }: { toolSlug: string; photoId: string }) {
  const [tool] = await tx.select({ id: tools.id }).from(tools).where(eq(tools.slug, toolSlug));
  if (!tool) return null;
  const [row] = await tx
    .delete(toolPhotos)
    .where(and(eq(toolPhotos.id, photoId), eq(toolPhotos.toolId, tool.id)))
    .returning({ objectKeyPrefix: toolPhotos.objectKeyPrefix, widths: toolPhotos.widths });
  return row ?? null;
}

export async function countToolPhotos(tx: Transaction, { toolId }: { toolId: string }) {
  return (await tx.select({ id: toolPhotos.id }).from(toolPhotos).where(eq(toolPhotos.toolId, toolId))).length;
}
