/**
 * Test signals of IEC 61000-4-15: a sinusoidal supply voltage whose amplitude is modulated
 * sinusoidally or rectangularly, with ΔV/V the peak-to-peak relative change; and the current of a
 * burst-fired resistive heater.
 */

export interface ModulatedVoltage {
  shape: "sinusoidal" | "rectangular";
  modulationHz: number;
  deltaVOverVPercent: number;
  supplyHz: number;
  rmsVolts: number;
  sampleRateHz: number;
  seconds: number;
  /** Time of an upward change of the rectangular modulation (and a zero of the sinusoidal one). */
  phaseOriginSeconds: number;
}

export function modulatedVoltage(s: ModulatedVoltage): Float64Array {
  const n = Math.round(s.seconds * s.sampleRateHz);
  const out = new Float64Array(n);
  const peak = s.rmsVolts * Math.SQRT2;
  const half = s.deltaVOverVPercent / 200;
  for (let i = 0; i < n; i++) {
    const t = i / s.sampleRateHz;
    const phase = s.modulationHz * (t - s.phaseOriginSeconds);
    const m =
      s.shape === "sinusoidal"
        ? Math.sin(2 * Math.PI * phase)
        : phase - Math.floor(phase) < 0.5
          ? 1
          : -1;
    out[i] = peak * (1 + half * m) * Math.sin(2 * Math.PI * s.supplyHz * t);
  }
  return out;
}

/** Rectangular modulation frequency for a rate of changes per minute: two changes a period. */
export function rectangularHzForChangesPerMinute(changesPerMinute: number): number {
  return changesPerMinute / 120;
}

export interface BurstFiredHeater {
  /** Power the heater draws at the nominal voltage while conducting. */
  watts: number;
  nominalVoltage: number;
  supplyHz: number;
  sampleRateHz: number;
  /** Lengths in whole cycles of alternating on and off intervals, starting with on, repeated to fill the capture. */
  intervalCycles: readonly number[];
  cycles: number;
  /** Current noise, amperes r.m.s., from a fixed pseudo-random sequence. */
  noiseAmps?: number;
}

/**
 * Integral-cycle (burst-fire) current of a resistor R = U²/P switched at the zero crossings of the
 * supply, measured on a stiff supply at the nominal voltage.
 */
export function burstFiredHeaterCurrent(h: BurstFiredHeater): Float64Array {
  const samplesPerCycle = h.sampleRateHz / h.supplyHz;
  const n = Math.round(h.cycles * samplesPerCycle);
  const out = new Float64Array(n);
  const peak = (h.watts / h.nominalVoltage) * Math.SQRT2;
  const conducting = new Uint8Array(h.cycles);
  for (let cycle = 0, k = 0, on = true; cycle < h.cycles; k = (k + 1) % h.intervalCycles.length, on = !on) {
    const length = h.intervalCycles[k]!;
    for (let c = 0; c < length && cycle < h.cycles; c++, cycle++) conducting[cycle] = on ? 1 : 0;
  }
  let seed = 12345;
  const uniform = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 2 ** 32 - 0.5;
  };
  const noise = (h.noiseAmps ?? 0) * Math.sqrt(12);
  for (let i = 0; i < n; i++) {
    const cycle = Math.min(h.cycles - 1, Math.floor(i / samplesPerCycle));
    const current = conducting[cycle] ? peak * Math.sin((2 * Math.PI * h.supplyHz * i) / h.sampleRateHz) : 0;
    out[i] = noise === 0 ? current : current + noise * uniform();
  }
  return out;
}
