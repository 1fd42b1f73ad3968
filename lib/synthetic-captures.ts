// Invented captures with known physics, written the way bench instruments export them: a burst-fired heater's
// current and voltage, and a heat-up log. The demo seed, the API benchmark and the tests use them. Lines come out a
// block at a time, so a 100 MB capture can stream to storage without being held whole.

/** Deterministic noise in ±1, so the same capture comes out byte for byte every time. */
function noiseSource(seed: number): () => number {
  let state = seed >>> 0 || 1;
  return () => {
    state = (Math.imul(state, 1103515245) + 12345) >>> 0;
    return (state / 0x100000000) * 2 - 1;
  };
}

export type BurstFiredHeater = {
  /** RMS voltage of the source behind the bench socket. */
  supplyVoltage: number;
  frequencyHz: number;
  heaterOhms: number;
  /** Source impedance: the socket voltage sags by this times the current while the heater conducts. */
  sourceOhms: number;
  sampleRateHz: number;
  seconds: number;
  /** Whole cycles on, then off, as a zero-crossing controller holds its setpoint; full demand conducts throughout first. */
  burst: { onCycles: number; offCycles: number };
  fullDemandSeconds: number;
  /** The current column holds amperes divided by this (a 100 mV/A clamp read in volts: 10). */
  currentColumnScale: number;
  noise: { amps: number; volts: number };
  seed: number;
};

export type CaptureLayout = { header: string[]; columns: [string, string, string] | [string, string]; delimiter: string };

const BLOCK_ROWS = 2000;

/** Rows of time, current (as the column holds it) and voltage, after the header lines. */
export function* burstFiredCaptureBlocks(heater: BurstFiredHeater, layout: CaptureLayout): Generator<string> {
  const { supplyVoltage, frequencyHz, heaterOhms, sourceOhms, sampleRateHz, burst, currentColumnScale } = heater;
  const noise = noiseSource(heater.seed);
  const rows = Math.round(heater.seconds * sampleRateHz);
  const peak = Math.SQRT2 * supplyVoltage;
  const period = burst.onCycles + burst.offCycles;
  const d = layout.delimiter;
  yield [...layout.header, layout.columns.join(d)].join("\n") + "\n";
  let block = "";
  for (let k = 0; k < rows; k++) {
    const t = k / sampleRateHz;
    const cycle = Math.floor(t * frequencyHz);
    const conducting = t < heater.fullDemandSeconds || cycle % period < burst.onCycles;
    const source = peak * Math.sin(2 * Math.PI * frequencyHz * t);
    const amps = conducting ? source / (heaterOhms + sourceOhms) : 0;
    const volts = source - amps * sourceOhms + heater.noise.volts * noise();
    const column = (amps + heater.noise.amps * noise()) / currentColumnScale;
    block += `${t.toFixed(7)}${d}${column.toFixed(5)}${d}${volts.toFixed(3)}\n`;
    if ((k + 1) % BLOCK_ROWS === 0) {
      yield block;
      block = "";
    }
  }
  if (block) yield block;
}

export type HeatUpRun = {
  ambientC: number;
  setpointC: number;
  deadTimeS: number;
  timeConstantS: number;
  overshootC: number;
  /** Regulation ripple about the setpoint once settled. */
  rippleC: number;
  intervalS: number;
  seconds: number;
  noiseC: number;
  seed: number;
};

/** A first-order rise after a dead time, a brief overshoot, then the controller's ripple about the setpoint. */
export function* heatUpLogBlocks(run: HeatUpRun, layout: CaptureLayout): Generator<string> {
  const noise = noiseSource(run.seed);
  const d = layout.delimiter;
  yield [...layout.header, layout.columns.join(d)].join("\n") + "\n";
  let block = "";
  const rows = Math.round(run.seconds / run.intervalS) + 1;
  for (let k = 0; k < rows; k++) {
    const t = k * run.intervalS;
    const x = Math.max(0, t - run.deadTimeS) / run.timeConstantS;
    const rise = 1 - Math.exp(-x);
    const bump = x > 0 ? run.overshootC * Math.exp(-(((x - 5) / 1.5) ** 2)) : 0;
    const ripple = run.rippleC * rise ** 8 * Math.sin((2 * Math.PI * t) / 17);
    const temperature = run.ambientC + (run.setpointC - run.ambientC) * rise + bump + ripple + run.noiseC * noise();
    block += `${t.toFixed(1)}${d}${temperature.toFixed(2)}\n`;
    if ((k + 1) % BLOCK_ROWS === 0) {
      yield block;
      block = "";
    }
  }
  if (block) yield block;
}

export function captureText(blocks: Iterable<string>): string {
  let text = "";
  for (const block of blocks) text += block;
  return text;
}
