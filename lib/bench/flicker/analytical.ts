/**
 * IEC 61000-3-3 analytical method: each voltage change leaves a flicker impression time
 * t_f = 2.3·(F·dmax)^3.2 s (dmax in %), and Pst = (Σt_f / T_p)^(1/3.2) over T_p = 600 s. Shape
 * factor F = 1 for steps (seen); the exponents and constant are from memory, cross-checked against
 * Table 5 of IEC 61000-4-15: within ±4 % up to about 40 changes/min, drifting above it.
 */
import { OBSERVATION_SECONDS } from "./flickermeter";
import type { VoltageChanges } from "./voltage-changes";

const ANALYTICAL_MAX_CHANGES_PER_MINUTE = 40;
const STEP_SHAPE_FACTOR = 1;

export interface AnalyticalPst {
  pst: number;
  valid: boolean;
  note: string;
}

/** Pst of equal steps of `stepPercent` at a regular rate. */
export function analyticalPst(stepPercent: number, changesPerMinute: number): number {
  const impressionSeconds = 2.3 * (STEP_SHAPE_FACTOR * stepPercent) ** 3.2;
  const changes = (changesPerMinute * OBSERVATION_SECONDS) / 60;
  return ((changes * impressionSeconds) / OBSERVATION_SECONDS) ** (1 / 3.2);
}

/** The cross-check for a capture, or null when the voltage never changes. */
export function analyticalMethod(changes: VoltageChanges): AnalyticalPst | null {
  if (changes.changesPerMinute === 0) return null;
  const pst = analyticalPst(changes.stepPercent, changes.changesPerMinute);
  const rate = `${changes.changesPerMinute.toFixed(1)} changes/min`;
  if (!changes.rectangular) {
    return { pst, valid: false, note: `voltage changes are not rectangular steps (${rate}); the analytical method with F = 1 does not apply` };
  }
  if (changes.changesPerMinute > ANALYTICAL_MAX_CHANGES_PER_MINUTE) {
    return {
      pst,
      valid: false,
      note: `${rate} is above the ${ANALYTICAL_MAX_CHANGES_PER_MINUTE}/min where the analytical method tracks the flickermeter; it reads high beyond it`,
    };
  }
  return { pst, valid: true, note: `rectangular steps of ${changes.stepPercent.toFixed(3)} % at ${rate}, F = 1` };
}
