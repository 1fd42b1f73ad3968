import { z } from "zod";
import { getReportImageForServing } from "@/db/queries/reports";
import { can } from "@/lib/authz";
import { UserFacingError } from "@/lib/errors";
import { getObjectStream } from "@/lib/object-storage";
import { handleRoute } from "@/lib/route-handler";

export async function GET(_request: Request, { params }: RouteContext<"/api/report-images/[imageId]">) {
  return handleRoute("GET /api/report-images/[imageId]", z.object({ imageId: z.uuid("Unknown image.") }), await params, async ({ imageId }, user) => {
    const image = await getReportImageForServing({ imageId });
    // A retracted report stays readable, pictures included.
    const published = image?.reportStatus === "published" || image?.reportStatus === "retracted";
    const mayView = published || (user !== null && (user.id === image?.authorId || can(user.role, "workspace:edit-any")));
    // A draft's picture answers 404 to everyone else, exactly like a missing one: its existence is not theirs to learn.
    if (!image || !mayView) throw new UserFacingError("No such image.", 404);
    const body = await getObjectStream(image.objectKey);
    if (!body) throw new UserFacingError("No such image.", 404);
    // Each upload gets a new id and key, so an image never changes under its URL.
    return new Response(body, {
      headers: { "Content-Type": "image/webp", "Cache-Control": `${published ? "public" : "private"}, max-age=86400, immutable` },
    });
  });
}
