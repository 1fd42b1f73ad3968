// Airflow of a hot-air tool from an anemometer's air velocity at the nozzle.
// Q [L/min] = v [m/s] · profile factor · π d²/4 [m²] · 60 000.

import { requireFinite, requireNonNegative, requirePositive } from "./input-checks";

/** Mean ÷ centre-line velocity (REFERENCES.md §8). */
export const PROFILE_FACTORS = {
  /** Centre-line velocity × area: an upper bound, since a nozzle exit is not fully developed flow. */
  centreLine: 1,
  /** Fully developed turbulent pipe flow (1/7 power law). */
  turbulent: 0.82,
  /** Fully developed laminar pipe flow. */
  laminar: 0.5,
} as const;

export const REFERENCE_AIR_TEMPERATURE_C = 20;

const KELVIN_OFFSET = 273.15;

export type AirflowCondition = { heater: "off" } | { heater: "on"; airTemperatureC: number };

export interface Airflow {
  /** The figure to report: at 20 °C when the heater was on, else as measured. */
  litresPerMinute: number;
  /** Before any temperature correction. */
  measuredLitresPerMinute: number;
  airVelocityMps: number;
  boreMm: number;
  boreAreaM2: number;
  profileFactor: number;
  profileNote: string;
  airTemperatureC: number | null;
  temperatureNote: string;
}

function describeProfile(profileFactor: number): string {
  if (profileFactor === PROFILE_FACTORS.centreLine) {
    return "profile factor 1: centre-line velocity × bore area, an upper bound since a nozzle exit is not fully developed flow";
  }
  if (profileFactor === PROFILE_FACTORS.turbulent) return "profile factor 0.82: fully developed turbulent flow (1/7 power law)";
  if (profileFactor === PROFILE_FACTORS.laminar) return "profile factor 0.5: fully developed laminar flow";
  return `profile factor ${profileFactor}, chosen by the reviewer`;
}

/**
 * Hot air takes more volume for the same mass: at constant pressure an ideal
 * gas's volumetric flow scales with absolute temperature, so a reading with the
 * heater on is referred to 20 °C to compare with one taken cold.
 */
export function airflowFromVelocity(input: {
  airVelocityMps: number;
  boreMm: number;
  profileFactor?: number;
  condition: AirflowCondition;
}): Airflow {
  const airVelocityMps = requireNonNegative("airVelocityMps", input.airVelocityMps);
  const boreMm = requirePositive("boreMm", input.boreMm);
  const profileFactor = requirePositive("profileFactor", input.profileFactor ?? PROFILE_FACTORS.centreLine);
  if (profileFactor > 1) throw new Error(`profileFactor must not exceed 1 (mean ÷ centre-line velocity), got ${profileFactor}`);

  const boreAreaM2 = (Math.PI * (boreMm / 1000) ** 2) / 4;
  const measuredLitresPerMinute = airVelocityMps * profileFactor * boreAreaM2 * 60_000;
  const base = { measuredLitresPerMinute, airVelocityMps, boreMm, boreAreaM2, profileFactor, profileNote: describeProfile(profileFactor) };

  const { condition } = input;
  if (condition?.heater === "off") {
    return {
      ...base,
      litresPerMinute: measuredLitresPerMinute,
      airTemperatureC: null,
      temperatureNote: "measured with the heater off, at ambient temperature; not corrected",
    };
  }
  if (condition?.heater !== "on") {
    throw new Error('condition must be { heater: "off" } or { heater: "on", airTemperatureC }');
  }
  const airTemperatureC = requireFinite("airTemperatureC", condition.airTemperatureC);
  if (airTemperatureC <= -KELVIN_OFFSET) throw new Error(`airTemperatureC must be above −273.15 °C, got ${airTemperatureC}`);
  return {
    ...base,
    litresPerMinute: (measuredLitresPerMinute * (REFERENCE_AIR_TEMPERATURE_C + KELVIN_OFFSET)) / (airTemperatureC + KELVIN_OFFSET),
    airTemperatureC,
    temperatureNote:
      `measured with the heater on, air at ${airTemperatureC} °C; referred to ${REFERENCE_AIR_TEMPERATURE_C} °C ` +
      "as an ideal gas at constant pressure (volumetric flow ∝ absolute temperature)",
  };
}
