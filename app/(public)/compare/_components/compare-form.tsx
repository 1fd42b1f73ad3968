import type { CompareSide } from "@/lib/validations/compare";
import { ToolPicker, type PickedTool } from "./tool-picker";

export const sideLabels: Record<CompareSide, string> = { a: "First tool", b: "Second tool" };

/**
 * The two pickers in a GET form: with JavaScript each choice replaces the URL at once; without it the button sends
 * the typed text (and the tool already chosen on the other side), which the page resolves.
 */
export function CompareForm({ picked }: { picked: Record<CompareSide, PickedTool | null> }) {
  const current = { a: picked.a?.slug ?? null, b: picked.b?.slug ?? null };
  return (
    <form action="/compare" method="get" role="search" aria-label="Choose two tools" className="grid gap-4 rounded border border-rule bg-paper-raised p-4 sm:grid-cols-[1fr_1fr_auto] sm:items-start">
      {(["a", "b"] as const).map((side) => (
        <div key={side}>
          {current[side] ? <input type="hidden" name={side} value={current[side]} /> : null}
          <ToolPicker key={current[side] ?? "none"} side={side} label={sideLabels[side]} picked={picked[side]} current={current} />
        </div>
      ))}
      <button type="submit" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised sm:mt-6">
        Compare
      </button>
    </form>
  );
}
