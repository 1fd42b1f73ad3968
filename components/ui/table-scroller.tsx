import type { ReactNode } from "react";

/**
 * The scroller a wide table sits in, so that on a phone the table scrolls sideways and the page does not. It is a named,
 * focusable region because a table of plain figures has nothing else a keyboard user could reach to scroll it.
 */
export function TableScroller({ label, className = "", children }: { label: string; className?: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className={`overflow-x-auto ${className}`}>
      {children}
    </div>
  );
}
