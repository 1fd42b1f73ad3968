import Link from "next/link";

/** The way back up from a detail or form page to its list. */
export function BackLink({ href, children }: { href: string; children: string }) {
  return (
    <nav aria-label="Breadcrumb" className="text-sm">
      <Link href={href} className="text-verdigris-deep hover:text-copper">
        ← {children}
      </Link>
    </nav>
  );
}
