// Verdicts: a measurement judged against a rating under a stated decision
// rule, as ISO/IEC 17025:2017 clauses 7.1.3 and 7.8.6 require of a statement
// of conformity. Every verdict carries the numbers that produced it.

import { requireFinite, requireFiniteList, requireNonNegative, requirePositive } from "./input-checks";
import { typeAStandardUncertainty } from "./statistics";
import {
  powerInputTolerance,
  ratedVoltagePoints,
  type ApplianceType,
  type RatedVoltage,
  type RatingTolerance,
} from "./tolerance";
import {
  COVERAGE_FACTOR,
  combineRelativeUncertainties,
  specStandardUncertainty,
  type AccuracySpec,
  type PowerLawTerm,
} from "./uncertainty";

export type DecisionRule = "simple" | "guarded";

export type VerdictResult = "meets rating" | "above rating" | "below rating" | "inconclusive";

export interface Judgement {
  measured: number;
  expandedUncertainty: number;
  lower: number | null;
  upper: number | null;
  rule: DecisionRule;
  /** w: 0 under simple acceptance, U under guarded acceptance. */
  guardBand: number;
  acceptanceLower: number | null;
  acceptanceUpper: number | null;
  result: VerdictResult;
}

/**
 * Decision rules of ILAC-G8:09/2019.
 *
 * simple: acceptance limits are the tolerance limits; a value on a limit meets
 * the rating. Binary, and the false-accept risk reaches 50 % at a limit.
 *
 * guarded: guard band w = U (k = 2). The closed interval measured ± U decides:
 * wholly inside the tolerance → "meets rating" (false accept < 2.5 %); wholly
 * outside → "above rating" / "below rating"; straddling a limit →
 * "inconclusive", which covers ILAC-G8's conditional pass (inside, within U of
 * a limit) and conditional fail (outside, within U of it). A value exactly U
 * inside a limit meets; exactly U outside is still inconclusive, since its
 * interval touches the limit. When 2U exceeds the tolerance width nothing can
 * meet the rating, and the acceptance limits cross to show it.
 *
 * A missing limit (one-sided Table 1 rows, one-sided protocol tolerances)
 * never yields a verdict on that side.
 */
export function judge(input: {
  measured: number;
  expandedUncertainty: number;
  lower: number | null;
  upper: number | null;
  rule: DecisionRule;
}): Judgement {
  const measured = requireFinite("measured", input.measured);
  const expandedUncertainty = requireNonNegative("expandedUncertainty", input.expandedUncertainty);
  const { lower, upper, rule } = input;
  if (lower !== null) requireFinite("lower", lower);
  if (upper !== null) requireFinite("upper", upper);
  if (lower === null && upper === null) throw new Error("A verdict needs at least one tolerance limit; lower and upper are both null");
  if (lower !== null && upper !== null && lower > upper) {
    throw new Error(`Tolerance lower limit ${lower} is above the upper limit ${upper}`);
  }
  if (rule !== "simple" && rule !== "guarded") throw new Error(`rule must be "simple" or "guarded", got ${String(rule)}`);

  const guardBand = rule === "guarded" ? expandedUncertainty : 0;
  const acceptanceLower = lower === null ? null : lower + guardBand;
  const acceptanceUpper = upper === null ? null : upper - guardBand;
  let result: VerdictResult;
  if (upper !== null && measured - guardBand > upper) result = "above rating";
  else if (lower !== null && measured + guardBand < lower) result = "below rating";
  else if (
    (acceptanceLower === null || measured >= acceptanceLower) &&
    (acceptanceUpper === null || measured <= acceptanceUpper)
  ) {
    result = "meets rating";
  } else result = "inconclusive";

  return { measured, expandedUncertainty, lower, upper, rule, guardBand, acceptanceLower, acceptanceUpper, result };
}

/** A tolerance a protocol sets on a rating; null on a side means no limit there. */
export interface ProtocolTolerance {
  kind: "percent" | "absolute";
  plus: number | null;
  minus: number | null;
  /** Where the tolerance comes from, e.g. the protocol version. */
  source?: string;
}

