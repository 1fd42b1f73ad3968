import { describe, expect, it } from "vitest";
import { describeSpread, mean, sampleStandardDeviation, typeAStandardUncertainty } from "@/lib/bench/statistics";

describe("statistics", () => {
  it("gives the mean, sample standard deviation and extremes of repeats", () => {
    const repeats = [2, 4, 4, 4, 5, 5, 7, 9];
    expect(mean(repeats)).toBe(5);
    // Sample (n − 1) deviation: √(32/7)
    expect(sampleStandardDeviation(repeats)).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(describeSpread(repeats)).toEqual({
      count: 8,
      mean: 5,
      standardDeviation: sampleStandardDeviation(repeats),
      min: 2,
      max: 9,
    });
  });

  it("gives Type A uncertainty as s/√n (GUM 4.2.3)", () => {
    const repeats = [700, 702, 698, 701, 699];
    expect(typeAStandardUncertainty(repeats)).toBeCloseTo(sampleStandardDeviation(repeats) / Math.sqrt(5), 12);
  });

  it("reports a single value with no spread", () => {
    expect(describeSpread([3])).toEqual({ count: 1, mean: 3, standardDeviation: 0, min: 3, max: 3 });
  });

  it("rejects empty, too-short and non-finite input, naming the value", () => {
    expect(() => mean([])).toThrow("values needs at least one value, got 0");
    expect(() => typeAStandardUncertainty([5])).toThrow("repeats needs at least 2 values");
    expect(() => mean([1, Number.NaN])).toThrow("values[1] must be a finite number, got NaN");
  });
});
