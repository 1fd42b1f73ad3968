import type { getToolBySlug } from "@/db/queries/catalogue";

export type CatalogueTool = NonNullable<Awaited<ReturnType<typeof getToolBySlug>>>;
import { formatFrequencies, formatOptional, formatPrice, formatRange, formatRatedVoltage } from "@/lib/format";
import { toolCategoryLabels } from "@/lib/validations/catalogue";
import { compareTableClass, compareHeadClass } from "./compare-table";

const rows: { label: string; value: (tool: CatalogueTool) => string; words?: true }[] = [
  { label: "Kind of tool", value: (tool) => toolCategoryLabels[tool.category], words: true },
  { label: "Rated power input", value: (tool) => `${tool.ratedPowerW} W` },
  { label: "Rated voltage", value: (tool) => formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax) },
  { label: "Rated frequency", value: (tool) => formatFrequencies(tool.ratedFrequenciesHz) },
  { label: "Rated airflow", value: (tool) => formatOptional(tool.ratedAirflowLpm, "L/min") },
  { label: "Temperature range", value: (tool) => formatRange(tool.temperatureMinC, tool.temperatureMaxC, "°C") },
  { label: "Claimed heat-up time", value: (tool) => formatOptional(tool.claimedHeatUpSeconds, "s") },
  { label: "Price", value: (tool) => formatPrice(tool.priceMinor, tool.currency) },
];

function accessoryList(tool: CatalogueTool) {
  if (tool.accessories.length === 0) return <span className="text-ink-faint">None listed</span>;
  return (
    <ul className="list-disc space-y-0.5 pl-4">
      {/* The maker's list in its order, and one nozzle often comes in several sizes: index keys are right here. */}
      {tool.accessories.map((accessory, index) => (
        <li key={index}>
          {accessory.name}
          {accessory.size ? <span className="figure text-ink-soft"> ({accessory.size})</span> : null}
        </li>
      ))}
    </ul>
  );
}

/** The catalogue's side of the comparison: ratings as the makers state them, price and what comes in the box. */
export function CatalogueSideBySide({ a, b }: { a: CatalogueTool; b: CatalogueTool }) {
  return (
    <div className="rounded border border-rule bg-paper-raised">
      <table className={compareTableClass}>
        <caption className="sr-only">Ratings, price and accessories of both tools, as the catalogue lists them</caption>
        <thead className={compareHeadClass}>
          <tr>
            <td className="px-3 py-2" />
            <th scope="col" className="px-3 py-2">
              {a.maker} {a.model}
            </th>
            <th scope="col" className="px-3 py-2">
              {b.maker} {b.model}
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.label} className="border-t border-rule align-top">
              <th scope="row" className="px-3 py-2 font-semibold">
                {row.label}
              </th>
              <td className={`${row.words ? "" : "figure "}px-3 py-2`}>{row.value(a)}</td>
              <td className={`${row.words ? "" : "figure "}px-3 py-2`}>{row.value(b)}</td>
            </tr>
          ))}
          <tr className="border-t border-rule align-top">
            <th scope="row" className="px-3 py-2 font-semibold">
              In the box
            </th>
            <td className="px-3 py-2">{accessoryList(a)}</td>
            <td className="px-3 py-2">{accessoryList(b)}</td>
          </tr>
        </tbody>
      </table>
    </div>
  );
}
