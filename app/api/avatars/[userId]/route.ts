import { z } from "zod";
import { getUserById } from "@/db/queries/users";
import { UserFacingError } from "@/lib/errors";
import { getObjectStream } from "@/lib/object-storage";
import { handleRoute } from "@/lib/route-handler";

export async function GET(_request: Request, { params }: RouteContext<"/api/avatars/[userId]">) {
  return handleRoute("GET /api/avatars/[userId]", z.object({ userId: z.uuid("Unknown account.") }), await params, async ({ userId }) => {
    const user = await getUserById({ id: userId });
    if (!user?.avatarKey) throw new UserFacingError("No picture for this account.", 404);
    const body = await getObjectStream(user.avatarKey);
    if (!body) throw new UserFacingError("No picture for this account.", 404);
    // The key changes with every upload, so a cached copy is never stale for long.
    return new Response(body, { headers: { "Content-Type": "image/webp", "Cache-Control": "public, max-age=300" } });
  });
}
