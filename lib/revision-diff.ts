import { diffLines } from "diff";
import { formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import type { FrozenReportContent } from "@/db/schema";
import { assembleReportEmbeds } from "@/lib/report-embeds";

// What changed between two revisions of a report: the MDX line by line, and every figure a reader sees, side by side.

export type FigureLine = { key: string; label: string; value: string };

/** Every number and verdict a revision shows, each under a name that stays the same from one revision to the next. */
export function figureLines(content: FrozenReportContent): FigureLine[] {
  const embeds = assembleReportEmbeds(content);
  const lines: FigureLine[] = [
    { key: "title", label: "Title", value: content.title },
    { key: "disclosure", label: "Disclosure", value: content.disclosure || "—" },
  ];
  const push = (key: string, label: string, value: string) => lines.push({ key, label, value });
  for (const analysis of Object.values(embeds.analyses)) {
    const at = `${analysis.label} · ${analysis.tool.name}`;
    push(`${analysis.label}:source`, `${at}: analysed capture`, `${analysis.captureFileName} (run of ${analysis.run.testedOn}, code ${analysis.analysisVersion ?? "—"})`);
    const waveform = analysis.waveform;
    if (waveform) {
      push(`${analysis.label}:current`, `${at}: current`, `${formatNumber(waveform.current.rms)} A RMS, ${formatNumber(waveform.current.peak)} A peak`);
      if (waveform.power) {
        push(`${analysis.label}:power`, `${at}: real power`, `${formatNumber(waveform.power.real)} W mean, ${formatNumber(waveform.power.whileConducting)} W while conducting`);
        push(`${analysis.label}:factor`, `${at}: power factor`, formatNumber(waveform.power.factor, 3));
      }
      push(
        `${analysis.label}:half-cycles`,
        `${at}: switching`,
        `duty ${formatNumber(waveform.halfCycles.duty * 100, 3)} %, ${formatNumber(waveform.halfCycles.switchesPerMinute, 3)} switchings/min, ${waveform.halfCycles.firing}`,
      );
      push(`${analysis.label}:harmonics`, `${at}: harmonics`, `THD ${formatNumber(waveform.harmonics.thdPercent, 3)} %, ${waveform.harmonics.status}`);
    }
    const heatUp = analysis.heatUp;
    if (heatUp) {
      push(`${analysis.label}:band-entry`, `${at}: in the band after`, heatUp.bandEntryS === null ? "never" : `${formatNumber(heatUp.bandEntryS, 3)} s`);
      push(`${analysis.label}:overshoot`, `${at}: overshoot`, `${formatNumber(heatUp.overshootC, 3)} °C`);
      push(`${analysis.label}:steady`, `${at}: steady state`, `${formatNumber(heatUp.finalTemperatureC, 4)} °C`);
    }
    for (const { quantity, unit, verdict } of analysis.verdicts) {
      push(`${analysis.label}:verdict:${quantity}`, `${at}: ${quantity}`, `${formatMeasured(verdict.normalized ?? verdict.measured, verdict.expandedUncertainty, unit)}, ${verdict.result}`);
    }
  }
  for (const tool of embeds.tools) {
    const seen = new Map<string, number>();
    for (const measurement of tool.measurements.filter((candidate) => candidate.source === "manual")) {
      const repeat = (seen.get(measurement.kind) ?? 0) + 1;
      seen.set(measurement.kind, repeat);
      push(
        `${tool.slug}:manual:${measurement.kind}:${repeat}`,
        `${tool.name}: ${measurement.quantity}${repeat > 1 ? ` (${repeat})` : ""}, read by hand`,
        `${formatMeasured(measurement.value, measurement.expandedUncertainty, measurement.unit)}${measurement.verdict ? `, ${measurement.verdict.result}` : ""}`,
      );
    }
  }
  return lines;
}

export type FigureChange = { key: string; label: string; before: string | null; after: string | null };

/** The figures that differ, in the order the newer revision shows them, then those it dropped. */
export function changedFigures(before: FrozenReportContent, after: FrozenReportContent): FigureChange[] {
  const old = new Map(figureLines(before).map((line) => [line.key, line]));
  const changes: FigureChange[] = [];
  for (const line of figureLines(after)) {
    const previous = old.get(line.key);
    old.delete(line.key);
    if (previous?.value !== line.value) changes.push({ key: line.key, label: line.label, before: previous?.value ?? null, after: line.value });
  }
  for (const line of old.values()) changes.push({ key: line.key, label: line.label, before: line.value, after: null });
  return changes;
}

export type TextChange = { kind: "added" | "removed" | "same"; text: string };

/** The MDX source line by line; long unchanged stretches are left for the reader to skip. */
export function bodyChanges(before: string, after: string): TextChange[] {
  return diffLines(before, after).map((part) => ({ kind: part.added ? "added" : part.removed ? "removed" : "same", text: part.value }));
}