export interface RatingVerdict {
  rated: number;
  measured: number;
  lower: number | null;
  upper: number | null;
  acceptanceLower: number | null;
  acceptanceUpper: number | null;
  expandedUncertainty: number;
  coverageFactor: typeof COVERAGE_FACTOR;
  rule: DecisionRule;
  result: VerdictResult;
  tolerance: { source: string; description: string };
}

function describeSide(sign: "+" | "−", value: number | null, kind: ProtocolTolerance["kind"]): string | null {
  if (value === null) return null;
  return kind === "percent" ? `${sign}${value} %` : `${sign}${value}`;
}

/** Airflow, heat-up time, temperature and other ratings judged against a protocol's tolerance. */
export function judgeRating(input: {
  rated: number;
  measured: number;
  expandedUncertainty: number;
  tolerance: ProtocolTolerance;
  rule: DecisionRule;
}): RatingVerdict {
  const rated = requireFinite("rated", input.rated);
  const { kind, plus, minus, source } = input.tolerance;
  if (kind !== "percent" && kind !== "absolute") throw new Error(`tolerance.kind must be "percent" or "absolute", got ${String(kind)}`);
  if (plus === null && minus === null) throw new Error("tolerance needs a plus or a minus limit; both are null");
  if (plus !== null) requireNonNegative("tolerance.plus", plus);
  if (minus !== null) requireNonNegative("tolerance.minus", minus);
  if (kind === "percent") {
    requirePositive("rated (a percentage tolerance needs a positive rating)", rated);
    if (minus !== null && minus > 100) throw new Error(`tolerance.minus of ${minus} % would put the lower limit below zero`);
  }
  const upper = plus === null ? null : kind === "percent" ? rated * (1 + plus / 100) : rated + plus;
  const lower = minus === null ? null : kind === "percent" ? rated * (1 - minus / 100) : rated - minus;
  const judgement = judge({
    measured: input.measured,
    expandedUncertainty: input.expandedUncertainty,
    lower,
    upper,
    rule: input.rule,
  });
  const sides = [describeSide("+", plus, kind), describeSide("−", minus, kind)].filter((side) => side !== null);
  return {
    rated,
    measured: judgement.measured,
    lower,
    upper,
    acceptanceLower: judgement.acceptanceLower,
    acceptanceUpper: judgement.acceptanceUpper,
    expandedUncertainty: judgement.expandedUncertainty,
    coverageFactor: COVERAGE_FACTOR,
    rule: judgement.rule,
    result: judgement.result,
    tolerance: { source: source ?? "protocol", description: sides.join(" / ") },
  };
}

/**
 * Power factor while conducting at or above which the load is taken as a fixed
 * resistance, so P ∝ V² (common practice, no source).
 */
export const RESISTIVE_POWER_FACTOR = 0.98;

export interface PowerInputInput {
  ratedPowerW: number;
  ratedVoltage: RatedVoltage;
  appliance: ApplianceType;
  motorShareAbove50?: boolean;
  powerWhileConductingW: number;
  /** Null without a voltage channel: the power is then an estimate from the nominal voltage. */
  voltageRmsWhileConducting: number | null;
  currentRmsWhileConducting: number;
  powerFactorWhileConducting: number | null;
  currentAccuracy: AccuracySpec | null;
  voltageAccuracy: AccuracySpec | null;
  repeatsW?: readonly number[];
  rule: DecisionRule;
}

/** The power input normalised to one end of a rated voltage range and judged there. */
export interface RangeEndVerdict {
  voltage: number;
  normalized: number;
  acceptanceLower: number | null;
  acceptanceUpper: number | null;
  expandedUncertainty: number;
  result: VerdictResult;
}

