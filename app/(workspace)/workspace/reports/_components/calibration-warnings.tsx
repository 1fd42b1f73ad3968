import type { CalibrationWarning } from "@/db/queries/runs";

/** Runs dated after an instrument's calibration fell due, from the snapshot each run keeps of its instruments. */
export function CalibrationWarnings({ warnings, toolOfRun }: { warnings: CalibrationWarning[]; toolOfRun: Map<string, string> }) {
  if (warnings.length === 0) return null;
  return (
    <div role="alert" className="rounded border-l-4 border-verdict-inconclusive bg-paper-sunk px-4 py-3 text-sm text-ink">
      <p className="font-semibold">Calibration overdue on a cited run</p>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {warnings.map((warning) => (
          <li key={`${warning.runId}-${warning.instrumentId}`}>
            {toolOfRun.get(warning.runId) ?? "A cited run"}, run of {warning.testedOn}: {warning.maker} {warning.model} (serial {warning.serialNumber}) was due
            for calibration on {warning.calibrationDueOn}. Say so in the report, or cite a run made within calibration.
          </li>
        ))}
      </ul>
    </div>
  );
}
