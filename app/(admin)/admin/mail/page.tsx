import type { Metadata } from "next";
import { listFakeInbox } from "@/lib/mail";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Outgoing mail" };

export default async function OutgoingMailPage() {
  await requirePagePermission("mail:inspect", "/admin/mail");
  const messages = await listFakeInbox();
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Outgoing mail</h1>
      {messages === null ? (
        <p className="text-ink-soft">
          Mail goes to a real provider here, so there is no local inbox to show. The demo sets MAIL_FAKE_INBOX_URL to list what the
          local SMTP fake received.
        </p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">What the local SMTP fake received, newest first ({messages.length}).</p>
          <ol className="space-y-3">
            {messages.map((message) => (
              <li key={message.id} className="rounded border border-rule bg-paper-raised p-4">
                <p className="text-xs text-ink-faint">
                  <time dateTime={message.receivedAt}>{new Date(message.receivedAt).toUTCString()}</time> · to {message.to.join(", ")}
                </p>
                <h2 className="font-semibold">{message.subject}</h2>
                <pre className="mt-2 whitespace-pre-wrap break-words font-mono text-xs text-ink-soft">{message.text}</pre>
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