export interface PowerInputVerdict {
  rated: number;
  measured: number;
  normalized: number | null;
  normalizedTo: number | null;
  normalizationNote: string;
  lower: number | null;
  upper: number | null;
  acceptanceLower: number | null;
  acceptanceUpper: number | null;
  expandedUncertainty: number;
  coverageFactor: typeof COVERAGE_FACTOR;
  rule: DecisionRule;
  result: VerdictResult;
  tolerance: RatingTolerance;
  /** Each end of a rated voltage range when the power was normalised to them; null otherwise. */
  ends: RangeEndVerdict[] | null;
  inputs: {
    ratedPowerW: number;
    ratedVoltage: RatedVoltage;
    ratedVoltageNote: string;
    appliance: ApplianceType;
    motorShareAbove50: boolean | null;
    powerWhileConductingW: number;
    voltageRmsWhileConducting: number | null;
    currentRmsWhileConducting: number;
    powerFactorWhileConducting: number | null;
    resistivePowerFactorThreshold: number;
    currentAccuracy: AccuracySpec | null;
    voltageAccuracy: AccuracySpec | null;
    repeatsW: readonly number[] | null;
    /** Relative standard uncertainties and exponents as used for the judged figure. */
    uncertaintyBudget: PowerLawTerm[];
    relativeCombinedStandardUncertainty: number;
  };
}

const SEVERITY: Record<VerdictResult, number> = {
  "meets rating": 0,
  inconclusive: 1,
  "above rating": 2,
  "below rating": 2,
};

function requirePowerFactor(value: number | null): number | null {
  if (value === null) return null;
  requireFinite("powerFactorWhileConducting", value);
  if (value <= 0 || value > 1 + 1e-9) throw new Error(`powerFactorWhileConducting must be in (0, 1], got ${value}`);
  return value;
}

/**
 * Power input (IEC 60335-1 clause 10.1) judged on the power while conducting,
 * the full-demand figure, so a controller cycling at its setpoint does not pull
 * the mean down.
 *
 * Uncertainty: P = mean(v·i) and Vrms come from the same voltage channel, so a
 * voltage reading error enters both. P has exponent 1 in V and I; P·(U_r/U)²
 * has U with exponent 1 − 2 = −1, so normalising leaves the relative
 * uncertainty unchanged. The doubled voltage weight of a separate voltmeter
 * (exponent −2, see combineRelativeUncertainties) does not arise here. Phase
 * errors between the channels are not in the instruments' specs and not here.
 *
 * Rated voltage ranges (see ratedVoltagePoints): a wide range is judged at
 * both ends; the headline figures are those of the end nearer the supply (the
 * lower end when equidistant), the smallest extrapolation of P ∝ V², and the
 * result is the worst of the ends, the nearer end's when both are equally bad.
 */
