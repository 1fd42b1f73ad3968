/** Runs of conducting and blocked half-cycles, in order: the strip draws one rectangle per run, not per half-cycle. */
export function conductionRuns(conducting: readonly boolean[]): { on: boolean; from: number; count: number }[] {
  const runs: { on: boolean; from: number; count: number }[] = [];
  conducting.forEach((on, index) => {
    const last = runs[runs.length - 1];
    if (last && last.on === on) last.count += 1;
    else runs.push({ on, from: index, count: 1 });
  });
  return runs;
}

export function ConductionStrip({ conducting, halfCycleSeconds }: { conducting: boolean[]; halfCycleSeconds: number }) {
  const runs = conductionRuns(conducting);
  const total = conducting.length;
  return (
    <div>
      <svg viewBox={`0 0 ${Math.max(total, 1)} 1`} preserveAspectRatio="none" className="h-10 w-full rounded border border-rule bg-paper-sunk">
        {runs
          .filter((run) => run.on)
          .map((run) => (
            <rect key={run.from} x={run.from} y={0} width={run.count} height={1} fill="#a5481f" />
          ))}
      </svg>
      <div className="mt-1 flex justify-between text-xs text-ink-faint">
        <span className="figure">0 s</span>
        <span className="flex items-center gap-3">
          <span className="flex items-center gap-1">
            <span className="inline-block size-3 rounded-sm bg-copper" /> conducting
          </span>
          <span className="flex items-center gap-1">
            <span className="inline-block size-3 rounded-sm border border-rule bg-paper-sunk" /> blocked
          </span>
        </span>
        <span className="figure">{(total * halfCycleSeconds).toFixed(2)} s</span>
      </div>
    </div>
  );
}
