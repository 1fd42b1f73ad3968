// The database enum is built from this tuple (db/schema/bench.ts); this module stays free of imports so client code
// and zod can use it.
export const measurementKinds = [
  "power_input_full_demand",
  "power_input_at_setpoint",
  "standby_power",
  "inrush_peak_current",
  "current",
  "airflow",
  "heat_up_time",
  "temperature_vs_setpoint",
  "temperature_vs_display",
  "temperature_stability",
  "recovery_under_load",
  "tip_to_ground_resistance",
  "leakage_voltage",
] as const;

export type MeasurementKind = (typeof measurementKinds)[number];

/** What each measured quantity is called on every page, and the unit it is recorded in. */
export const measurementKindInfo = {
  power_input_full_demand: { label: "Power input at full demand", unit: "W" },
  power_input_at_setpoint: { label: "Power input at setpoint", unit: "W" },
  standby_power: { label: "Idle or standby power", unit: "W" },
  inrush_peak_current: { label: "Inrush peak current", unit: "A" },
  current: { label: "Current (true RMS)", unit: "A" },
  airflow: { label: "Airflow", unit: "L/min" },
  heat_up_time: { label: "Heat-up time", unit: "s" },
  temperature_vs_setpoint: { label: "Outlet or tip temperature against setpoint", unit: "°C" },
  temperature_vs_display: { label: "Outlet or tip temperature against the tool's display", unit: "°C" },
  temperature_stability: { label: "Temperature stability at setpoint", unit: "°C" },
  recovery_under_load: { label: "Recovery under load", unit: "s" },
  tip_to_ground_resistance: { label: "Tip-to-ground resistance", unit: "Ω" },
  leakage_voltage: { label: "Tip leakage voltage", unit: "mV" },
} as const satisfies Record<MeasurementKind, { label: string; unit: string }>;

export function measurementKindLabel(kind: MeasurementKind): string {
  return measurementKindInfo[kind].label;
}
