import "server-only";
import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { deleteToolPhoto, insertToolPhoto } from "@/db/queries/tool-photos";
import { UserFacingError } from "@/lib/errors";
import { reencodeWebRenditions } from "@/lib/images";
import { deleteObject, putObject } from "@/lib/object-storage";
import { photoLimits } from "@/lib/validations/tool";

export function toolPhotoObjectKey(objectKeyPrefix: string, width: number): string {
  return `${objectKeyPrefix}/${width}.webp`;
}

/**
 * Re-encodes the photo, stores every rendition, then records the row. The objects go first so a row never points at
 * nothing; if anything after the first upload fails, every rendition is deleted again.
 */
export async function storeToolPhoto({
  toolId,
  image,
  altText,
  uploadedById,
}: {
  toolId: string;
  image: Buffer;
  altText: string;
  uploadedById: string | null;
}) {
  const renditions = await reencodeWebRenditions(image, photoLimits.widths, "photo");
  const id = randomUUID();
  const objectKeyPrefix = `tools/${toolId}/${id}`;
  const keys = renditions.map((rendition) => toolPhotoObjectKey(objectKeyPrefix, rendition.width));
  try {
    await Promise.all(renditions.map((rendition, index) => putObject(keys[index]!, rendition.data, "image/webp")));
    await db.transaction((tx) =>
      insertToolPhoto(tx, {
        id,
        toolId,
        objectKeyPrefix,
        widths: renditions.map((rendition) => rendition.width),
        heights: renditions.map((rendition) => rendition.height),
        altText,
        uploadedById,
      }),
    );
  } catch (error) {
    await Promise.allSettled(keys.map((key) => deleteObject(key)));
    throw error;
  }
  return { id };
}

/**
 * Deletes the row and then its objects inside one transaction: if storage refuses, the row comes back and the
 * photo can be deleted again, rather than a row being left pointing at missing renditions.
 */
export async function removeToolPhoto({ toolSlug, photoId }: { toolSlug: string; photoId: string }) {
  await db.transaction(async (tx) => {
    const removed = await deleteToolPhoto(tx, { toolSlug, photoId });
    if (!removed) throw new UserFacingError("That photo is not on this tool any more.", 404);
    await Promise.all(removed.widths.map((width) => deleteObject(toolPhotoObjectKey(removed.objectKeyPrefix, width))));
  });
}
