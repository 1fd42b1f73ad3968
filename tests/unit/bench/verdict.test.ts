import { describe, expect, it } from "vitest";
import { specHalfWidth } from "@/lib/bench/uncertainty";
import { judge, judgePowerInput, judgeRating, type PowerInputInput } from "@/lib/bench/verdict";
import { mulberry32, rectangular, standardDeviation } from "./monte-carlo";

// Decision rules of ILAC-G8:09/2019 (REFERENCES.md §6): simple acceptance, and guarded acceptance with w = U.
// Limits are those of a 700 W heating appliance under IEC 60335-1:1991 Table 1: 630–735 W. U = 10 W.
describe("judge at each tolerance limit ± U", () => {
  const U = 10;
  const limits = { lower: 630, upper: 735, expandedUncertainty: U };

  it.each([
    // upper limit
    [735, "meets rating", "inconclusive"],
    [735 + U / 2, "above rating", "inconclusive"],
    [735 - U / 2, "meets rating", "inconclusive"],
    [735 + U, "above rating", "inconclusive"],
    [735 - U, "meets rating", "meets rating"],
    [735 + 1.5 * U, "above rating", "above rating"],
    [735 - 1.5 * U, "meets rating", "meets rating"],
    // lower limit
    [630, "meets rating", "inconclusive"],
    [630 - U / 2, "below rating", "inconclusive"],
    [630 + U / 2, "meets rating", "inconclusive"],
    [630 - U, "below rating", "inconclusive"],
    [630 + U, "meets rating", "meets rating"],
    [630 - 1.5 * U, "below rating", "below rating"],
    [630 + 1.5 * U, "meets rating", "meets rating"],
  ])("%d W: simple → %s, guarded → %s", (measured, simple, guarded) => {
    expect(judge({ ...limits, measured, rule: "simple" }).result).toBe(simple);
    expect(judge({ ...limits, measured, rule: "guarded" }).result).toBe(guarded);
  });

  it("moves the acceptance limits in by U under guarded acceptance only", () => {
    expect(judge({ ...limits, measured: 700, rule: "simple" })).toMatchObject({
      guardBand: 0,
      acceptanceLower: 630,
      acceptanceUpper: 735,
    });
    expect(judge({ ...limits, measured: 700, rule: "guarded" })).toMatchObject({
      guardBand: U,
      acceptanceLower: 640,
      acceptanceUpper: 725,
    });
  });

  it("never says below rating on a one-sided row", () => {
    // IEC 60335-1:1991 Table 1, motor-operated > 300 W: +15 % or +60 W, no lower limit.
    for (const rule of ["simple", "guarded"] as const) {
      expect(judge({ measured: 10, expandedUncertainty: 1, lower: null, upper: 805, rule }).result).toBe("meets rating");
    }
  });

  it("lets nothing meet the rating when the guard bands overlap", () => {
    const verdict = judge({ measured: 105, expandedUncertainty: 6, lower: 100, upper: 110, rule: "guarded" });
    expect(verdict).toMatchObject({ acceptanceLower: 106, acceptanceUpper: 104, result: "inconclusive" });
  });

  it("rejects bad inputs, naming them", () => {
    const base = { measured: 700, expandedUncertainty: 10, lower: 630, upper: 735, rule: "simple" as const };
    expect(() => judge({ ...base, measured: Number.NaN })).toThrow("measured must be a finite number, got NaN");
    expect(() => judge({ ...base, expandedUncertainty: -1 })).toThrow("expandedUncertainty must not be negative, got -1");
    expect(() => judge({ ...base, lower: 800 })).toThrow("Tolerance lower limit 800 is above the upper limit 735");
    expect(() => judge({ ...base, lower: null, upper: null })).toThrow("at least one tolerance limit");
    expect(() => judge({ ...base, rule: "lenient" as never })).toThrow('rule must be "simple" or "guarded", got lenient');
  });
});

