import type { ToolAccessory } from "@/db/schema";

/** What comes in the box, in the maker's order, each size beside its name. */
export function AccessoryList({ accessories, className = "" }: { accessories: readonly ToolAccessory[]; className?: string }) {
  return (
    <ul className={`list-disc ${className}`}>
      {/* A static list in the maker's order, and the same nozzle often comes in several sizes: index keys are right here. */}
      {accessories.map((accessory, index) => (
        <li key={index}>
          {accessory.name}
          {accessory.size ? <span className="figure text-ink-soft"> ({accessory.size})</span> : null}
        </li>
      ))}
    </ul>
  );
}
