// Local stand-ins for the hosted services, all on loopback: an S3-compatible object store and an SMTP server whose
// messages can be read back over a small JSON inbox. The app only sees environment variables, so swapping in a real
// provider is a configuration change.
import { randomBytes } from "node:crypto";
import { mkdir, readdir, readFile, rename, rm, writeFile } from "node:fs/promises";
import http from "node:http";
import net from "node:net";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";
import { z } from "zod";
import { fakeMailMessageSchema, type FakeMailMessage } from "../lib/fake-inbox";

const root = path.resolve(import.meta.dirname, "..");
const host = "127.0.0.1";

const env = z
  .object({
    S3_PORT: z.coerce.number().int().positive().default(4569),
    S3_BUCKET: z.string().min(3).default("benchplate-uploads"),
    S3_DATA_DIR: z.string().default(path.join(root, ".data/s3")),
    APP_ORIGIN: z.string().url().default("http://localhost:3000"),
    SMTP_PORT: z.coerce.number().int().positive().default(2525),
    MAIL_DATA_DIR: z.string().default(path.join(root, ".data/mail")),
    MAIL_FAKE_INBOX_PORT: z.coerce.number().int().positive().default(2580),
  })
  .parse(process.env);

const s3Dir = path.resolve(root, env.S3_DATA_DIR);
const mailDir = path.resolve(root, env.MAIL_DATA_DIR);

// Presigned uploads come straight from the browser, so the bucket must answer the preflight and expose ETag (the
// client reads it to confirm the upload). localhost and 127.0.0.1 are both listed because people type either.
function corsOrigins(origin: string): string[] {
  const url = new URL(origin);
  const origins = new Set([url.origin]);
  if (url.hostname === "localhost") origins.add(url.origin.replace("//localhost", "//127.0.0.1"));
  if (url.hostname === "127.0.0.1") origins.add(url.origin.replace("//127.0.0.1", "//localhost"));
  return [...origins];
}

