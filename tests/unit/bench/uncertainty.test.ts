import { describe, expect, it } from "vitest";
import {
  COVERAGE_FACTOR,
  combineRelativeUncertainties,
  combineStandardUncertainties,
  expandedUncertainty,
  parseAccuracySpec,
  rectangularStandardUncertainty,
  specHalfWidth,
  specStandardUncertainty,
  uncertaintyOfReading,
} from "@/lib/bench/uncertainty";
import { mulberry32, rectangular, standardDeviation } from "./monte-carlo";

describe("parseAccuracySpec", () => {
  it.each([
    ["1.5%+0.05", { percentOfReading: 1.5, offset: 0.05 }],
    ["1.5% + 0.05", { percentOfReading: 1.5, offset: 0.05 }],
    ["±(1.5 % + 0.05)", { percentOfReading: 1.5, offset: 0.05 }],
    ["1.5%", { percentOfReading: 1.5, offset: 0 }],
    ["0.05", { percentOfReading: 0, offset: 0.05 }],
    [" 0.5%+2e-3 ", { percentOfReading: 0.5, offset: 0.002 }],
  ])("reads %s", (text, spec) => {
    expect(parseAccuracySpec(text)).toEqual(spec);
  });

  it.each([
    ["", "Accuracy spec is empty"],
    ["abc", '"abc" is not a plain number or percentage'],
    ["1.5%+", '"" is not a plain number or percentage'],
    ["1.5%+0.05A", '"0.05A" is not a plain number or percentage'],
    ["1,5%", '"1,5%" is not a plain number or percentage'],
    ["-1.5%", '"-1.5%" is not a plain number or percentage'],
    ["1%+2%", "more than one percentage term"],
    ["0.1+0.2", "more than one offset term"],
  ])("rejects %j with a clear message", (text, message) => {
    expect(() => parseAccuracySpec(text)).toThrow(message);
  });
});

describe("GUM arithmetic", () => {
  // REFERENCES.md §6, GUM arithmetic (JCGM 100:2008 4.3.7, 5.1.2, 6.2.1), derived check:
  // 10.00 A read with ±(1.5 % + 5 digits of 0.01 A).
  const spec = { percentOfReading: 1.5, offset: 5 * 0.01 };

  it("reads the spec as a rectangular half-width: a = 0.20 A, u = 0.1155 A", () => {
    expect(specHalfWidth(spec, 10)).toBeCloseTo(0.2, 12);
    expect(specStandardUncertainty(spec, 10)).toBeCloseTo(0.1155, 4);
    expect(rectangularStandardUncertainty(0.2)).toBeCloseTo(0.2 / Math.sqrt(3), 15);
  });

  it("combines a second independent standard uncertainty of 0.05 A: u_c = 0.1258 A, U = 0.2517 A (k = 2)", () => {
    const combined = combineStandardUncertainties([
      { source: "meter", standardUncertainty: specStandardUncertainty(spec, 10) },
      { source: "second term", standardUncertainty: 0.05 },
    ]);
    expect(combined).toBeCloseTo(0.1258, 4);
    expect(COVERAGE_FACTOR).toBe(2);
    expect(expandedUncertainty(combined)).toBeCloseTo(0.2517, 4);
  });

  it("weights contributions by their sensitivity coefficients", () => {
    expect(
      combineStandardUncertainties([
        { source: "a", standardUncertainty: 3, sensitivity: 2 },
        { source: "b", standardUncertainty: 8, sensitivity: -1 },
      ]),
    ).toBeCloseTo(10, 12);
  });

  it("adds a Type A term from repeats to the instrument's Type B term", () => {
    const repeats = [9.98, 10.02, 10.0, 10.01, 9.99];
    const result = uncertaintyOfReading({ reading: 10, accuracy: spec, repeats });
    const typeA = 0.01581138830084 / Math.sqrt(5);
    expect(result.typeA).toBeCloseTo(typeA, 10);
    expect(result.typeB).toBeCloseTo(0.2 / Math.sqrt(3), 12);
    expect(result.combined).toBeCloseTo(Math.hypot(typeA, 0.2 / Math.sqrt(3)), 12);
    expect(result.expanded).toBeCloseTo(2 * result.combined, 12);
    expect(uncertaintyOfReading({ reading: 10, accuracy: null })).toMatchObject({ typeA: null, typeB: null, expanded: 0 });
  });

  it("doubles a separately read voltage's weight when normalising P·(U_r/U)² (REFERENCES.md §6), matching a Monte Carlo of 10^5 draws within 5 %", () => {
    // A wattmeter reads P and a separate voltmeter reads U, so their errors are independent.
    const power = 1000;
    const volts = 236;
    const rated = 230;
    const powerSpec = { percentOfReading: 1, offset: 2 };
    const voltSpec = { percentOfReading: 0.5, offset: 0.5 };
    const relative = combineRelativeUncertainties([
      { source: "power", relativeStandardUncertainty: specStandardUncertainty(powerSpec, power) / power, exponent: 1 },
      { source: "voltage", relativeStandardUncertainty: specStandardUncertainty(voltSpec, volts) / volts, exponent: -2 },
    ]);
    const normalised = power * (rated / volts) ** 2;
    const random = mulberry32(20190901);
    const draws = Array.from({ length: 100_000 }, () => {
      const p = power + rectangular(random, specHalfWidth(powerSpec, power));
      const u = volts + rectangular(random, specHalfWidth(voltSpec, volts));
      return p * (rated / u) ** 2;
    });
    const monteCarloU = 2 * standardDeviation(draws);
    expect(expandedUncertainty(relative * normalised) / monteCarloU).toBeGreaterThan(0.95);
    expect(expandedUncertainty(relative * normalised) / monteCarloU).toBeLessThan(1.05);
  });

  it("rejects bad inputs, naming them", () => {
    expect(() => specHalfWidth({ percentOfReading: -1, offset: 0 }, 10)).toThrow("accuracy spec.percentOfReading must not be negative, got -1");
    expect(() => specHalfWidth(spec, Number.POSITIVE_INFINITY)).toThrow("reading must be a finite number, got Infinity");
    expect(() => combineStandardUncertainties([{ source: "clamp", standardUncertainty: -0.1 }])).toThrow(
      "standard uncertainty of clamp must not be negative",
    );
    expect(() => expandedUncertainty(1, 0)).toThrow("coverage factor must be greater than 0");
  });
});
