import { describe, expect, it } from "vitest";
import { isCalibrationOverdue, isoDateOf } from "@/lib/calibration";
import { fieldErrorsOf } from "@/lib/form-data";
import { firstFreeSlug, slugify } from "@/lib/slug";
import { formatAccuracySpec, instrumentFormSchema } from "@/lib/validations/instrument";
import { defaultSafetyCautions, protocolFormSchema } from "@/lib/validations/protocol";
import { toolFormSchema } from "@/lib/validations/tool";

const errorsOf = (result: { success: boolean; error?: Parameters<typeof fieldErrorsOf>[0] }) => (result.success ? {} : fieldErrorsOf(result.error!));

describe("slugs", () => {
  it("makes URL segments from names, accents and symbols dropped", () => {
    expect(slugify("Quillfern Thermal Aeris 720")).toBe("quillfern-thermal-aeris-720");
    expect(slugify("  Ørsted & Søn — HX/2000 ")).toBe("orsted-son-hx-2000");
    expect(slugify("Crème brûlée")).toBe("creme-brulee");
    expect(slugify("!!!")).toBe("");
  });

  it("picks the first free numbered variant", () => {
    expect(firstFreeSlug("aeris", new Set())).toBe("aeris");
    expect(firstFreeSlug("aeris", new Set(["aeris", "aeris-2"]))).toBe("aeris-3");
  });
});

describe("calibration", () => {
  it("counts the due date itself as still calibrated", () => {
    expect(isCalibrationOverdue("2026-05-01", "2026-05-01")).toBe(false);
    expect(isCalibrationOverdue("2026-05-01", "2026-05-02")).toBe(true);
    expect(isoDateOf(new Date("2026-05-01T23:30:00Z"))).toBe("2026-05-01");
  });
});

describe("tool form", () => {
  const valid = {
    makerId: "2d3c1e8a-9a51-4a52-9a51-1c0d6e2f7a01",
    model: "Aeris 720",
    category: "hot_air_station",
    applianceType: "combined",
    motorShare: "not-above",
    ratedPowerW: "720",
    ratedVoltageMin: "220",
    ratedVoltageMax: "240",
    ratedFrequency: "50",
    temperatureMinC: "",
    temperatureMaxC: "",
    price: "",
    currency: "",
  };

  it("turns form strings into the stored shape", () => {
    const parsed = toolFormSchema.parse({ ...valid, "accessories.0.kind": "tip", "accessories.0.name": "Chisel", "accessories.0.size": "" });
    expect(parsed).toMatchObject({
      ratedPowerW: 720,
      ratedVoltageMin: 220,
      ratedVoltageMax: 240,
      ratedFrequenciesHz: [50],
      motorShareAboveHalf: false,
      temperatureMinC: null,
      priceMinor: null,
      currency: null,
      accessories: [{ kind: "tip", name: "Chisel", size: null }],
    });
  });

  it("reports field and cross-field mistakes together", () => {
    const errors = errorsOf(toolFormSchema.safeParse({ ...valid, model: "", temperatureMinC: "200", price: "10", currency: "ZZZ" }));
    expect(Object.keys(errors).sort()).toEqual(["currency", "model", "temperatureMaxC"]);
  });

  it("rejects a price without a currency, and zero or negative ratings", () => {
    const errors = errorsOf(toolFormSchema.safeParse({ ...valid, price: "0", ratedPowerW: "0", ratedVoltageMin: "abc" }));
    expect(errors).toMatchObject({
      price: ["The price must be above 0."],
      ratedPowerW: ["Rated power input must be above 0 W."],
      ratedVoltageMin: ["Enter a number, such as 230 or 12.5."],
    });
  });
});

describe("instrument form", () => {
  it("writes accuracy lines back as the form reads them", () => {
    const parsed = instrumentFormSchema.parse({
      kind: "anemometer",
      maker: "Aldmoor",
      model: "VA-8",
      serialNumber: "1",
      labId: "",
      "accuracy.0.quantity": "air_velocity",
      "accuracy.0.unit": "m/s",
      "accuracy.0.rangeMax": "30",
      "accuracy.0.spec": "3% + 0.1",
      calibratedOn: "2026-01-01",
      calibrationDueOn: "2027-01-01",
    });
    expect(parsed.accuracy[0]).toEqual({ quantity: "air_velocity", unit: "m/s", rangeMax: 30, percentOfReading: 3, offset: 0.1 });
    expect(formatAccuracySpec(parsed.accuracy[0]!)).toBe("3% + 0.1");
    expect(parsed.labId).toBeNull();
  });

  it("refuses a spec that claims a perfect instrument", () => {
    const errors = errorsOf(
      instrumentFormSchema.safeParse({ "accuracy.0.quantity": "current", "accuracy.0.unit": "A", "accuracy.0.rangeMax": "10", "accuracy.0.spec": "0% + 0" }),
    );
    expect(errors["accuracy.0.spec"]?.[0]).toMatch(/perfect instrument/);
  });
});

describe("protocol form", () => {
  it("gathers ticked measurements and tolerances, and ignores an unset tolerance", () => {
    const parsed = protocolFormSchema.parse({
      name: "Soldering bench",
      summary: "Tip temperature.",
      supplyVoltage: "120",
      supplyFrequencyHz: "60",
      ambientC: "22",
      warmUpMinutes: "3",
      repeats: "3",
      "requiredMeasurements.heat_up_time": "on",
      "requiredMeasurements.leakage_voltage": "on",
      heatUpToleranceKind: "percent",
      heatUpTolerancePlus: "20",
      heatUpToleranceMinus: "100",
      heatUpToleranceSource: "Protocol's own choice",
      temperatureToleranceKind: "",
      temperatureTolerancePlus: "5",
      stepsMdx: "1. Tin the tip.",
      safetyCautions: defaultSafetyCautions,
    });
    expect(parsed.requiredMeasurements).toEqual(["heat_up_time", "leakage_voltage"]);
    expect(parsed.tolerances).toEqual({ heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "Protocol's own choice" } });
    expect(parsed.conditions).toMatchObject({ supplyVoltage: 120, supplyFrequencyHz: 60, nozzle: null, temperatureSetpointC: null });
  });

  it("starts new protocols with the cautions for mains and hot-air work", () => {
    for (const words of [/isolation transformer/, /CAT-rated/, /Never float an oscilloscope's ground/, /burn/, /fume extraction/, /local electrical codes/, /licensed electrician/]) {
      expect(defaultSafetyCautions).toMatch(words);
    }
  });
});
