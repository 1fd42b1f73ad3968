import { fakeMailListSchema, type FakeMailMessage } from "@/lib/fake-inbox";

export type { FakeMailMessage } from "@/lib/fake-inbox";

function inboxUrl(path: string): URL {
  const base = process.env.MAIL_FAKE_INBOX_URL ?? "http://127.0.0.1:2581";
  return new URL(path, base);
}

/** Messages the mail fake received, newest first, optionally only those addressed to `to`. */
export async function listMessages(to?: string): Promise<FakeMailMessage[]> {
  const response = await fetch(inboxUrl(to ? `/messages?to=${encodeURIComponent(to)}` : "/messages"));
  if (!response.ok) throw new Error(`mail fake inbox answered ${response.status}`);
  return fakeMailListSchema.parse(await response.json());
}

export async function clearMessages(): Promise<void> {
  const response = await fetch(inboxUrl("/messages"), { method: "DELETE" });
  if (!response.ok) throw new Error(`mail fake inbox answered ${response.status} to DELETE`);
}

/**
 * The newest message to `to` whose subject matches, polling because the app sends mail after it answers the
 * request. Fails with the subjects that did arrive, which is usually enough to see what went wrong.
 */
export async function waitForMessage(
  to: string,
  subjectMatch: string | RegExp,
  { timeoutMs = 10_000, intervalMs = 200 }: { timeoutMs?: number; intervalMs?: number } = {},
): Promise<FakeMailMessage> {
  const matches = (subject: string) =>
    typeof subjectMatch === "string" ? subject.includes(subjectMatch) : subjectMatch.test(subject);
  const deadline = Date.now() + timeoutMs;
  let seen: FakeMailMessage[] = [];
  while (Date.now() < deadline) {
    seen = await listMessages(to);
    const found = seen.find((message) => matches(message.subject));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
  const subjects = seen.map((message) => JSON.stringify(message.subject)).join(", ") || "none";
  throw new Error(`no message to ${to} matching ${String(subjectMatch)} within ${timeoutMs} ms (subjects: ${subjects})`);
}

/**
 * The one message to `to` with exactly this subject: waits for it, then gives a late duplicate time to arrive before
 * counting, and fails if there is not exactly one.
 */
export async function expectExactlyOnce(to: string, subject: string): Promise<FakeMailMessage> {
  await waitForMessage(to, subject, { timeoutMs: 90_000 });
  await new Promise((resolve) => setTimeout(resolve, 2_000));
  const matching = (await listMessages(to)).filter((message) => message.subject === subject);
  if (matching.length !== 1) throw new Error(`${matching.length} messages “${subject}” to ${to}, expected exactly one`);
  return matching[0]!;
}
