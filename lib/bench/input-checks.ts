// Guards shared by the bench math modules. Each names the offending input so a
// reviewer who typed a bad number into a form or a CLI flag can find it.

export function requireFinite(name: string, value: number): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new Error(`${name} must be a finite number, got ${String(value)}`);
  }
  return value;
}

export function requirePositive(name: string, value: number): number {
  requireFinite(name, value);
  if (value <= 0) throw new Error(`${name} must be greater than 0, got ${value}`);
  return value;
}

export function requireNonNegative(name: string, value: number): number {
  requireFinite(name, value);
  if (value < 0) throw new Error(`${name} must not be negative, got ${value}`);
  return value;
}

export function requireFiniteList(name: string, values: readonly number[], minLength: number): readonly number[] {
  if (!Array.isArray(values)) throw new Error(`${name} must be a list of numbers`);
  if (values.length < minLength) {
    const needed = minLength === 1 ? "at least one value" : `at least ${minLength} values`;
    throw new Error(`${name} needs ${needed}, got ${values.length}`);
  }
  values.forEach((value, index) => requireFinite(`${name}[${index}]`, value));
  return values;
}
