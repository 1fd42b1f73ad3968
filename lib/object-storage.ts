import "server-only";

import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  NoSuchKey,
  NotFound,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { serverEnv } from "@/lib/env";

// Built on first use rather than at import, so `next build` can import this module without a configured store.
let client: S3Client | undefined;

export function getObjectStorageClient(): S3Client {
  if (!client) {
    const env = serverEnv();
    client = new S3Client({
      endpoint: env.S3_ENDPOINT,
      region: env.S3_REGION,
      credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
      // Path-style URLs work against the local fake and S3-compatible providers without wildcard DNS.
      forcePathStyle: true,
      // Default checksums add headers a browser PUT to a presigned URL cannot send; only compute them when the API
      // requires it.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }
  return client;
}

export function objectStorageBucket(): string {
  return serverEnv().S3_BUCKET;
}

export type StoredObjectInfo = {
  size: number;
  contentType: string | undefined;
  etag: string | undefined;
};

export async function putObject(
  key: string,
  body: Uint8Array | Buffer | string,
  contentType: string,
): Promise<{ etag: string | undefined }> {
  const result = await getObjectStorageClient().send(
    new PutObjectCommand({ Bucket: objectStorageBucket(), Key: key, Body: body, ContentType: contentType }),
  );
  return { etag: result.ETag };
}

/**
 * The object's bytes as a web stream (ready for `new Response(...)`); null when the key does not exist, so a route
 * handler can answer 404 without catching SDK errors. Use `statObject` for size and type.
 */
export async function getObjectStream(key: string): Promise<ReadableStream<Uint8Array> | null> {
  try {
    const result = await getObjectStorageClient().send(
      new GetObjectCommand({ Bucket: objectStorageBucket(), Key: key }),
    );
    return result.Body ? (result.Body.transformToWebStream() as ReadableStream<Uint8Array>) : null;
  } catch (error) {
    if (error instanceof NoSuchKey) return null;
    throw error;
  }
}

/** Null when the key does not exist. Used to check what a browser actually uploaded to a presigned URL. */
export async function statObject(key: string): Promise<StoredObjectInfo | null> {
  try {
    const result = await getObjectStorageClient().send(
      new HeadObjectCommand({ Bucket: objectStorageBucket(), Key: key }),
    );
    return { size: result.ContentLength ?? 0, contentType: result.ContentType, etag: result.ETag };
  } catch (error) {
    if (error instanceof NotFound || error instanceof NoSuchKey) return null;
    throw error;
  }
}

/** Deleting a missing key succeeds, as it does on S3. */
export async function deleteObject(key: string): Promise<void> {
  await getObjectStorageClient().send(new DeleteObjectCommand({ Bucket: objectStorageBucket(), Key: key }));
}

export type PresignedUpload = {
  url: string;
  method: "PUT";
  /** Headers the browser must send with the PUT, exactly as given (they are part of the signature). */
  headers: Record<string, string>;
  key: string;
  maxBytes: number;
  expiresAt: Date;
};

export class UploadTooLargeError extends Error {
  constructor(
    readonly size: number,
    readonly maxBytes: number,
  ) {
    super(`Upload of ${size} bytes exceeds the limit of ${maxBytes} bytes`);
    this.name = "UploadTooLargeError";
  }
}

/**
 * A URL the browser can PUT one object to. A presigned PUT cannot carry a size range, so pass the file's size as
 * `contentLength` when it is known: it is checked against `maxBytes` here and signed, so real S3 rejects any other
 * length. The local fake does not verify signatures, and a caller that omits `contentLength` gets no size guarantee
 * at all, so confirm with `statObject` after the upload before trusting the object.
 */
export async function presignUpload(
  key: string,
  contentType: string,
  maxBytes: number,
  options: { contentLength?: number; expiresInSeconds?: number } = {},
): Promise<PresignedUpload> {
  const { contentLength, expiresInSeconds = 300 } = options;
  if (contentLength !== undefined && (contentLength <= 0 || contentLength > maxBytes)) {
    throw new UploadTooLargeError(contentLength, maxBytes);
  }
  const command = new PutObjectCommand({
    Bucket: objectStorageBucket(),
    Key: key,
    ContentType: contentType,
    ContentLength: contentLength,
  });
  const signableHeaders = new Set(["content-type"]);
  if (contentLength !== undefined) signableHeaders.add("content-length");
  const url = await getSignedUrl(getObjectStorageClient(), command, {
    expiresIn: expiresInSeconds,
    signableHeaders,
  });
  return {
    url,
    method: "PUT",
    headers: { "Content-Type": contentType },
    key,
    maxBytes,
    expiresAt: new Date(Date.now() + expiresInSeconds * 1000),
  };
}
