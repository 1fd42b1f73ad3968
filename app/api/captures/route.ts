import { randomUUID } from "node:crypto";
import { NextResponse } from "next/server";
import { db } from "@/db";
import { insertCapture } from "@/db/queries/captures";
import { lockRunForEdit } from "@/db/queries/runs";
import { captureObjectKey } from "@/lib/capture-uploads";
import { UserFacingError } from "@/lib/errors";
import { presignUpload } from "@/lib/object-storage";
import { handleRoute } from "@/lib/route-handler";
import { captureLimits, captureUploadRequestSchema } from "@/lib/validations/runs";

const contentTypes: Record<string, string> = { csv: "text/csv", tsv: "text/tab-separated-values", txt: "text/plain" };

/**
 * Starts an upload: records the capture as awaited and answers with a URL the browser PUTs the file to, straight to
 * object storage. The size is signed into the URL; POST /api/captures/[id]/uploaded confirms what arrived.
 */
export async function POST(request: Request) {
  const body: unknown = await request.json().catch(() => null);
  return handleRoute("POST /api/captures", captureUploadRequestSchema, body, async ({ runId, kind, fileName, sizeBytes }, user) => {
    const viewer = user!;
    const captureId = randomUUID();
    const objectKey = captureObjectKey({ runId, captureId, fileName });
    await db.transaction(async (tx) => {
      if (!(await lockRunForEdit(tx, { id: runId, viewer }))) throw new UserFacingError("No run of yours has that id.", 404);
      await insertCapture(tx, { id: captureId, runId, kind, objectKey, fileName, declaredBytes: sizeBytes, createdById: viewer.id });
    });
    // An upload that never comes leaves an awaited row, which the worker's clean-up removes after an hour.
    const extension = fileName.split(".").pop()?.toLowerCase() ?? "csv";
    const upload = await presignUpload(objectKey, contentTypes[extension] ?? "text/plain", captureLimits.maxBytes, {
      contentLength: sizeBytes,
      expiresInSeconds: 15 * 60,
    });
    return NextResponse.json(
      {
        captureId,
        upload: { url: upload.url, method: upload.method, headers: upload.headers, expiresAt: upload.expiresAt.toISOString() },
        confirmUrl: `/api/captures/${captureId}/uploaded`,
      },
      { status: 201 },
    );
  });
}
