import type { ReactNode } from "react";

/** The one row a table shows when it has none to show: the reason, across every column. */
export function EmptyTableRow({ columns, padding = "py-6", children }: { columns: number; padding?: "py-4" | "py-6"; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={columns} className={`px-3 ${padding} text-center text-ink-soft`}>
        {children}
      </td>
    </tr>
  );
}
