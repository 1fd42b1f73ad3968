// Type K thermocouple EMF ↔ temperature on ITS-90, reference junction at 0 °C.
//
// Coefficients: NIST Monograph 175 (1993) and the NIST ITS-90 Thermocouple
// Database file type_k.tab. REFERENCES.md §5 gives the 0–1372 °C reference
// function and the 0–500 °C inverse; the −270–0 °C reference function and the
// −200–0 °C and 500–1372 °C inverses were confirmed against several
// independent public reproductions of type_k.tab found by code search, which
// agree digit for digit.

import { requireFinite } from "./input-checks";

export const TYPE_K_MIN_C = -270;
export const TYPE_K_MAX_C = 1372;

/** Reference function, −270 °C to 0 °C: E = Σ c_i t^i (mV, °C). */
const BELOW_ZERO = [
  0, 3.9450128025e-2, 2.3622373598e-5, -3.2858906784e-7, -4.9904828777e-9, -6.7509059173e-11, -5.7410327428e-13,
  -3.1088872894e-15, -1.0451609365e-17, -1.9889266878e-20, -1.6322697486e-23,
];

/** Reference function, 0 °C to 1372 °C: E = Σ c_i t^i + a0·exp(a1·(t − a2)²) (mV, °C). */
const ABOVE_ZERO = [
  -1.7600413686e-2, 3.8921204975e-2, 1.8558770032e-5, -9.9457592874e-8, 3.1840945719e-10, -5.6072844889e-13,
  5.6075059059e-16, -3.2020720003e-19, 9.7151147152e-23, -1.2104721275e-26,
];
const A0 = 0.1185976;
const A1 = -1.183432e-4;
const A2 = 126.9686;

/** Inverse polynomials t = Σ d_i E^i (°C, mV); NIST gives none below −200 °C. */
const INVERSE_BELOW_ZERO = [
  0, 2.5173462e1, -1.1662878, -1.0833638, -8.977354e-1, -3.7342377e-1, -8.6632643e-2, -1.0450598e-2, -5.1920577e-4,
];
const INVERSE_TO_500 = [
  0, 2.508355e1, 7.860106e-2, -2.503131e-1, 8.31527e-2, -1.228034e-2, 9.804036e-4, -4.41303e-5, 1.057734e-6, -1.052755e-8,
];
const INVERSE_ABOVE_500 = [-1.318058e2, 4.830222e1, -1.646031, 5.464731e-2, -9.650715e-4, 8.802193e-6, -3.11081e-8];
/** E(500 °C), where the two positive inverse ranges meet. */
const EMF_AT_500_MV = 20.644;

function polynomial(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) sum = sum * x + (coefficients[i] ?? 0);
  return sum;
}

function polynomialSlope(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 1; i--) sum = sum * x + i * (coefficients[i] ?? 0);
  return sum;
}

function emf(temperatureC: number): number {
  if (temperatureC < 0) return polynomial(BELOW_ZERO, temperatureC);
  return polynomial(ABOVE_ZERO, temperatureC) + A0 * Math.exp(A1 * (temperatureC - A2) ** 2);
}

/** Seebeck coefficient dE/dt in mV/°C. */
function seebeck(temperatureC: number): number {
  if (temperatureC < 0) return polynomialSlope(BELOW_ZERO, temperatureC);
  const offset = temperatureC - A2;
  return polynomialSlope(ABOVE_ZERO, temperatureC) + 2 * A0 * A1 * offset * Math.exp(A1 * offset ** 2);
}

const EMF_MIN_MV = emf(TYPE_K_MIN_C);
const EMF_MAX_MV = emf(TYPE_K_MAX_C);

export function typeKEmfMv(temperatureC: number): number {
  requireFinite("temperatureC", temperatureC);
  if (temperatureC < TYPE_K_MIN_C || temperatureC > TYPE_K_MAX_C) {
    throw new Error(`temperatureC ${temperatureC} °C is outside type K's ITS-90 range of ${TYPE_K_MIN_C} to ${TYPE_K_MAX_C} °C`);
  }
  return emf(temperatureC);
}

/**
 * The inverse polynomials are within −0.05…+0.06 °C of the reference function
 * (NIST's stated error), so their result only starts a safeguarded Newton
 * solve of the reference function itself: EMF → temperature → EMF then round
 * trips exactly, and the −270…−200 °C stretch NIST gives no inverse for is
 * covered too. Down there the Seebeck coefficient falls towards zero, so a
 * microvolt of reading error is worth degrees.
 */
export function typeKTemperatureC(emfMv: number): number {
  requireFinite("emfMv", emfMv);
  if (emfMv < EMF_MIN_MV || emfMv > EMF_MAX_MV) {
    throw new Error(
      `emfMv ${emfMv} mV is outside type K's ITS-90 range of ${EMF_MIN_MV.toFixed(3)} to ${EMF_MAX_MV.toFixed(3)} mV (${TYPE_K_MIN_C} to ${TYPE_K_MAX_C} °C)`,
    );
  }
  const inverse = emfMv < 0 ? INVERSE_BELOW_ZERO : emfMv < EMF_AT_500_MV ? INVERSE_TO_500 : INVERSE_ABOVE_500;
  let low = TYPE_K_MIN_C;
  let high = TYPE_K_MAX_C;
  let temperature = Math.min(high, Math.max(low, polynomial(inverse, emfMv)));
  for (let iteration = 0; iteration < 200; iteration++) {
    const error = emf(temperature) - emfMv;
    if (Math.abs(error) <= 1e-12) break;
    if (error > 0) high = temperature;
    else low = temperature;
    const newton = temperature - error / seebeck(temperature);
    temperature = newton > low && newton < high ? newton : (low + high) / 2;
  }
  return temperature;
}

export interface ColdJunctionCompensated {
  temperatureC: number;
  /** EMF referred to a 0 °C junction: measured + E(cold junction). */
  totalEmfMv: number;
  coldJunctionEmfMv: number;
}

/** A meter reads the EMF between hot and cold junctions; adding E(T_cj) refers it to 0 °C before inverting. */
export function typeKTemperatureWithColdJunction(input: { measuredEmfMv: number; coldJunctionC: number }): ColdJunctionCompensated {
  const measured = requireFinite("measuredEmfMv", input.measuredEmfMv);
  const coldJunctionEmfMv = typeKEmfMv(requireFinite("coldJunctionC", input.coldJunctionC));
  const totalEmfMv = measured + coldJunctionEmfMv;
  return { temperatureC: typeKTemperatureC(totalEmfMv), totalEmfMv, coldJunctionEmfMv };
}
