import Link from "next/link";
import type { ComponentProps } from "react";

type Href = ComponentProps<typeof Link>["href"];

/** Previous / next links for a list paged on the server. */
export function Pager({
  page,
  perPage,
  total,
  noun,
  hrefFor,
}: {
  page: number;
  perPage: number;
  total: number;
  noun: [singular: string, plural: string];
  hrefFor: (page: number) => Href;
}) {
  const lastPage = Math.max(1, Math.ceil(total / perPage));
  return (
    <nav aria-label="Pages" className="flex items-center gap-4 text-sm">
      {page > 1 ? <Link href={hrefFor(page - 1)}>← Previous</Link> : null}
      <span className="text-ink-faint">
        Page {page} of {lastPage} · {total} {total === 1 ? noun[0] : noun[1]}
      </span>
      {page < lastPage ? <Link href={hrefFor(page + 1)}>Next →</Link> : null}
    </nav>
  );
}
