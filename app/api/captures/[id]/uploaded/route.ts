import { NextResponse } from "next/server";
import { db } from "@/db";
import { deleteCaptureRow, getCapture, lockAwaitedCapture, markCaptureUploaded } from "@/db/queries/captures";
import { UserFacingError } from "@/lib/errors";
import { deleteObject, statObject } from "@/lib/object-storage";
import { handleRoute } from "@/lib/route-handler";
import { captureIdSchema } from "@/lib/validations/runs";

/**
 * Confirms an upload by looking at what storage holds: the object must exist and have the declared size. A wrong size
 * removes both the object and the row, so nothing half-uploaded is ever analysed or left behind.
 */
export async function POST(_request: Request, { params }: RouteContext<"/api/captures/[id]/uploaded">) {
  return handleRoute("POST /api/captures/[id]/uploaded", captureIdSchema, await params, async ({ id }, user) => {
    const viewer = user!;
    const outcome = await db.transaction(async (tx) => {
      const capture = await lockAwaitedCapture(tx, { id, viewer });
      if (!capture) return null;
      const stored = await statObject(capture.objectKey);
      if (!stored) throw new UserFacingError("The file has not arrived in storage; upload it again.", 409);
      if (stored.size !== capture.declaredBytes) {
        await deleteObject(capture.objectKey);
        await deleteCaptureRow(tx, { id });
        return { rejected: true as const, message: `Storage holds ${stored.size} bytes where ${capture.declaredBytes} were declared; the upload was discarded, so upload the file again.` };
      }
      await markCaptureUploaded(tx, { id });
      return { rejected: false as const, capture };
    });
    if (outcome?.rejected) throw new UserFacingError(outcome.message, 422);
    // A repeated confirmation (a retry after a lost answer) finds the capture already uploaded and succeeds again.
    const capture = outcome?.capture ?? (await getCapture({ id, viewer }));
    if (!capture || (outcome === null && capture.status !== "uploaded")) throw new UserFacingError("No upload of yours is waiting with that id.", 404);
    return NextResponse.json({ captureId: id, status: "uploaded", mappingUrl: `/workspace/runs/${capture.runId}/captures/${id}` });
  });
}
