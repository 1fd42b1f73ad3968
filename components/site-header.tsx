import Link from "next/link";
import { SignOutButton } from "@/components/sign-out-button";
import { Wordmark } from "@/components/wordmark";
import { can, roleNavigation } from "@/lib/authz";
import { getCurrentUser } from "@/lib/session";

export async function SiteHeader() {
  const user = await getCurrentUser();
  const roleLinks = roleNavigation.filter((link) => can(user?.role, link.permission));
  return (
    <header className="border-b border-rule bg-paper-raised">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" aria-label="Benchplate home">
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="flex flex-wrap items-center gap-x-5 gap-y-1 text-sm font-semibold">
          <Link href="/reports" className="hover:text-copper">
            Reports
          </Link>
          <Link href="/tools" className="hover:text-copper">
            Tools
          </Link>
          <Link href="/compare" className="hover:text-copper">
            Compare
          </Link>
          <Link href="/requests" className="hover:text-copper">
            Requests
          </Link>
          <Link href="/search" className="hover:text-copper">
            Search
          </Link>
          {roleLinks.map((link) => (
            <Link key={link.href} href={link.href} className="text-verdigris-deep hover:text-copper">
              {link.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-4 text-sm print:hidden">
          {user ? (
            <>
              <Link href="/account" className="hover:text-copper">
                {user.name} <span className="text-ink-faint">· {user.role}</span>
              </Link>
              <SignOutButton />
            </>
          ) : (
            <>
              <Link href="/sign-in" className="font-semibold hover:text-copper">
                Sign in
              </Link>
              <Link href="/sign-up" className="rounded border border-ink px-3 py-1 hover:bg-ink hover:text-paper-raised">
                Join as a reader
              </Link>
            </>
          )}
        </div>
      </div>
    </header>
  );
}