describe("judgeRating against a protocol's tolerance", () => {
  it("judges airflow against ±10 % through the same decision step", () => {
    const verdict = judgeRating({
      rated: 30,
      measured: 32.5,
      expandedUncertainty: 1,
      tolerance: { kind: "percent", plus: 10, minus: 10, source: "protocol v1" },
      rule: "guarded",
    });
    expect(verdict).toMatchObject({
      rated: 30,
      measured: 32.5,
      acceptanceLower: 28,
      acceptanceUpper: 32,
      expandedUncertainty: 1,
      coverageFactor: 2,
      rule: "guarded",
      result: "inconclusive",
      tolerance: { source: "protocol v1", description: "+10 % / −10 %" },
    });
    expect(verdict.lower).toBeCloseTo(27, 12);
    expect(verdict.upper).toBeCloseTo(33, 12);
    expect(verdict.result).toBe(judge({ measured: 32.5, expandedUncertainty: 1, lower: 27, upper: 33, rule: "guarded" }).result);
  });

  it("judges a temperature against an absolute band", () => {
    const verdict = judgeRating({
      rated: 350,
      measured: 338,
      expandedUncertainty: 1.5,
      tolerance: { kind: "absolute", plus: 10, minus: 10 },
      rule: "simple",
    });
    expect(verdict).toMatchObject({ lower: 340, upper: 360, result: "below rating", tolerance: { source: "protocol", description: "+10 / −10" } });
  });

  it("never says below rating for a one-sided heat-up time tolerance", () => {
    const verdict = judgeRating({
      rated: 20,
      measured: 5,
      expandedUncertainty: 0.5,
      tolerance: { kind: "percent", plus: 20, minus: null },
      rule: "guarded",
    });
    expect(verdict).toMatchObject({ lower: null, upper: 24, acceptanceLower: null, result: "meets rating" });
  });

  it("rejects a tolerance with no limits or a negative side", () => {
    const base = { rated: 30, measured: 30, expandedUncertainty: 1, rule: "simple" as const };
    expect(() => judgeRating({ ...base, tolerance: { kind: "percent", plus: null, minus: null } })).toThrow("needs a plus or a minus limit");
    expect(() => judgeRating({ ...base, tolerance: { kind: "absolute", plus: -1, minus: 1 } })).toThrow("tolerance.plus must not be negative, got -1");
    expect(() => judgeRating({ ...base, tolerance: { kind: "percent", plus: 10, minus: 120 } })).toThrow("below zero");
  });
});

