import type { InstrumentForEditing } from "@/db/queries/instruments";
import { formatAccuracySpec } from "@/lib/validations/instrument";

/** A stored instrument as the form's field values. */
export function instrumentFormDefaults(instrument: InstrumentForEditing): Record<string, string> {
  const values: Record<string, string> = {
    kind: instrument.kind,
    labId: instrument.labId ?? "",
    maker: instrument.maker,
    model: instrument.model,
    serialNumber: instrument.serialNumber,
    calibratedOn: instrument.calibratedOn,
    calibrationDueOn: instrument.calibrationDueOn,
  };
  instrument.accuracy.forEach((range, index) => {
    values[`accuracy.${index}.quantity`] = range.quantity;
    values[`accuracy.${index}.unit`] = range.unit;
    values[`accuracy.${index}.rangeMax`] = String(range.rangeMax);
    values[`accuracy.${index}.spec`] = formatAccuracySpec(range);
  });
  return values;
}
