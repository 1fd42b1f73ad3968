// Permitted deviations from a tool's ratings under IEC 60335-1 clause 10.
// Table 1 was read in GOST R IEC 335-1-94 (IEC 335-1:1991) and is believed
// unchanged since; Table 2 is recalled, not read, and says so in its source.

import { requirePositive } from "./input-checks";

export type ApplianceType = "heating" | "motor" | "combined";

export type RatedVoltage = number | { min: number; max: number };

export interface RatingTolerance {
  source: string;
  /** The table row as the standard words it. */
  row: string;
  rated: number;
  /** Null where the row is one-sided: such a rating can never be "below rating". */
  lower: number | null;
  upper: number;
  /** Why this row was picked, when it rests on an assumption rather than the caller's data. */
  assumption: string | null;
}

const TABLE_1 = "IEC 60335-1 clause 10.1, Table 1";
const TABLE_2 = "IEC 60335-1 clause 10.2, Table 2 (from memory, not confirmed in a document)";

/** Which Table 1 rows a combined appliance uses turns on the motor's share of rated power input. */
function rowFamily(
  appliance: ApplianceType,
  motorShareAbove50: boolean | undefined,
): { family: "heating" | "motor"; assumption: string | null } {
  if (appliance !== "heating" && appliance !== "motor" && appliance !== "combined") {
    throw new Error(`appliance must be "heating", "motor" or "combined", got ${String(appliance)}`);
  }
  if (appliance === "heating" && motorShareAbove50 === true) {
    throw new Error("motorShareAbove50 is true but the appliance is heating: a motor share applies to combined appliances");
  }
  if (appliance !== "combined") return { family: appliance, assumption: null };
  if (motorShareAbove50 === undefined) {
    return {
      family: "heating",
      assumption: "combined appliance with the motor's share not stated: taken as not more than 50 %, so the heating rows apply",
    };
  }
  return { family: motorShareAbove50 ? "motor" : "heating", assumption: null };
}

export function powerInputTolerance(input: {
  ratedPowerW: number;
  appliance: ApplianceType;
  motorShareAbove50?: boolean;
}): RatingTolerance {
  const rated = requirePositive("ratedPowerW", input.ratedPowerW);
  const { family, assumption } = rowFamily(input.appliance, input.motorShareAbove50);
  const tolerance = (row: string, lower: number | null, upper: number): RatingTolerance => ({
    source: TABLE_1,
    row,
    rated,
    lower,
    upper,
    assumption,
  });
  if (rated <= 25) return tolerance("all appliances, ≤ 25 W: +20 %", null, rated * 1.2);
  if (family === "heating") {
    if (rated <= 200) {
      return tolerance("heating and combined appliances, > 25 W and ≤ 200 W: ±10 %", rated * 0.9, rated * 1.1);
    }
    return tolerance(
      "heating and combined appliances, > 200 W: +5 % or +20 W (whichever is greater), −10 %",
      rated * 0.9,
      rated + Math.max(rated * 0.05, 20),
    );
  }
  if (rated <= 300) return tolerance("motor-operated and combined appliances, > 25 W and ≤ 300 W: +20 %", null, rated * 1.2);
  return tolerance(
    "motor-operated and combined appliances, > 300 W: +15 % or +60 W (whichever is greater)",
    null,
    rated + Math.max(rated * 0.15, 60),
  );
}

/**
 * Only the Table 2 rows our references hold are coded; the motor-operated rows
 * above 0.2 A are not, so such a rating throws rather than get a guessed band.
 */
export function ratedCurrentTolerance(input: {
  ratedCurrentA: number;
  appliance: ApplianceType;
  motorShareAbove50?: boolean;
}): RatingTolerance {
  const rated = requirePositive("ratedCurrentA", input.ratedCurrentA);
  const { family, assumption } = rowFamily(input.appliance, input.motorShareAbove50);
  const tolerance = (row: string, lower: number | null, upper: number): RatingTolerance => ({
    source: TABLE_2,
    row,
    rated,
    lower,
    upper,
    assumption,
  });
  if (rated <= 0.2) return tolerance("all appliances, ≤ 0.2 A: +20 %", null, rated * 1.2);
  if (family === "motor") {
    throw new Error(
      `No Table 2 row for a motor-operated rated current of ${rated} A in Benchplate's references; only the heating rows and the ≤ 0.2 A row are known`,
    );
  }
  if (rated <= 1) {
    return tolerance("heating and combined appliances, > 0.2 A and ≤ 1.0 A: ±10 %", rated * 0.9, rated * 1.1);
  }
  return tolerance(
    "heating and combined appliances, > 1.0 A: +5 % or +0.10 A (whichever is greater), −10 %",
    rated * 0.9,
    rated + Math.max(rated * 0.05, 0.1),
  );
}

/** Rated current of a heating appliance with none marked: I = P / U (IEC 60335-1 clause 3.1.6). */
export function ratedCurrentFromPower(ratedPowerW: number, ratedVoltageV: number): number {
  return requirePositive("ratedPowerW", ratedPowerW) / requirePositive("ratedVoltageV", ratedVoltageV);
}

export interface RatedVoltagePoints {
  /** Voltages the power input is judged at, the whole tolerance applying at each. */
  voltages: number[];
  note: string;
}

/**
 * A range wider than 10 % of its mean is judged at both ends (IEC 60335-1
 * clause 10.1, seen). For a narrower range the references say nothing more;
 * Benchplate judges at the mean, reading the rated power as relating to it,
 * because a resistive heater judged at both ends of, say, 220–240 V could
 * never pass: its power changes by 16 % across the range while Table 1 allows
 * 15 %.
 */
export function ratedVoltagePoints(ratedVoltage: RatedVoltage): RatedVoltagePoints {
  if (typeof ratedVoltage === "number") {
    return { voltages: [requirePositive("ratedVoltage", ratedVoltage)], note: `rated voltage ${ratedVoltage} V` };
  }
  if (typeof ratedVoltage !== "object" || ratedVoltage === null) {
    throw new Error(`ratedVoltage must be a number or { min, max }, got ${String(ratedVoltage)}`);
  }
  const min = requirePositive("ratedVoltage.min", ratedVoltage.min);
  const max = requirePositive("ratedVoltage.max", ratedVoltage.max);
  if (max <= min) throw new Error(`ratedVoltage.max (${max} V) must be above ratedVoltage.min (${min} V)`);
  const mean = (max + min) / 2;
  const range = `rated voltage range ${min}–${max} V`;
  if ((max - min) / mean > 0.1) {
    return {
      voltages: [min, max],
      note: `${range}: the ends differ by more than 10 % of the mean, so the deviation applies at both ends (IEC 60335-1 clause 10.1)`,
    };
  }
  return {
    voltages: [mean],
    note:
      `${range}: the ends differ by not more than 10 % of the mean, so it is judged at the mean, ${mean} V ` +
      "(Benchplate's reading; the references state only the rule for wider ranges)",
  };
}
