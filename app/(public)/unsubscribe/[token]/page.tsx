import type { Metadata } from "next";
import Link from "next/link";
import { unsubscribeByToken } from "@/db/queries/notifications";
import { notificationTopicDetails } from "@/lib/notification-topics";
import { unsubscribeSchema } from "@/lib/validations/notifications";

export const metadata: Metadata = { title: "Unsubscribe", robots: { index: false } };

/**
 * The link at the foot of every notification lands here and switches its topic off straight away, without signing in:
 * that is what the person asked for, and doing it again changes nothing.
 */
export default async function UnsubscribePage({ params, searchParams }: PageProps<"/unsubscribe/[token]">) {
  const { token } = await params;
  const { topic } = await searchParams;
  const parsed = unsubscribeSchema.safeParse({ token, topic });
  const done = parsed.success ? await unsubscribeByToken(parsed.data) : null;

  return (
    <section className="max-w-2xl space-y-4">
      <h1 className="font-serif text-3xl">E-mail settings</h1>
      {parsed.success && done ? (
        <>
          <p role="status" className="border-l-4 border-verdigris bg-verdigris-wash px-4 py-3">
            Done: you will no longer receive e-mails about “<strong>{notificationTopicDetails[parsed.data.topic].label}</strong>”.
          </p>
          <p className="text-ink-soft">
            Other e-mails stay as they were. Mail about your account itself, such as password resets, is always sent.
          </p>
        </>
      ) : (
        <p role="alert" className="border-l-4 border-copper bg-copper-wash px-4 py-3">
          {parsed.success ? "This unsubscribe link is not valid any more." : parsed.error.issues[0]?.message} Sign in to choose which
          e-mails you receive.
        </p>
      )}
      <p>
        <Link href="/account#notifications" className="font-semibold text-copper underline">
          All your e-mail settings
        </Link>{" "}
        <span className="text-sm text-ink-faint">(after signing in)</span>
      </p>
    </section>
  );
}
