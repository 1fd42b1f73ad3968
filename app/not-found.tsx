import Link from "next/link";

export default function NotFound() {
  return (
    <section className="max-w-xl space-y-3">
      <h1 className="font-serif text-3xl">Nothing on this bench</h1>
      <p className="text-ink-soft">The page you asked for does not exist or has moved.</p>
      <Link href="/tools" className="text-copper underline underline-offset-4">
        Browse the tools
      </Link>
    </section>
  );
}
