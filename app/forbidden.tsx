import Link from "next/link";

export default function Forbidden() {
  return (
    <section className="max-w-xl space-y-3">
      <h1 className="font-serif text-3xl">Not for your role</h1>
      <p className="text-ink-soft">
        You are signed in, but your account&apos;s role does not open this page. If you think it should, ask an admin.
      </p>
      <Link href="/" className="text-copper underline underline-offset-4">
        Back to the front page
      </Link>
    </section>
  );
}