function corsXml(origins: string[]): string {
  const allowed = origins.map((origin) => `<AllowedOrigin>${origin}</AllowedOrigin>`).join("");
  return `<?xml version="1.0" encoding="UTF-8"?>
<CORSConfiguration xmlns="http://s3.amazonaws.com/doc/2006-03-01/">
  <CORSRule>
    ${allowed}
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;
}

// s3rver does not report a busy port (the listen error goes unhandled), so check all three first and say which one.
function assertPortFree(port: number, name: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once("error", (error: NodeJS.ErrnoException) => {
      reject(
        new Error(
          error.code === "EADDRINUSE"
            ? `${name} port ${host}:${port} is already in use (fakes already running?)`
            : `${name} port ${port}: ${error.message}`,
        ),
      );
    });
    probe.listen(port, host, () => probe.close(() => resolve()));
  });
}

// Time first, so ids sort by arrival even within one millisecond; the counter breaks ties, the random part keeps
// ids from colliding across restarts.
let sequence = 0;
function newMessageId(): string {
  sequence = (sequence + 1) % 10_000;
  return `${Date.now()}-${String(sequence).padStart(4, "0")}-${randomBytes(3).toString("hex")}`;
}

const messageIdPattern = /^[0-9]{13}-[0-9]{4}-[0-9a-f]{6}$/;

function addressesOf(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const objects = Array.isArray(field) ? field : [field];
  return objects.flatMap((object) => object.value.map((entry) => entry.address ?? "")).filter(Boolean);
}

async function storeMessage(message: FakeMailMessage): Promise<void> {
  // Write then rename, so the inbox never reads a half-written file.
  const file = path.join(mailDir, `${message.id}.json`);
  await writeFile(`${file}.tmp`, JSON.stringify(message, null, 2));
  await rename(`${file}.tmp`, file);
}

async function readMessages(): Promise<FakeMailMessage[]> {
  const files = (await readdir(mailDir)).filter((name) => name.endsWith(".json")).sort().reverse();
  const messages: FakeMailMessage[] = [];
  for (const name of files) {
    try {
      messages.push(fakeMailMessageSchema.parse(JSON.parse(await readFile(path.join(mailDir, name), "utf8"))));
    } catch {
      // A file removed by a concurrent DELETE, or edited by hand: skip it rather than fail the whole list.
    }
  }
  return messages;
}

async function clearMessages(): Promise<number> {
  const files = (await readdir(mailDir)).filter((name) => name.endsWith(".json"));
  await Promise.all(files.map((name) => rm(path.join(mailDir, name), { force: true })));
  return files.length;
}

function startSmtp(): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    // A real provider may want credentials; the fake accepts any, and over plain text since it is loopback only.
    allowInsecureAuth: true,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? "anonymous" });
    },
    disabledCommands: ["STARTTLS"],
    size: 10 * 1024 * 1024,
    logger: false,
    banner: "Benchplate mail fake",
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((recipient) => recipient.address);
          const to = [...new Set([...addressesOf(parsed.to), ...addressesOf(parsed.cc), ...envelopeTo])].map((a) =>
            a.toLowerCase(),
          );
          const message: FakeMailMessage = {
            id: newMessageId(),
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ""),
            to: [...new Set(to)],
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: parsed.html || null,
          };
          await storeMessage(message);
          console.log(`fakes: mail ${message.id} to ${message.to.join(", ")}: ${message.subject}`);
          callback();
        })
        .catch((error: unknown) => {
          console.error("fakes: could not store a message:", error);
          callback(error instanceof Error ? error : new Error(String(error)));
        });
    },
  });
  server.on("error", (error) => console.error("fakes: smtp error:", error.message));
  return new Promise((resolve, reject) => {
    server.server.once("error", reject);
    server.listen(env.SMTP_PORT, host, () => resolve(server));
  });
}

function sendJson(res: http.ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" });
  res.end(JSON.stringify(body));
}

async function handleInbox(req: http.IncomingMessage, res: http.ServerResponse): Promise<void> {
  const url = new URL(req.url ?? "/", `http://${host}`);
  const parts = url.pathname.split("/").filter(Boolean);
  if (parts[0] !== "messages" || parts.length > 2) return sendJson(res, 404, { error: "not found" });

  if (parts.length === 1) {
    if (req.method === "GET") {
      const to = url.searchParams.get("to")?.trim().toLowerCase();
      const messages = await readMessages();
      return sendJson(res, 200, to ? messages.filter((message) => message.to.includes(to)) : messages);
    }
    if (req.method === "DELETE") return sendJson(res, 200, { deleted: await clearMessages() });
    return sendJson(res, 405, { error: "method not allowed" });
  }

  const id = parts[1] ?? "";
  if (req.method !== "GET") return sendJson(res, 405, { error: "method not allowed" });
  if (!messageIdPattern.test(id)) return sendJson(res, 404, { error: "not found" });
  try {
    const message = fakeMailMessageSchema.parse(JSON.parse(await readFile(path.join(mailDir, `${id}.json`), "utf8")));
    return sendJson(res, 200, message);
  } catch {
    return sendJson(res, 404, { error: "not found" });
  }
}

function startInbox(): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    handleInbox(req, res).catch((error: unknown) => {
      console.error("fakes: inbox error:", error);
      if (!res.headersSent) sendJson(res, 500, { error: "inbox error" });
      else res.end();
    });
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(env.MAIL_FAKE_INBOX_PORT, host, () => resolve(server));
  });
}

async function main(): Promise<void> {
  await assertPortFree(env.S3_PORT, "S3");
  await assertPortFree(env.SMTP_PORT, "SMTP");
  await assertPortFree(env.MAIL_FAKE_INBOX_PORT, "mail inbox");
  await mkdir(s3Dir, { recursive: true });
  await mkdir(mailDir, { recursive: true });

  const s3 = new S3rver({
    address: host,
    port: env.S3_PORT,
    directory: s3Dir,
    silent: true,
    configureBuckets: [{ name: env.S3_BUCKET, configs: [corsXml(corsOrigins(env.APP_ORIGIN))] }],
  });
  await s3.run();
  const smtp = await startSmtp();
  const inbox = await startInbox();

  console.log(
    `fakes ready: s3 http://${host}:${env.S3_PORT} (bucket ${env.S3_BUCKET}), smtp ${host}:${env.SMTP_PORT}, ` +
      `inbox http://${host}:${env.MAIL_FAKE_INBOX_PORT}/messages`,
  );

  let stopping = false;
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`fakes: ${signal}, stopping`);
    // Open SMTP or keep-alive connections can hold close() for long; the data is on disk, so do not wait for them.
    const deadline = setTimeout(() => process.exit(0), 2_000);
    deadline.unref();
    Promise.allSettled([
      s3.close(),
      new Promise<void>((resolve) => smtp.close(() => resolve())),
      new Promise<void>((resolve) => {
        inbox.close(() => resolve());
        inbox.closeAllConnections();
      }),
    ]).then(() => process.exit(0));
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((error: unknown) => {
  console.error(`fakes: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
