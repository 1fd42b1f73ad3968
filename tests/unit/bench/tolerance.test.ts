import { describe, expect, it } from "vitest";
import {
  powerInputTolerance,
  ratedCurrentFromPower,
  ratedCurrentTolerance,
  ratedVoltagePoints,
} from "@/lib/bench/tolerance";

// IEC 60335-1 clause 10.1, Table 1 (seen in GOST R IEC 335-1-94, adoption of IEC 335-1:1991; REFERENCES.md §1).
describe("IEC 60335-1:1991 Table 1, power input", () => {
  it.each([
    // Derived checks in REFERENCES.md §1.
    [700, 630, 735, "+5 % or +20 W"],
    [300, 270, 320, "+5 % or +20 W"], // the +20 W floor: 5 % would give only 315 W
    [150, 135, 165, "±10 %"],
    // 400 W is where +5 % and +20 W meet.
    [400, 360, 420, "+5 % or +20 W"],
    [1000, 900, 1050, "+5 % or +20 W"],
    [200, 180, 220, "±10 %"],
    [201, 180.9, 221, "+5 % or +20 W"],
  ])("heating, %d W → %d–%d W (%s)", (rated, lower, upper, row) => {
    const tolerance = powerInputTolerance({ ratedPowerW: rated, appliance: "heating" });
    expect(tolerance.lower).toBeCloseTo(lower, 9);
    expect(tolerance.upper).toBeCloseTo(upper, 9);
    expect(tolerance.row).toContain(row);
    expect(tolerance.source).toBe("IEC 60335-1 clause 10.1, Table 1");
    expect(tolerance.assumption).toBeNull();
  });

  it("has a one-sided +20 % row for every appliance of 25 W or less", () => {
    for (const appliance of ["heating", "motor", "combined"] as const) {
      const tolerance = powerInputTolerance({ ratedPowerW: 25, appliance });
      expect(tolerance.lower).toBeNull();
      expect(tolerance.upper).toBeCloseTo(30, 12);
      expect(tolerance.row).toBe("all appliances, ≤ 25 W: +20 %");
    }
  });

  it.each([
    [100, 120, "+20 %"],
    [300, 360, "+20 %"],
    [350, 410, "+15 % or +60 W"], // +60 W floor: 15 % would give only 402.5 W
    [1000, 1150, "+15 % or +60 W"],
  ])("motor-operated, %d W → up to %d W, no lower limit (%s)", (rated, upper, row) => {
    const tolerance = powerInputTolerance({ ratedPowerW: rated, appliance: "motor" });
    expect(tolerance.lower).toBeNull();
    expect(tolerance.upper).toBeCloseTo(upper, 9);
    expect(tolerance.row).toContain(row);
  });

  it("uses the motor rows for a combined appliance only when the motor takes more than 50 % of rated power", () => {
    expect(powerInputTolerance({ ratedPowerW: 700, appliance: "combined", motorShareAbove50: true })).toMatchObject({
      lower: null,
      upper: 805,
    });
    expect(powerInputTolerance({ ratedPowerW: 700, appliance: "combined", motorShareAbove50: false })).toMatchObject({
      lower: 630,
      upper: 735,
      assumption: null,
    });
    const unstated = powerInputTolerance({ ratedPowerW: 700, appliance: "combined" });
    expect(unstated).toMatchObject({ lower: 630, upper: 735 });
    expect(unstated.assumption).toContain("taken as not more than 50 %");
  });

  it("rejects bad inputs, naming them", () => {
    expect(() => powerInputTolerance({ ratedPowerW: 0, appliance: "heating" })).toThrow("ratedPowerW must be greater than 0, got 0");
    expect(() => powerInputTolerance({ ratedPowerW: Number.NaN, appliance: "heating" })).toThrow("ratedPowerW must be a finite number, got NaN");
    expect(() => powerInputTolerance({ ratedPowerW: 700, appliance: "toaster" as never })).toThrow('appliance must be "heating", "motor" or "combined", got toaster');
    expect(() => powerInputTolerance({ ratedPowerW: 700, appliance: "heating", motorShareAbove50: true })).toThrow("motor share applies to combined appliances");
  });
});

