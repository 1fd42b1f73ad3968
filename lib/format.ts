export function formatRatedVoltage(min: number, max: number): string {
  return min === max ? `${min} V` : `${min}–${max} V`;
}

export function formatFrequencies(frequenciesHz: readonly number[]): string {
  return `${frequenciesHz.join("/")} Hz`;
}

export function formatPrice(priceMinor: number | null, currency: string | null): string {
  if (priceMinor === null || !currency) return "—";
  return new Intl.NumberFormat("en", { style: "currency", currency }).format(priceMinor / 100);
}

export function formatRange(min: number | null, max: number | null, unit: string): string {
  if (min === null || max === null) return "—";
  return `${min}–${max} ${unit}`;
}

export function formatOptional(value: number | null, unit: string): string {
  return value === null ? "—" : `${value} ${unit}`;
}
