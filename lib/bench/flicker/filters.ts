/**
 * IIR building blocks for the flickermeter: analog prototypes mapped to the digital domain
 * with the bilinear transform, run as second-order sections in transposed direct form II.
 */

/** One digital second-order section, normalised so that a0 = 1. */
export interface Biquad {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

/** Analog section H(s) = (n2 s² + n1 s + n0) / (d2 s² + d1 s + d0). */
interface AnalogSection {
  n2: number;
  n1: number;
  n0: number;
  d2: number;
  d1: number;
  d0: number;
}

export type Lamp = 230 | 120;

/**
 * Lamp–eye weighting filter (IEC 61000-4-15:2010, block 3), as published in the standard:
 *   W(s) = k·ω1·s / (s² + 2λs + ω1²) · (1 + s/ω2) / ((1 + s/ω3)(1 + s/ω4)),  ω = 2π·f.
 * The values below were confirmed, identical to every digit, in several public flickermeter
 * implementations found by code search that quote the standard as their source, e.g. repository
 * qwtb/qwtb, file `qwtb/alg_flicker_sim/flicker_sim.m`, and the `Pstcalc.pas` unit of an open-source
 * distribution-system simulator.
 */
const WEIGHTING_PARAMETERS: Record<Lamp, { k: number; lambdaHz: number; f1: number; f2: number; f3: number; f4: number }> = {
  230: { k: 1.74802, lambdaHz: 4.05981, f1: 9.15494, f2: 2.27979, f3: 1.22535, f4: 21.9 },
  120: { k: 1.6357, lambdaHz: 4.167375, f1: 9.077169, f2: 2.939902, f3: 1.394468, f4: 17.31512 },
};

const TWO_PI = 2 * Math.PI;

/** Bilinear transform without pre-warping: at the flickermeter's ≥ 1 kHz internal rate the warping at 35–42 Hz is under 0.5 %. */
function bilinear(section: AnalogSection, sampleRateHz: number): Biquad {
  const c = 2 * sampleRateHz;
  const c2 = c * c;
  const { n2, n1, n0, d2, d1, d0 } = section;
  const a0 = d2 * c2 + d1 * c + d0;
  return {
    b0: (n2 * c2 + n1 * c + n0) / a0,
    b1: (2 * n0 - 2 * n2 * c2) / a0,
    b2: (n2 * c2 - n1 * c + n0) / a0,
    a1: (2 * d0 - 2 * d2 * c2) / a0,
    a2: (d2 * c2 - d1 * c + d0) / a0,
  };
}

export function firstOrderHighPass(cutoffHz: number, sampleRateHz: number): Biquad {
  return bilinear({ n2: 0, n1: 1, n0: 0, d2: 0, d1: 1, d0: TWO_PI * cutoffHz }, sampleRateHz);
}

export function firstOrderLowPass(timeConstantSeconds: number, sampleRateHz: number): Biquad {
  return bilinear({ n2: 0, n1: 0, n0: 1, d2: 0, d1: timeConstantSeconds, d0: 1 }, sampleRateHz);
}

/** Butterworth low-pass of even order as order/2 sections with damping ζ = sin((2m − 1)π / 2·order). */
export function butterworthLowPass(order: number, cutoffHz: number, sampleRateHz: number): Biquad[] {
  const wc = TWO_PI * cutoffHz;
  const sections: Biquad[] = [];
  for (let m = 1; m <= order / 2; m++) {
    const zeta = Math.sin(((2 * m - 1) * Math.PI) / (2 * order));
    sections.push(bilinear({ n2: 0, n1: 0, n0: wc * wc, d2: 1, d1: 2 * zeta * wc, d0: wc * wc }, sampleRateHz));
  }
  return sections;
}

export function weightingFilter(lamp: Lamp, sampleRateHz: number): Biquad[] {
  const p = WEIGHTING_PARAMETERS[lamp];
  const w1 = TWO_PI * p.f1;
  const w2 = TWO_PI * p.f2;
  const w3 = TWO_PI * p.f3;
  const w4 = TWO_PI * p.f4;
  const lambda = TWO_PI * p.lambdaHz;
  return [
    bilinear({ n2: 0, n1: p.k * w1, n0: 0, d2: 1, d1: 2 * lambda, d0: w1 * w1 }, sampleRateHz),
    bilinear({ n2: 0, n1: 1 / w2, n0: 1, d2: 1 / (w3 * w4), d1: 1 / w3 + 1 / w4, d0: 1 }, sampleRateHz),
  ];
}

/** |H(e^{jωT})| of a cascade, used to calibrate the flickermeter against its own digital filters. */
export function cascadeMagnitude(sections: readonly Biquad[], frequencyHz: number, sampleRateHz: number): number {
  const w = (TWO_PI * frequencyHz) / sampleRateHz;
  const c1 = Math.cos(w);
  const s1 = Math.sin(w);
  const c2 = Math.cos(2 * w);
  const s2 = Math.sin(2 * w);
  let magnitude = 1;
  for (const q of sections) {
    const numRe = q.b0 + q.b1 * c1 + q.b2 * c2;
    const numIm = -(q.b1 * s1 + q.b2 * s2);
    const denRe = 1 + q.a1 * c1 + q.a2 * c2;
    const denIm = -(q.a1 * s1 + q.a2 * s2);
    magnitude *= Math.hypot(numRe, numIm) / Math.hypot(denRe, denIm);
  }
  return magnitude;
}

/**
 * A cascade of sections with its state, run a block at a time so that each section's loop keeps
 * its coefficients and state in registers; sample by sample they went through memory at every
 * section of every sample, a third of the flickermeter's filtering time. The arithmetic is the same.
 */
export class SectionCascade {
  private readonly coefficients: Float64Array;
  private readonly state: Float64Array;
  private readonly count: number;

