import type { ReactNode } from "react";

/** Labelled figures in a bordered list: a tool's ratings, a protocol's conditions. */
export function FigureList({ rows }: { rows: readonly (readonly [label: string, value: ReactNode])[] }) {
  return (
    <dl className="divide-y divide-rule rounded border border-rule bg-paper-raised">
      {rows.map(([label, value]) => (
        <div key={label} className="grid grid-cols-2 gap-4 px-4 py-2">
          <dt className="text-ink-soft">{label}</dt>
          <dd className="figure">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
