import { TableScroller } from "@/components/ui/table-scroller";
import type { FigureChange, TextChange } from "@/lib/revision-diff";

const context = 2;

/** A long unchanged stretch shows only its first and last lines around an ellipsis (null), so the changes stand out. */
function shownLines(part: TextChange): (string | null)[] {
  const lines = part.text.replace(/\n$/, "").split("\n");
  if (part.kind !== "same" || lines.length <= context * 2 + 1) return lines;
  return [...lines.slice(0, context), null, ...lines.slice(-context)];
}

/** Changed figures as a table, then the MDX source with added and removed lines marked in words as well as colour. */
export function RevisionDiffView({ figures, body, from, to }: { figures: FigureChange[]; body: TextChange[]; from: number; to: number }) {
  const bodyChanged = body.some((part) => part.kind !== "same");
  return (
    <div className="space-y-6">
      <section aria-labelledby="figures-diff-heading" className="space-y-2">
        <h2 id="figures-diff-heading" className="font-serif text-2xl">
          Figures that changed
        </h2>
        {figures.length ? (
          <TableScroller label={`Figures in revision ${from} and revision ${to}`} className="rounded border border-rule bg-paper-raised">
            <table className="w-full min-w-[40rem] text-left text-sm">
              <caption className="sr-only">
                Figures in revision {from} and revision {to}
              </caption>
              <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th scope="col" className="px-3 py-2">Figure</th>
                  <th scope="col" className="px-3 py-2">Revision {from}</th>
                  <th scope="col" className="px-3 py-2">Revision {to}</th>
                </tr>
              </thead>
              <tbody>
                {figures.map((change) => (
                  <tr key={change.key} className="border-t border-rule align-top">
                    <th scope="row" className="px-3 py-2 font-semibold">{change.label}</th>
                    <td className="figure px-3 py-2 text-ink-soft">{change.before ?? "not shown"}</td>
                    <td className="figure px-3 py-2">{change.after ?? "not shown"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroller>
        ) : (
          <p className="text-ink-soft">No figure or verdict changed.</p>
        )}
      </section>
      <section aria-labelledby="text-diff-heading" className="space-y-2">
        <h2 id="text-diff-heading" className="font-serif text-2xl">
          Text that changed
        </h2>
        {bodyChanged ? (
          <pre className="overflow-x-auto whitespace-pre-wrap break-words rounded border border-rule bg-paper-raised p-3 text-xs leading-relaxed">
            {body.map((part, index) => (
              // The parts are a fixed sequence computed once; their position is their identity.
              <span
                key={index}
                className={part.kind === "added" ? "block bg-verdigris-wash" : part.kind === "removed" ? "block bg-copper-wash line-through decoration-copper/60" : "block text-ink-faint"}
              >
                {shownLines(part)
                  .map((line) => (line === null ? "  …" : `${part.kind === "added" ? "+ " : part.kind === "removed" ? "− " : "  "}${line}`))
                  .join("\n")}
              </span>
            ))}
          </pre>
        ) : (
          <p className="text-ink-soft">The body text is the same.</p>
        )}
      </section>
    </div>
  );
}