  constructor(sections: readonly Biquad[]) {
    // Sections run in pairs; an odd one out is paired with y = x, which a section of b0 = 1 and zeros elsewhere
    // gives exactly (its state stays ±0, and adding ±0 changes no number).
    const paired = sections.length % 2 === 0 ? sections : [...sections, { b0: 1, b1: 0, b2: 0, a1: 0, a2: 0 }];
    this.count = paired.length;
    this.coefficients = new Float64Array(5 * this.count);
    this.state = new Float64Array(2 * this.count);
    paired.forEach((q, i) => this.coefficients.set([q.b0, q.b1, q.b2, q.a1, q.a2], 5 * i));
  }

  /**
   * Filters values[0, length) in place; the state carries over to the next block. Sections go two at a time, the
   * second one sample behind the first: each section's recursion waits on its own previous output, so two
   * independent ones keep the CPU busy where one leaves it waiting. Every section does the same arithmetic in the
   * same order as alone, so the output is the same to the last bit.
   */
  processBlock(values: Float64Array, length: number): void {
    const c = this.coefficients;
    const z = this.state;
    if (length === 0) return;
    for (let i = 0; i < this.count; i += 2) {
      const b0 = c[5 * i]!;
      const b1 = c[5 * i + 1]!;
      const b2 = c[5 * i + 2]!;
      const a1 = c[5 * i + 3]!;
      const a2 = c[5 * i + 4]!;
      const d0 = c[5 * i + 5]!;
      const d1 = c[5 * i + 6]!;
      const d2 = c[5 * i + 7]!;
      const e1 = c[5 * i + 8]!;
      const e2 = c[5 * i + 9]!;
      let z0 = z[2 * i]!;
      let z1 = z[2 * i + 1]!;
      let w0 = z[2 * i + 2]!;
      let w1 = z[2 * i + 3]!;
      let x = values[0]!;
      let y = b0 * x + z0;
      z0 = b1 * x - a1 * y + z1;
      z1 = b2 * x - a2 * y;
      for (let n = 1; n < length; n++) {
        // The second section takes the first's output for sample n − 1 while the first takes sample n.
        const v = d0 * y + w0;
        w0 = d1 * y - e1 * v + w1;
        w1 = d2 * y - e2 * v;
        values[n - 1] = v;
        x = values[n]!;
        y = b0 * x + z0;
        z0 = b1 * x - a1 * y + z1;
        z1 = b2 * x - a2 * y;
      }
      const v = d0 * y + w0;
      w0 = d1 * y - e1 * v + w1;
      w1 = d2 * y - e2 * v;
      values[length - 1] = v;
      z.set([z0, z1, w0, w1], 2 * i);
    }
  }
}
