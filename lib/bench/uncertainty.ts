// GUM arithmetic for the bench (JCGM 100:2008). Instrument specs are read as
// rectangular distributions, contributions combine in quadrature, and expanded
// uncertainties use k = 2 throughout so every figure Benchplate publishes is
// comparable.

import { requireFinite, requireNonNegative, requirePositive } from "./input-checks";
import { typeAStandardUncertainty } from "./statistics";

/** An instrument's accuracy spec ±(% of reading + offset), offset in the reading's unit. */
export interface AccuracySpec {
  percentOfReading: number;
  offset: number;
}

export const COVERAGE_FACTOR = 2;

const NUMBER = /^(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;

/**
 * Reads "1.5%+0.05", "1.5 % + 0.05", "±(1.5% + 0.05)", "1.5%" or "0.05".
 * Digits go in as an offset in the reading's unit (5 digits of 0.01 A → 0.05),
 * because the parser cannot know the meter's resolution.
 */
export function parseAccuracySpec(text: string): AccuracySpec {
  if (typeof text !== "string" || text.trim() === "") {
    throw new Error('Accuracy spec is empty: write it as "% of reading + offset", e.g. "1.5%+0.05"');
  }
  let body = text.trim().replace(/^±/, "").trim();
  if (body.startsWith("(") && body.endsWith(")")) body = body.slice(1, -1);
  const terms = body.split("+").map((term) => term.trim());
  let percentOfReading: number | null = null;
  let offset: number | null = null;
  for (const term of terms) {
    const isPercent = term.endsWith("%");
    const digits = isPercent ? term.slice(0, -1).trim() : term;
    if (!NUMBER.test(digits)) {
      throw new Error(
        `Accuracy spec "${text}": "${term}" is not a plain number or percentage; ` +
          'write it as "% of reading + offset", e.g. "1.5%+0.05" (offset in the reading\'s unit, no unit letters)',
      );
    }
    const value = Number(digits);
    if (isPercent) {
      if (percentOfReading !== null) throw new Error(`Accuracy spec "${text}" has more than one percentage term`);
      percentOfReading = value;
    } else {
      if (offset !== null) throw new Error(`Accuracy spec "${text}" has more than one offset term`);
      offset = value;
    }
  }
  return { percentOfReading: percentOfReading ?? 0, offset: offset ?? 0 };
}

function requireSpec(spec: AccuracySpec, name: string): AccuracySpec {
  requireNonNegative(`${name}.percentOfReading`, spec.percentOfReading);
  requireNonNegative(`${name}.offset`, spec.offset);
  return spec;
}

/** Half-width a of the spec's error interval at a reading: a = |reading|·p/100 + offset. */
export function specHalfWidth(spec: AccuracySpec, reading: number, name = "accuracy spec"): number {
  requireSpec(spec, name);
  requireFinite("reading", reading);
  return (Math.abs(reading) * spec.percentOfReading) / 100 + spec.offset;
}

/** A spec states bounds, not a distribution: GUM 4.3.7 reads it as rectangular, u = a/√3. */
export function rectangularStandardUncertainty(halfWidth: number): number {
  requireNonNegative("half-width", halfWidth);
  return halfWidth / Math.sqrt(3);
}

export function specStandardUncertainty(spec: AccuracySpec, reading: number, name = "accuracy spec"): number {
  return rectangularStandardUncertainty(specHalfWidth(spec, reading, name));
}

export interface UncertaintyContribution {
  source: string;
  standardUncertainty: number;
  /** Sensitivity coefficient c_i = ∂y/∂x_i; 1 when the input is the measurand itself. */
  sensitivity?: number;
}

/** u_c = √Σ(c_i·u_i)² for uncorrelated inputs (GUM 5.1.2). */
export function combineStandardUncertainties(contributions: readonly UncertaintyContribution[]): number {
  let sumOfSquares = 0;
  for (const { source, standardUncertainty, sensitivity = 1 } of contributions) {
    requireNonNegative(`standard uncertainty of ${source}`, standardUncertainty);
    requireFinite(`sensitivity coefficient of ${source}`, sensitivity);
    sumOfSquares += (sensitivity * standardUncertainty) ** 2;
  }
  return Math.sqrt(sumOfSquares);
}

export interface PowerLawTerm {
  source: string;
  relativeStandardUncertainty: number;
  /** Exponent n_i of the input in y = Π x_i^n_i, which is its relative sensitivity coefficient. */
  exponent: number;
}

/**
 * Relative combined uncertainty of y = Π x_i^n_i (GUM 5.1.6): for P = V·I both
 * exponents are 1; normalising P·(U_r/U)² with U read by a separate instrument
 * adds U with exponent −2, doubling its weight.
 */
export function combineRelativeUncertainties(terms: readonly PowerLawTerm[]): number {
  return combineStandardUncertainties(
    terms.map(({ source, relativeStandardUncertainty, exponent }) => ({
      source,
      standardUncertainty: relativeStandardUncertainty,
      sensitivity: exponent,
    })),
  );
}

export function expandedUncertainty(combinedStandardUncertainty: number, coverageFactor = COVERAGE_FACTOR): number {
  requireNonNegative("combined standard uncertainty", combinedStandardUncertainty);
  requirePositive("coverage factor", coverageFactor);
  return coverageFactor * combinedStandardUncertainty;
}

export interface ReadingUncertainty {
  reading: number;
  /** From the instrument spec (Type B), null when no spec was given. */
  typeB: number | null;
  /** From repeats (Type A, s/√n), null without repeats. */
  typeA: number | null;
  combined: number;
  expanded: number;
  coverageFactor: typeof COVERAGE_FACTOR;
}

/** Uncertainty of one reported reading: the instrument's spec plus, when repeated, the scatter of the repeats. */
export function uncertaintyOfReading(input: {
  reading: number;
  accuracy: AccuracySpec | null;
  repeats?: readonly number[];
}): ReadingUncertainty {
  const reading = requireFinite("reading", input.reading);
  const typeB = input.accuracy ? specStandardUncertainty(input.accuracy, reading, "accuracy") : null;
  const typeA = input.repeats ? typeAStandardUncertainty(input.repeats) : null;
  const combined = combineStandardUncertainties([
    { source: "instrument spec", standardUncertainty: typeB ?? 0 },
    { source: "repeats", standardUncertainty: typeA ?? 0 },
  ]);
  return {
    reading,
    typeB,
    typeA,
    combined,
    expanded: expandedUncertainty(combined),
    coverageFactor: COVERAGE_FACTOR,
  };
}
