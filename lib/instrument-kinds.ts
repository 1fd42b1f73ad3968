// The database enums for instruments are built from these tuples (db/schema/bench.ts), so forms, labels and the
// schema cannot drift apart; this module stays free of imports so client code can use it.

export const instrumentKinds = [
  "current_clamp",
  "oscilloscope",
  "power_meter",
  "thermocouple_meter",
  "anemometer",
  "resistance_meter",
  "multimeter",
] as const;

export type InstrumentKind = (typeof instrumentKinds)[number];

export const instrumentKindLabels: Record<InstrumentKind, string> = {
  current_clamp: "Current clamp",
  oscilloscope: "Oscilloscope",
  power_meter: "Power meter",
  thermocouple_meter: "Thermocouple meter",
  anemometer: "Anemometer",
  resistance_meter: "Resistance meter",
  multimeter: "Multimeter",
};

/** What one accuracy line of a datasheet measures. */
export const accuracyQuantities = ["current", "voltage", "power", "temperature", "air_velocity", "resistance", "time"] as const;

export type AccuracyQuantity = (typeof accuracyQuantities)[number];

/** Each quantity's name and the unit its ranges and offsets are usually written in. */
export const accuracyQuantityInfo: Record<AccuracyQuantity, { label: string; unit: string }> = {
  current: { label: "Current", unit: "A" },
  voltage: { label: "Voltage", unit: "V" },
  power: { label: "Power", unit: "W" },
  temperature: { label: "Temperature", unit: "°C" },
  air_velocity: { label: "Air velocity", unit: "m/s" },
  resistance: { label: "Resistance", unit: "Ω" },
  time: { label: "Time", unit: "s" },
};
