import type { Metadata } from "next";
import Link from "next/link";

export const metadata: Metadata = { title: "Account deleted", robots: { index: false } };

export default function AccountDeletedPage() {
  return (
    <section className="max-w-2xl space-y-4">
      <h1 className="font-serif text-3xl">Your account is deleted</h1>
      <p className="text-ink-soft">
        Your name, address, picture, e-mail settings and votes are gone. Comments you wrote stay beside the reports they discuss,
        signed “a former reader”, and requests you asked for stay open for others to vote on.
      </p>
      <p>
        <Link href="/" className="font-semibold text-copper underline">
          Back to Benchplate
        </Link>
      </p>
    </section>
  );
}
