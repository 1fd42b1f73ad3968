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

// One fixed locale and time zone, so the server's render and the reader's hydration agree on every date.
const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" });
const dateTimeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

export function formatDate(date: Date): string {
  return dateFormat.format(date);
}

/** With the time, marked UTC so no one reads it as their local time. */
export function formatDateTime(date: Date): string {
  return `${dateTimeFormat.format(date)} UTC`;
}
