import { z } from "zod";
import { getToolPhotoObjects } from "@/db/queries/tool-photos";
import { UserFacingError } from "@/lib/errors";
import { getObjectStream } from "@/lib/object-storage";
import { handleRoute } from "@/lib/route-handler";
import { toolPhotoObjectKey } from "@/lib/tool-photos";

const photoRequestSchema = z.object({
  photoId: z.uuid("Unknown photo."),
  width: z.coerce.number({ error: "Width must be a number of pixels." }).int("Width must be a whole number of pixels.").positive("Width must be above 0."),
});

export async function GET(_request: Request, { params }: RouteContext<"/api/tool-photos/[photoId]/[width]">) {
  return handleRoute("GET /api/tool-photos/[photoId]/[width]", photoRequestSchema, await params, async ({ photoId, width }) => {
    const photo = await getToolPhotoObjects({ photoId });
    if (!photo || !photo.widths.includes(width)) throw new UserFacingError("No such photo at that width.", 404);
    const body = await getObjectStream(toolPhotoObjectKey(photo.objectKeyPrefix, width));
    if (!body) throw new UserFacingError("No such photo at that width.", 404);
    // A photo id's renditions never change (a new upload gets a new id), so caches may keep them for good.
    return new Response(body, {
      headers: { "Content-Type": "image/webp", "Cache-Control": "public, max-age=31536000, immutable", "X-Content-Type-Options": "nosniff" },
    });
  });
}