// IEC 60335-1 clause 10.2, Table 2 — from memory, not confirmed in a document (REFERENCES.md §1).
describe("IEC 60335-1 Table 2, rated current (from memory)", () => {
  it.each([
    [0.2, null, 0.24, "≤ 0.2 A: +20 %"],
    [0.5, 0.45, 0.55, "±10 %"],
    [1.0, 0.9, 1.1, "±10 %"],
    [1.5, 1.35, 1.6, "+5 % or +0.10 A"], // the +0.10 A floor
    [2.9, 2.61, 3.045, "+5 % or +0.10 A"],
  ])("heating, %d A → %s–%d A (%s)", (rated, lower, upper, row) => {
    const tolerance = ratedCurrentTolerance({ ratedCurrentA: rated, appliance: "heating" });
    if (lower === null) expect(tolerance.lower).toBeNull();
    else expect(tolerance.lower).toBeCloseTo(lower, 9);
    expect(tolerance.upper).toBeCloseTo(upper, 9);
    expect(tolerance.row).toContain(row);
    expect(tolerance.source).toContain("from memory");
  });

  it("refuses motor-operated rows it does not hold rather than guess", () => {
    expect(() => ratedCurrentTolerance({ ratedCurrentA: 2, appliance: "motor" })).toThrow("No Table 2 row for a motor-operated rated current of 2 A");
    expect(ratedCurrentTolerance({ ratedCurrentA: 0.1, appliance: "motor" }).upper).toBeCloseTo(0.12, 12);
  });
});

describe("rated current from rated power (IEC 60335-1 clause 3.1.6: I = P / U)", () => {
  it("gives about 2.9 A for 700 W at 240 V (common practice, no source)", () => {
    expect(ratedCurrentFromPower(700, 240)).toBeCloseTo(2.9, 1);
  });

  it("rejects a zero voltage", () => {
    expect(() => ratedCurrentFromPower(700, 0)).toThrow("ratedVoltageV must be greater than 0, got 0");
  });
});

// IEC 60335-1 clause 10.1: a range whose ends differ by more than 10 % of the mean gets the deviation at both
// ends (seen, REFERENCES.md §1). Judging a narrower range at its mean is Benchplate's reading, not a source.
describe("rated voltage ranges", () => {
  it("judges a single rated voltage at that voltage", () => {
    expect(ratedVoltagePoints(230).voltages).toEqual([230]);
  });

  it("applies the tolerance at both ends of a range wider than 10 % of its mean", () => {
    // 100–240 V: 140 V apart, mean 170 V → 82 %.
    const points = ratedVoltagePoints({ min: 100, max: 240 });
    expect(points.voltages).toEqual([100, 240]);
    expect(points.note).toContain("applies at both ends");
  });

  it("judges a range within 10 % of its mean at the mean", () => {
    // 220–240 V: 20 V apart, mean 230 V → 8.7 %.
    const points = ratedVoltagePoints({ min: 220, max: 240 });
    expect(points.voltages).toEqual([230]);
    expect(points.note).toContain("Benchplate's reading");
  });

  it("puts a range exactly 10 % of its mean on the narrow side", () => {
    expect(ratedVoltagePoints({ min: 190, max: 210 }).voltages).toEqual([200]); // 20/200 = 10 % exactly
    expect(ratedVoltagePoints({ min: 190, max: 210.1 }).voltages).toEqual([190, 210.1]);
  });

  it("rejects inverted or non-positive ranges", () => {
    expect(() => ratedVoltagePoints({ min: 240, max: 220 })).toThrow("ratedVoltage.max (220 V) must be above ratedVoltage.min (240 V)");
    expect(() => ratedVoltagePoints({ min: -1, max: 220 })).toThrow("ratedVoltage.min must be greater than 0, got -1");
    expect(() => ratedVoltagePoints(Number.NaN)).toThrow("ratedVoltage must be a finite number, got NaN");
  });
});
