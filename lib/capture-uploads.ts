import "server-only";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { db } from "@/db";
import { deleteCaptureRow, listCaptureKeys, lockAbandonedCaptures } from "@/db/queries/captures";
import { readCaptureColumns, type CaptureColumns } from "@/lib/bench/capture-columns";
import { deleteObject, getObjectStorageClient, getObjectStream, objectStorageBucket } from "@/lib/object-storage";

const CAPTURE_PREFIX = "captures/";

/** Uploads not confirmed within this long are abandoned: a presigned URL lives five minutes, a 200 MB upload far less than an hour. */
export const ABANDONED_AFTER_MS = 60 * 60 * 1000;

/** Keys carry the run and capture ids, so an object found without its row still says where it came from. */
export function captureObjectKey({ runId, captureId, fileName }: { runId: string; captureId: string; fileName: string }): string {
  const safeName = fileName.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(-120) || "capture.csv";
  return `${CAPTURE_PREFIX}${runId}/${captureId}/${safeName}`;
}

/**
 * Deletes uploads begun before `olderThan` and never confirmed (row and object together), then objects under the
 * captures prefix that no row names (an upload whose row was already removed). Rows are taken with SKIP LOCKED,
 * so a confirmation in progress keeps its row, and the object goes before the row: if the row's delete failed, the
 * next run would find it again, never an object with no row to lead to it.
 */
export async function cleanUpAbandonedUploads({
  olderThan,
  prefix = CAPTURE_PREFIX,
  batch = 100,
}: {
  olderThan: Date;
  /** Narrows the sweep to keys under this prefix (one run's captures, say); it must lie under the captures prefix. */
  prefix?: string;
  batch?: number;
}) {
  if (!prefix.startsWith(CAPTURE_PREFIX)) throw new Error(`clean-up is limited to keys under ${CAPTURE_PREFIX}`);
  let rows = 0;
  for (;;) {
    const removed = await db.transaction(async (tx) => {
      const abandoned = await lockAbandonedCaptures(tx, { olderThan, keyPrefix: prefix, limit: batch });
      for (const capture of abandoned) {
        await deleteObject(capture.objectKey);
        await deleteCaptureRow(tx, { id: capture.id });
      }
      return abandoned.length;
    });
    rows += removed;
    if (removed < batch) break;
  }

  let objects = 0;
  let continuationToken: string | undefined;
  do {
    const page = await getObjectStorageClient().send(
      new ListObjectsV2Command({ Bucket: objectStorageBucket(), Prefix: prefix, ContinuationToken: continuationToken }),
    );
    // Objects younger than the cut-off may be uploads whose row is being written right now.
    const old = (page.Contents ?? []).filter((object) => object.Key && object.LastModified && object.LastModified < olderThan);
    const keys = old.map((object) => object.Key as string);
    const known = await listCaptureKeys({ keys });
    for (const key of keys) {
      if (known.has(key)) continue;
      await deleteObject(key);
      objects++;
    }
    continuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (continuationToken);
  return { rows, objects };
}

const HEADING_BYTES = 64 * 1024;

/** The capture's column names and header lines, from its first bytes only: a 200 MB file is not read to map it. */
export async function readStoredCaptureColumns(objectKey: string): Promise<CaptureColumns | null> {
  const stream = await getObjectStream(objectKey);
  if (stream === null) return null;
  const reader = stream.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  let complete = false;
  try {
    while (total < HEADING_BYTES) {
      const { done, value } = await reader.read();
      if (done) {
        complete = true;
        break;
      }
      chunks.push(value);
      total += value.length;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
    reader.releaseLock();
  }
  return readCaptureColumns(Buffer.concat(chunks), { complete });
}
