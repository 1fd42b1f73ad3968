// Deterministic draws for Monte Carlo checks of the uncertainty arithmetic.

/** mulberry32: a small seeded 32-bit PRNG, uniform on [0, 1). */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** One draw from a rectangular distribution on [−halfWidth, +halfWidth]. */
export function rectangular(random: () => number, halfWidth: number): number {
  return (2 * random() - 1) * halfWidth;
}

export function standardDeviation(values: readonly number[]): number {
  const mean = values.reduce((sum, value) => sum + value, 0) / values.length;
  const sumOfSquares = values.reduce((sum, value) => sum + (value - mean) ** 2, 0);
  return Math.sqrt(sumOfSquares / (values.length - 1));
}
