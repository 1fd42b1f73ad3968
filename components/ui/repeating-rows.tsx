"use client";

import { useRef, useState, type ReactNode } from "react";

/** How many rows named `prefix.<index>.<field>` a set of echoed or stored form values holds. */
export function countIndexedRows(values: Record<string, string> | undefined, prefix: string): number {
  let count = 0;
  for (const name of Object.keys(values ?? {})) {
    const match = new RegExp(`^${prefix}\\.(\\d+)\\.`).exec(name);
    if (match) count = Math.max(count, Number(match[1]) + 1);
  }
  return count;
}

/**
 * "Add another" rows inside a form. Inputs are named `prefix.<index>.<field>` by the caller's `renderRow`, and
 * indexes are renumbered on removal so the server always sees 0…n-1 (lib/form-data.ts withIndexedRows reads them).
 * A row's starting values must be looked up by `source`, its index in the values the rows started from (null for a row
 * added since): looking them up by the current index would hand a row its removed neighbour's values. Give the
 * component a `key` that changes with those values, so echoed values after a refusal start a fresh set of rows.
 */
export function RepeatingRows({
  legend,
  hint,
  addLabel,
  rowLabel,
  initialCount,
  minRows = 0,
  error,
  renderRow,
}: {
  legend: string;
  hint?: ReactNode;
  addLabel: string;
  rowLabel: (index: number) => string;
  initialCount: number;
  minRows?: number;
  error?: string[];
  renderRow: (index: number, source: number | null) => ReactNode;
}) {
  const nextKey = useRef(Math.max(initialCount, minRows));
  const [keys, setKeys] = useState(() => Array.from({ length: Math.max(initialCount, minRows) }, (_, index) => index));
  return (
    <fieldset className="space-y-3" aria-describedby={error?.length ? `${legend}-rows-error` : undefined}>
      <legend className="font-serif text-xl">{legend}</legend>
      {hint ? <p className="text-sm text-ink-soft">{hint}</p> : null}
      {keys.map((key, index) => (
        <fieldset key={key} className="rounded border border-rule bg-paper-raised p-3">
          <legend className="px-1 text-sm font-semibold text-ink-soft">{rowLabel(index)}</legend>
          <div className="flex flex-wrap items-start gap-3">
            {renderRow(index, key < initialCount ? key : null)}
            {keys.length > minRows ? (
              <button
                type="button"
                onClick={() => setKeys((current) => current.filter((candidate) => candidate !== key))}
                className="mt-6 rounded border border-rule px-3 py-2 text-sm hover:border-copper hover:text-copper"
              >
                Remove <span className="sr-only">{rowLabel(index)}</span>
              </button>
            ) : null}
          </div>
        </fieldset>
      ))}
      {error?.length ? (
        <p id={`${legend}-rows-error`} className="text-sm text-copper-deep">
          {error.join(" ")}
        </p>
      ) : null}
      <button
        type="button"
        onClick={() => setKeys((current) => [...current, nextKey.current++])}
        className="rounded border border-ink px-3 py-1.5 text-sm font-semibold hover:bg-ink hover:text-paper-raised"
      >
        {addLabel}
      </button>
    </fieldset>
  );
}