export function judgePowerInput(input: PowerInputInput): PowerInputVerdict {
  const tolerance = powerInputTolerance(input);
  const points = ratedVoltagePoints(input.ratedVoltage);
  const measured = requirePositive("powerWhileConductingW", input.powerWhileConductingW);
  const current = requirePositive("currentRmsWhileConducting", input.currentRmsWhileConducting);
  const voltage =
    input.voltageRmsWhileConducting === null ? null : requirePositive("voltageRmsWhileConducting", input.voltageRmsWhileConducting);
  const powerFactor = requirePowerFactor(input.powerFactorWhileConducting);
  const repeats = input.repeatsW === undefined ? null : requireFiniteList("repeatsW", input.repeatsW, 2);

  const normalisable = voltage !== null && powerFactor !== null && powerFactor >= RESISTIVE_POWER_FACTOR;
  const voltageExponent = normalisable ? -1 : 1;
  const budget: PowerLawTerm[] = [];
  if (input.currentAccuracy) {
    const u = specStandardUncertainty(input.currentAccuracy, current, "currentAccuracy");
    budget.push({ source: "current reading (instrument spec)", relativeStandardUncertainty: u / current, exponent: 1 });
  }
  if (voltage !== null && input.voltageAccuracy) {
    const u = specStandardUncertainty(input.voltageAccuracy, voltage, "voltageAccuracy");
    budget.push({ source: "voltage reading (instrument spec)", relativeStandardUncertainty: u / voltage, exponent: voltageExponent });
  }
  if (repeats) {
    budget.push({ source: "repeats (Type A)", relativeStandardUncertainty: typeAStandardUncertainty(repeats, "repeatsW") / measured, exponent: 1 });
  }
  const relativeUncertainty = combineRelativeUncertainties(budget);
  const judgeAt = (value: number) =>
    judge({
      measured: value,
      expandedUncertainty: COVERAGE_FACTOR * relativeUncertainty * value,
      lower: tolerance.lower,
      upper: tolerance.upper,
      rule: input.rule,
    });

  let normalizationNote: string;
  let headline: Judgement;
  let normalized: number | null = null;
  let normalizedTo: number | null = null;
  let ends: RangeEndVerdict[] | null = null;
  let result: VerdictResult;

  if (normalisable) {
    const judged = points.voltages.map((target) => ({
      voltage: target,
      judgement: judgeAt(measured * (target / voltage) ** 2),
    }));
    const primary = judged.reduce((nearest, end) =>
      Math.abs(end.voltage - voltage) < Math.abs(nearest.voltage - voltage) ? end : nearest,
    );
    normalized = primary.judgement.measured;
    normalizedTo = primary.voltage;
    result = judged.reduce(
      (worst, end) => (SEVERITY[end.judgement.result] > SEVERITY[worst] ? end.judgement.result : worst),
      primary.judgement.result,
    );
    headline = primary.judgement;
    if (judged.length > 1) {
      ends = judged.map(({ voltage: endVoltage, judgement }) => ({
        voltage: endVoltage,
        normalized: judgement.measured,
        acceptanceLower: judgement.acceptanceLower,
        acceptanceUpper: judgement.acceptanceUpper,
        expandedUncertainty: judgement.expandedUncertainty,
        result: judgement.result,
      }));
    }
    normalizationNote =
      `Normalised from ${voltage} V to ${points.voltages.join(" V and ")} V as P·(U_r/U)², assuming a fixed resistance at full conduction ` +
      `(power factor while conducting ${powerFactor} ≥ ${RESISTIVE_POWER_FACTOR}); this does not hold for PTC elements. ${points.note}.`;
  } else {
    const reason =
      voltage === null
        ? "no voltage channel: the power is an estimate from the nominal voltage and the supply's deviation from it is not in the uncertainty"
        : powerFactor === null
          ? `power factor while conducting unknown, so the load cannot be taken as resistive`
          : `power factor while conducting ${powerFactor} < ${RESISTIVE_POWER_FACTOR}: not a resistive load, so P ∝ V² does not hold`;
    normalizationNote = `Not normalised (${reason}); judged as measured${voltage === null ? "" : ` at ${voltage} V`}. ${points.note}.`;
    headline = judgeAt(measured);
    result = headline.result;
  }

  return {
    rated: tolerance.rated,
    measured,
    normalized,
    normalizedTo,
    normalizationNote,
    lower: tolerance.lower,
    upper: tolerance.upper,
    acceptanceLower: headline.acceptanceLower,
    acceptanceUpper: headline.acceptanceUpper,
    expandedUncertainty: headline.expandedUncertainty,
    coverageFactor: COVERAGE_FACTOR,
    rule: input.rule,
    result,
    tolerance,
    ends,
    inputs: {
      ratedPowerW: tolerance.rated,
      ratedVoltage: input.ratedVoltage,
      ratedVoltageNote: points.note,
      appliance: input.appliance,
      motorShareAbove50: input.motorShareAbove50 ?? null,
      powerWhileConductingW: measured,
      voltageRmsWhileConducting: voltage,
      currentRmsWhileConducting: current,
      powerFactorWhileConducting: powerFactor,
      resistivePowerFactorThreshold: RESISTIVE_POWER_FACTOR,
      currentAccuracy: input.currentAccuracy,
      voltageAccuracy: input.voltageAccuracy,
      repeatsW: repeats,
      uncertaintyBudget: budget,
      relativeCombinedStandardUncertainty: relativeUncertainty,
    },
  };
}
