// Numbers in embedded figures: a measured value is rounded to the decimal place of its expanded uncertainty,
// which is given to two significant digits (GUM 7.2.6), so no digit is shown that the measurement cannot back.

export function formatNumber(value: number | null | undefined, significantDigits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return new Intl.NumberFormat("en", { maximumSignificantDigits: significantDigits, useGrouping: false }).format(value);
}

export function decimalsForUncertainty(uncertainty: number): number {
  if (!(uncertainty > 0)) return 2;
  return Math.max(0, 1 - Math.floor(Math.log10(uncertainty)));
}

export function formatMeasured(value: number, expandedUncertainty: number | null, unit: string): string {
  if (expandedUncertainty === null || !(expandedUncertainty > 0)) return `${formatNumber(value)} ${unit}`;
  const decimals = decimalsForUncertainty(expandedUncertainty);
  return `${value.toFixed(decimals)} ± ${expandedUncertainty.toFixed(decimals)} ${unit}`;
}

/** Limits share the measured value's rounding, so a reader can compare them digit by digit. */
export function formatLimits(lower: number | null, upper: number | null, unit: string, decimals: number): string {
  const side = (value: number | null) => (value === null ? "no limit" : value.toFixed(decimals));
  if (lower === null && upper === null) return "—";
  return `${side(lower)} to ${side(upper)} ${unit}`;
}
