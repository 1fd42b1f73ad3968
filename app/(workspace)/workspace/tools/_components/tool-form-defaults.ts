import type { ToolForEditing } from "@/db/queries/tools";
import { motorShareChoices } from "@/lib/validations/tool";

const text = (value: number | string | null) => (value === null ? "" : String(value));

/** A stored tool as the form's field values, the inverse of the form schema's transform. */
export function toolFormDefaults(tool: ToolForEditing): Record<string, string> {
  const motorShare = Object.entries(motorShareChoices).find(([, value]) => value === tool.motorShareAboveHalf)?.[0] ?? "";
  const values: Record<string, string> = {
    makerId: tool.makerId,
    model: tool.model,
    category: tool.category,
    applianceType: tool.applianceType,
    motorShare,
    ratedPowerW: text(tool.ratedPowerW),
    ratedVoltageMin: text(tool.ratedVoltageMin),
    ratedVoltageMax: tool.ratedVoltageMax === tool.ratedVoltageMin ? "" : text(tool.ratedVoltageMax),
    ratedFrequency: tool.ratedFrequenciesHz.join("/"),
    ratedAirflowLpm: text(tool.ratedAirflowLpm),
    temperatureMinC: text(tool.temperatureMinC),
    temperatureMaxC: text(tool.temperatureMaxC),
    claimedHeatUpSeconds: text(tool.claimedHeatUpSeconds),
    price: tool.priceMinor === null ? "" : (tool.priceMinor / 100).toFixed(2),
    currency: text(tool.currency),
    summary: tool.summary,
  };
  tool.accessories.forEach((accessory, index) => {
    values[`accessories.${index}.kind`] = accessory.kind;
    values[`accessories.${index}.name`] = accessory.name;
    values[`accessories.${index}.size`] = accessory.size ?? "";
  });
  return values;
}
