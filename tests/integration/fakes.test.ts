import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { sendMail } from "@/lib/mail";
import {
  deleteObject,
  getObjectStream,
  presignUpload,
  putObject,
  statObject,
  UploadTooLargeError,
} from "@/lib/object-storage";
import { clearMessages, listMessages, waitForMessage } from "../support/mail";

describe("object storage fake", () => {
  it("stores, returns and deletes an object", async () => {
    const key = `tests/${randomUUID()}.txt`;
    const body = "rated 850 W at 230 V";

    await putObject(key, body, "text/plain");
    expect(await statObject(key)).toMatchObject({ size: body.length, contentType: "text/plain" });

    const stream = await getObjectStream(key);
    expect(stream).not.toBeNull();
    expect(await new Response(stream).text()).toBe(body);

    await deleteObject(key);
    expect(await getObjectStream(key)).toBeNull();
    expect(await statObject(key)).toBeNull();
  });
});

describe("mail fake", () => {
  it("receives a message sent through lib/mail exactly once", async () => {
    await clearMessages();
    const to = `bench-${randomUUID()}@benchplate.test`;
    const subject = `Calibration note ${randomUUID()}`;

    await sendMail({ to, subject, text: "Plain body", html: "<p>HTML body</p>" });

    const message = await waitForMessage(to, subject);
    expect(message).toMatchObject({ to: [to], subject, text: expect.stringContaining("Plain body") });
    expect(message.html).toContain("<p>HTML body</p>");
    expect(message.from).toContain("desk@benchplate.test");
    expect(await listMessages(to)).toHaveLength(1);
  });
});

describe("presigned uploads", () => {
  it("lets a browser on the app origin PUT to a presigned URL and read the ETag", async () => {
    const key = `tests/${randomUUID()}.webp`;
    const bytes = new Uint8Array([82, 73, 70, 70, 0, 0, 0, 0]);
    const upload = await presignUpload(key, "image/webp", 1024, { contentLength: bytes.length });
    const origin = process.env.APP_ORIGIN ?? "http://localhost:3100";

    const preflight = await fetch(upload.url, {
      method: "OPTIONS",
      headers: { Origin: origin, "Access-Control-Request-Method": "PUT", "Access-Control-Request-Headers": "content-type" },
    });
    expect(preflight.status).toBe(200);
    expect(preflight.headers.get("access-control-allow-methods")).toContain("PUT");

    const put = await fetch(upload.url, { method: upload.method, headers: { ...upload.headers, Origin: origin }, body: bytes });
    expect(put.status).toBe(200);
    expect(put.headers.get("access-control-expose-headers")).toContain("ETag");
    expect(put.headers.get("etag")).toBeTruthy();
    expect(await statObject(key)).toMatchObject({ size: bytes.length, contentType: "image/webp" });

    await deleteObject(key);
  });

  it("refuses to sign an upload larger than the limit", async () => {
    await expect(presignUpload("tests/too-big.webp", "image/webp", 1024, { contentLength: 4096 })).rejects.toThrow(
      UploadTooLargeError,
    );
  });
});
