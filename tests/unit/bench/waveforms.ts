// Synthetic captures with known answers for the bench math tests.

export interface Mains {
  frequencyHz: number;
  sampleRateHz: number;
  seconds: number;
}

export function sampleCount({ sampleRateHz, seconds }: Mains): number {
  return Math.round(sampleRateHz * seconds);
}

/** v(t) = √2·U·sin(2πft + phase). */
export function mainsVoltage(mains: Mains, rmsVolts: number, phase = 0): Float64Array {
  const samples = new Float64Array(sampleCount(mains));
  for (let k = 0; k < samples.length; k++) {
    samples[k] = Math.SQRT2 * rmsVolts * Math.sin((2 * Math.PI * mains.frequencyHz * k) / mains.sampleRateHz + phase);
  }
  return samples;
}

/**
 * Current through a resistance across `voltage` (which starts at phase 0, so
 * half-cycle j is positive for even j), conducting in the half-cycles that
 * `conducts` picks.
 */
export function switchedResistor(mains: Mains, voltage: Float64Array, ohms: number, conducts: (halfCycle: number) => boolean): Float64Array {
  const current = new Float64Array(voltage.length);
  for (let k = 0; k < voltage.length; k++) {
    const halfCycle = Math.floor((2 * mains.frequencyHz * k) / mains.sampleRateHz);
    current[k] = conducts(halfCycle) ? (voltage[k] as number) / ohms : 0;
  }
  return current;
}

/** Burst-fire: `on` whole cycles conducting, then `off` whole cycles blocked. */
export function burstFire(on: number, off: number): (halfCycle: number) => boolean {
  return (halfCycle) => Math.floor(halfCycle / 2) % (on + off) < on;
}

/** Σ √2·I_h·sin(2πhft + φ_h) for the given RMS harmonic currents. */
export function harmonicCurrent(mains: Mains, rmsByOrder: Record<number, number>, phases: Record<number, number> = {}): Float64Array {
  const samples = new Float64Array(sampleCount(mains));
  for (const [orderText, rms] of Object.entries(rmsByOrder)) {
    const order = Number(orderText);
    const phase = phases[order] ?? 0;
    for (let k = 0; k < samples.length; k++) {
      samples[k] = (samples[k] as number) + Math.SQRT2 * rms * Math.sin((2 * Math.PI * order * mains.frequencyHz * k) / mains.sampleRateHz + phase);
    }
  }
  return samples;
}

/** Deterministic noise in ±amplitude, so tests stay repeatable. */
export function addNoise(samples: Float64Array, amplitude: number, seed = 7): Float64Array {
  let state = seed;
  for (let k = 0; k < samples.length; k++) {
    state = (state * 1103515245 + 12345) % 2147483648;
    samples[k] = (samples[k] as number) + amplitude * (2 * (state / 2147483648) - 1);
  }
  return samples;
}

/** A CSV with a time column in seconds, written the way a scope would. */
export function captureCsv(
  sampleRateHz: number,
  columns: Record<string, Float64Array>,
  options: { header?: string[]; delimiter?: string; decimalComma?: boolean; newline?: string } = {},
): string {
  const delimiter = options.delimiter ?? ",";
  const newline = options.newline ?? "\n";
  const format = (value: number) => (options.decimalComma ? String(value).replace(".", ",") : String(value));
  const names = Object.keys(columns);
  const arrays = Object.values(columns);
  const length = arrays[0]?.length ?? 0;
  const lines = [...(options.header ?? []), ["time", ...names].join(delimiter)];
  for (let k = 0; k < length; k++) {
    lines.push([format(k / sampleRateHz), ...arrays.map((array) => format(array[k] as number))].join(delimiter));
  }
  return lines.join(newline) + newline;
}