describe("judgePowerInput", () => {
  const heater: PowerInputInput = {
    ratedPowerW: 1000,
    ratedVoltage: 240,
    appliance: "heating",
    powerWhileConductingW: 1000,
    voltageRmsWhileConducting: 240,
    currentRmsWhileConducting: 1000 / 240,
    powerFactorWhileConducting: 1,
    currentAccuracy: null,
    voltageAccuracy: null,
    rule: "simple",
  };

  it("normalises 751 W at 208 V back to about 1000 W at 240 V (REFERENCES.md §7, seen)", () => {
    // A resistive heater's power scales with V²: 1000 W at 240 V → 751 W at 208 V.
    expect(1000 * (208 / 240) ** 2).toBeCloseTo(751, 0);
    const verdict = judgePowerInput({ ...heater, powerWhileConductingW: 751, voltageRmsWhileConducting: 208, currentRmsWhileConducting: 751 / 208 });
    expect(verdict.normalizedTo).toBe(240);
    expect(Math.abs((verdict.normalized ?? 0) - 1000)).toBeLessThan(1);
    expect(verdict.result).toBe("meets rating");
    expect(verdict.normalizationNote).toContain("assuming a fixed resistance at full conduction");
  });

  it("does not normalise a load whose power factor while conducting is below 0.98 (common practice, no source)", () => {
    const verdict = judgePowerInput({
      ...heater,
      powerWhileConductingW: 751,
      voltageRmsWhileConducting: 208,
      currentRmsWhileConducting: 751 / 208 / 0.9,
      powerFactorWhileConducting: 0.9,
    });
    expect(verdict).toMatchObject({ normalized: null, normalizedTo: null, result: "below rating" });
    expect(verdict.normalizationNote).toContain("not a resistive load");
  });

  it("judges 4.5 A RMS at 240 V into a heater as about 1080 W (common practice, no source)", () => {
    const verdict = judgePowerInput({
      ...heater,
      powerWhileConductingW: 4.5 * 240,
      voltageRmsWhileConducting: null,
      currentRmsWhileConducting: 4.5,
      powerFactorWhileConducting: null,
    });
    expect(verdict.measured).toBeCloseTo(1080, 6);
    expect(verdict.result).toBe("above rating"); // 1000 W rating: upper limit 1050 W
  });

  it("finds 2.6 A at 240 V (about 620 W) below a 700 W rating (common practice, no source)", () => {
    const verdict = judgePowerInput({
      ...heater,
      ratedPowerW: 700,
      powerWhileConductingW: 2.6 * 240,
      voltageRmsWhileConducting: null,
      currentRmsWhileConducting: 2.6,
      powerFactorWhileConducting: null,
    });
    expect(verdict.measured).toBeCloseTo(620, -1);
    expect(verdict).toMatchObject({ lower: 630, upper: 735, normalized: null, result: "below rating" });
    expect(verdict.normalizationNote).toContain("no voltage channel");
  });

  it("judges a wide rated voltage range at both ends and reports the worse", () => {
    // 100–240 V differs by far more than 10 % of its mean: IEC 60335-1 clause 10.1, both ends (seen).
    const verdict = judgePowerInput({
      ...heater,
      ratedVoltage: { min: 100, max: 240 },
      powerWhileConductingW: 1000,
      voltageRmsWhileConducting: 230,
      currentRmsWhileConducting: 1000 / 230,
    });
    expect(verdict.normalizedTo).toBe(240);
    expect(verdict.normalized).toBeCloseTo(1000 * (240 / 230) ** 2, 9);
    expect(verdict.ends?.map((end) => [end.voltage, end.result])).toEqual([
      [100, "below rating"],
      [240, "above rating"],
    ]);
    expect(verdict.result).toBe("above rating");
  });

  it("judges a narrow rated voltage range at its mean", () => {
    const verdict = judgePowerInput({
      ...heater,
      ratedVoltage: { min: 220, max: 240 },
      powerWhileConductingW: 1000,
      voltageRmsWhileConducting: 230,
      currentRmsWhileConducting: 1000 / 230,
    });
    expect(verdict).toMatchObject({ normalized: 1000, normalizedTo: 230, ends: null, result: "meets rating" });
  });

  it("carries every number it used", () => {
    const verdict = judgePowerInput({
      ...heater,
      ratedPowerW: 700,
      powerWhileConductingW: 705,
      voltageRmsWhileConducting: 236,
      currentRmsWhileConducting: 705 / 236,
      powerFactorWhileConducting: 0.999,
      currentAccuracy: { percentOfReading: 1.5, offset: 0.05 },
      voltageAccuracy: { percentOfReading: 0.5, offset: 0.2 },
      repeatsW: [704, 706, 705],
      rule: "guarded",
    });
    expect(verdict.tolerance.row).toContain("+5 % or +20 W");
    expect(verdict.coverageFactor).toBe(2);
    expect(verdict.inputs).toMatchObject({
      ratedPowerW: 700,
      powerWhileConductingW: 705,
      voltageRmsWhileConducting: 236,
      powerFactorWhileConducting: 0.999,
      resistivePowerFactorThreshold: 0.98,
      repeatsW: [704, 706, 705],
    });
    expect(verdict.inputs.uncertaintyBudget.map((term) => [term.source, term.exponent])).toEqual([
      ["current reading (instrument spec)", 1],
      ["voltage reading (instrument spec)", -1],
      ["repeats (Type A)", 1],
    ]);
    const relative = verdict.inputs.relativeCombinedStandardUncertainty;
    expect(verdict.expandedUncertainty).toBeCloseTo(2 * relative * (verdict.normalized ?? Number.NaN), 9);
    expect(verdict.acceptanceLower).toBeCloseTo(630 + verdict.expandedUncertainty, 9);
    expect(verdict.acceptanceUpper).toBeCloseTo(735 - verdict.expandedUncertainty, 9);
  });

  it("rejects bad inputs, naming them", () => {
    expect(() => judgePowerInput({ ...heater, powerWhileConductingW: -5 })).toThrow("powerWhileConductingW must be greater than 0, got -5");
    expect(() => judgePowerInput({ ...heater, currentRmsWhileConducting: Number.NaN })).toThrow("currentRmsWhileConducting must be a finite number, got NaN");
    expect(() => judgePowerInput({ ...heater, voltageRmsWhileConducting: 0 })).toThrow("voltageRmsWhileConducting must be greater than 0, got 0");
    expect(() => judgePowerInput({ ...heater, powerFactorWhileConducting: 1.2 })).toThrow("powerFactorWhileConducting must be in (0, 1], got 1.2");
    expect(() => judgePowerInput({ ...heater, repeatsW: [1000] })).toThrow("repeatsW needs at least 2 values, got 1");
    expect(() => judgePowerInput({ ...heater, currentAccuracy: { percentOfReading: Number.NaN, offset: 0 } })).toThrow(
      "currentAccuracy.percentOfReading must be a finite number, got NaN",
    );
  });
});

