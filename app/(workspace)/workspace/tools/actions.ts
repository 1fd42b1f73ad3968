"use server";

import { revalidatePath, updateTag } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { getToolForEditing, insertTool, updateTool as updateToolRow } from "@/db/queries/tools";
import { catalogueCacheTag } from "@/lib/catalogue-listing";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { removeToolPhoto, storeToolPhoto } from "@/lib/tool-photos";
import { toolFormSchema, toolPhotoDeleteSchema, toolPhotoUploadSchema, toolUpdateSchema } from "@/lib/validations/tool";

function revalidateTool(slug: string) {
  updateTag(catalogueCacheTag);
  revalidatePath("/tools");
  revalidatePath(`/tools/${slug}`);
  revalidatePath("/workspace/tools");
}

export const createTool = guardedAction("(workspace)/workspace/tools/actions.ts#createTool", toolFormSchema, async (tool) => {
  const created = await db.transaction((tx) => insertTool(tx, { tool }));
  revalidateTool(created.slug);
  redirect(`/workspace/tools/${created.slug}/edit?created=1`);
});

export const updateTool = guardedAction("(workspace)/workspace/tools/actions.ts#updateTool", toolUpdateSchema, async ({ slug, ...tool }) => {
  const updated = await db.transaction((tx) => updateToolRow(tx, { slug, tool }));
  if (!updated) throw new UserFacingError("That tool is no longer in the catalogue.", 404);
  revalidateTool(slug);
  return { status: "ok", message: "Ratings saved." };
});

export const addToolPhoto = guardedAction(
  "(workspace)/workspace/tools/actions.ts#addToolPhoto",
  toolPhotoUploadSchema,
  async ({ slug, photo, altText }, user) => {
    const tool = await getToolForEditing({ slug });
    if (!tool) throw new UserFacingError("That tool is no longer in the catalogue.", 404);
    await storeToolPhoto({ toolId: tool.id, image: Buffer.from(await photo.arrayBuffer()), altText, uploadedById: user.id });
    revalidateTool(slug);
    return { status: "ok", message: "Photo added." };
  },
);

export const deleteToolPhoto = guardedAction(
  "(workspace)/workspace/tools/actions.ts#deleteToolPhoto",
  toolPhotoDeleteSchema,
  async ({ slug, photoId }) => {
    await removeToolPhoto({ toolSlug: slug, photoId });
    revalidateTool(slug);
    return { status: "ok", message: "Photo deleted." };
  },
);
