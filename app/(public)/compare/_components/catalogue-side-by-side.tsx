import { AccessoryList } from "@/components/accessory-list";
import type { getToolBySlug } from "@/db/queries/catalogue";
import { formatFrequencies, formatOptional, formatPrice, formatRange, formatRatedVoltage } from "@/lib/format";
import { toolCategoryLabels } from "@/lib/validations/catalogue";
import { SideBySideTable, type SideBySideRow } from "./compare-table";

export type CatalogueTool = NonNullable<Awaited<ReturnType<typeof getToolBySlug>>>;

const rows: SideBySideRow<CatalogueTool>[] = [
  { label: "Kind of tool", value: (tool) => toolCategoryLabels[tool.category], words: true },
  { label: "Rated power input", value: (tool) => `${tool.ratedPowerW} W` },
  { label: "Rated voltage", value: (tool) => formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax) },
  { label: "Rated frequency", value: (tool) => formatFrequencies(tool.ratedFrequenciesHz) },
  { label: "Rated airflow", value: (tool) => formatOptional(tool.ratedAirflowLpm, "L/min") },
  { label: "Temperature range", value: (tool) => formatRange(tool.temperatureMinC, tool.temperatureMaxC, "°C") },
  { label: "Claimed heat-up time", value: (tool) => formatOptional(tool.claimedHeatUpSeconds, "s") },
  { label: "Price", value: (tool) => formatPrice(tool.priceMinor, tool.currency) },
  {
    label: "In the box",
    value: (tool) => (tool.accessories.length ? <AccessoryList accessories={tool.accessories} className="space-y-0.5 pl-4" /> : <span className="text-ink-faint">None listed</span>),
    words: true,
  },
];

/** The catalogue's side of the comparison: ratings as the makers state them, price and what comes in the box. */
export function CatalogueSideBySide({ a, b }: { a: CatalogueTool; b: CatalogueTool }) {
  return (
    <div className="rounded border border-rule bg-paper-raised">
      <SideBySideTable caption="Ratings, price and accessories of both tools, as the catalogue lists them" rows={rows} a={a} b={b} names={{ a: `${a.maker} ${a.model}`, b: `${b.maker} ${b.model}` }} />
    </div>
  );
}
