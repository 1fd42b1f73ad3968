import "server-only";

import nodemailer, { type Transporter } from "nodemailer";
import { serverEnv } from "@/lib/env";
import { fakeMailListSchema, fakeMailMessageSchema, type FakeMailMessage } from "@/lib/fake-inbox";

export type { FakeMailMessage } from "@/lib/fake-inbox";

let transport: Transporter | undefined;

const loopbackHosts = new Set(["127.0.0.1", "localhost", "::1"]);

function getTransport(): Transporter {
  if (!transport) {
    const env = serverEnv();
    const loopback = loopbackHosts.has(env.SMTP_HOST);
    transport = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
      // The local fake speaks plain SMTP. A remote relay on a non-TLS port must upgrade with STARTTLS, so that
      // credentials and reset links never cross the network in clear text.
      ignoreTLS: !env.SMTP_SECURE && loopback,
      requireTLS: !env.SMTP_SECURE && !loopback,
    });
  }
  return transport;
}

export type OutgoingMail = {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
};

export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  const info = await getTransport().sendMail({
    from: serverEnv().MAIL_FROM,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
  });
  return { messageId: info.messageId };
}

/** True when the mail fake's inbox is configured; the admin inbox page is shown only then. */
export function fakeInboxEnabled(): boolean {
  return Boolean(serverEnv().MAIL_FAKE_INBOX_URL);
}

async function fetchInbox(path: string): Promise<Response | null> {
  const base = serverEnv().MAIL_FAKE_INBOX_URL;
  if (!base) return null;
  return fetch(new URL(path, base), { cache: "no-store", signal: AbortSignal.timeout(5_000) });
}

/** Messages the mail fake received, newest first; null when no fake inbox is configured. */
export async function listFakeInbox(options: { to?: string } = {}): Promise<FakeMailMessage[] | null> {
  const query = options.to ? `?to=${encodeURIComponent(options.to)}` : "";
  const response = await fetchInbox(`/messages${query}`);
  if (!response) return null;
  if (!response.ok) throw new Error(`Mail fake inbox answered ${response.status}`);
  return fakeMailListSchema.parse(await response.json());
}

/** One message; null when it does not exist or no fake inbox is configured. */
export async function getFakeInboxMessage(id: string): Promise<FakeMailMessage | null> {
  const response = await fetchInbox(`/messages/${encodeURIComponent(id)}`);
  if (!response || response.status === 404) return null;
  if (!response.ok) throw new Error(`Mail fake inbox answered ${response.status}`);
  return fakeMailMessageSchema.parse(await response.json());
}
