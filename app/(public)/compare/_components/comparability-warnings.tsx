import { ambientThresholdC, type ComparabilityWarning } from "@/lib/comparability";

/**
 * The conditions in which the two tools' runs differ, above every figure, each named with what each tool had; or a
 * plain statement that the runs match, so an absent warning is never mistaken for a page that forgot to check.
 */
export function ComparabilityWarnings({ warnings, names, compared }: { warnings: ComparabilityWarning[]; names: { a: string; b: string }; compared: boolean }) {
  if (!compared) return null;
  if (warnings.length === 0) {
    return (
      <section aria-labelledby="comparability-heading" className="rounded border border-verdigris bg-verdigris-wash p-4">
        <h2 id="comparability-heading" className="font-serif text-xl text-verdigris-deep">
          Measured on equal terms
        </h2>
        <p className="mt-1 text-sm text-ink">
          Both tools&apos; results come from the same protocol version, supply voltage and frequency, nozzle and setpoints, with ambient temperatures within{" "}
          {ambientThresholdC} °C of each other.
        </p>
      </section>
    );
  }
  return (
    <section aria-labelledby="comparability-heading" data-testid="comparability-warnings" className="rounded border-2 border-copper bg-copper-wash p-4">
      <h2 id="comparability-heading" className="font-serif text-xl text-copper-deep">
        Not measured on equal terms: {warnings.length} {warnings.length === 1 ? "difference" : "differences"}
      </h2>
      <p className="mt-1 text-sm text-ink">The runs behind these results differ as listed; some gaps between the figures below may come from these conditions rather than from the tools.</p>
      <ul className="mt-3 grid gap-2 md:grid-cols-2">
        {warnings.map((warning) => (
          <li key={warning.condition} data-condition={warning.condition} className="rounded border border-copper/40 bg-paper-raised px-3 py-2 text-sm">
            <strong className="block font-semibold text-ink">{warning.title}</strong>
            <span className="block text-ink-soft">
              {names.a}: <span className="font-semibold text-ink">{warning.a.join("; ")}</span>
            </span>
            <span className="block text-ink-soft">
              {names.b}: <span className="font-semibold text-ink">{warning.b.join("; ")}</span>
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