// Expanded uncertainty against a Monte Carlo of 10^5 draws (JCGM 101:2008 propagation of distributions), each
// instrument's error rectangular over its spec. The voltage error is a scale error of the one voltage channel, so
// it enters the power (mean of v·i) and the RMS voltage used to normalise it alike.
describe("uncertainty of power and of normalised power, against a Monte Carlo", () => {
  const draws = 100_000;
  const volts = 236;
  const power = 1000;
  const currentAccuracy = { percentOfReading: 1, offset: 0.01 };
  const voltageAccuracy = { percentOfReading: 1, offset: 0.5 };

  function monteCarlo(powerFactor: number, normalise: boolean): number {
    const amps = power / (volts * powerFactor);
    const random = mulberry32(0x5eed);
    const results = Array.from({ length: draws }, () => {
      const voltGain = 1 + rectangular(random, specHalfWidth(voltageAccuracy, volts)) / volts;
      const ampGain = 1 + rectangular(random, specHalfWidth(currentAccuracy, amps)) / amps;
      const readPower = power * voltGain * ampGain;
      return normalise ? readPower * (230 / (volts * voltGain)) ** 2 : readPower;
    });
    return 2 * standardDeviation(results);
  }

  function verdictAt(powerFactor: number) {
    return judgePowerInput({
      ratedPowerW: 1000,
      ratedVoltage: 230,
      appliance: "heating",
      powerWhileConductingW: power,
      voltageRmsWhileConducting: volts,
      currentRmsWhileConducting: power / (volts * powerFactor),
      powerFactorWhileConducting: powerFactor,
      currentAccuracy,
      voltageAccuracy,
      rule: "guarded",
    });
  }

  it("matches for the power as measured (P = V·I: relative uncertainties in quadrature)", () => {
    const verdict = verdictAt(0.9);
    expect(verdict.normalized).toBeNull();
    const ratio = verdict.expandedUncertainty / monteCarlo(0.9, false);
    expect(ratio).toBeGreaterThan(0.95);
    expect(ratio).toBeLessThan(1.05);
  });

  it("matches for the power normalised to rated voltage", () => {
    const verdict = verdictAt(1);
    expect(verdict.normalized).not.toBeNull();
    const monteCarloU = monteCarlo(1, true);
    const ratio = verdict.expandedUncertainty / monteCarloU;
    expect(ratio).toBeGreaterThan(0.95);
    expect(ratio).toBeLessThan(1.05);
    // Weighting the voltage with exponent −2, right only for a separately read voltage, would overstate U here.
    const [current, voltage] = verdict.inputs.uncertaintyBudget;
    const doubled = 2 * Math.hypot(current?.relativeStandardUncertainty ?? 0, 2 * (voltage?.relativeStandardUncertainty ?? 0)) * (verdict.normalized ?? 0);
    expect(doubled / monteCarloU).toBeGreaterThan(1.05);
  });
});
