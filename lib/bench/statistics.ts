import { requireFiniteList } from "./input-checks";

export interface Spread {
  count: number;
  mean: number;
  /** Sample standard deviation (n − 1); 0 for a single value. */
  standardDeviation: number;
  min: number;
  max: number;
}

export function mean(values: readonly number[], name = "values"): number {
  requireFiniteList(name, values, 1);
  let sum = 0;
  for (const value of values) sum += value;
  return sum / values.length;
}

/** Sample (n − 1) standard deviation: repeats are a sample of what the bench could read, not the whole population. */
export function sampleStandardDeviation(values: readonly number[], name = "values"): number {
  requireFiniteList(name, values, 2);
  const centre = mean(values, name);
  let sumOfSquares = 0;
  for (const value of values) sumOfSquares += (value - centre) ** 2;
  return Math.sqrt(sumOfSquares / (values.length - 1));
}

/** GUM Type A standard uncertainty of the mean of repeated readings: s / √n. */
export function typeAStandardUncertainty(repeats: readonly number[], name = "repeats"): number {
  return sampleStandardDeviation(repeats, name) / Math.sqrt(repeats.length);
}

export function describeSpread(values: readonly number[], name = "values"): Spread {
  requireFiniteList(name, values, 1);
  let min = Infinity;
  let max = -Infinity;
  for (const value of values) {
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return {
    count: values.length,
    mean: mean(values, name),
    standardDeviation: values.length > 1 ? sampleStandardDeviation(values, name) : 0,
    min,
    max,
  };
}
