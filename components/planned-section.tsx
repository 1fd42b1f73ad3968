import type { ReactNode } from "react";

/** A role's landing page whose tools are still being built: says plainly what will live here. */
export function PlannedSection({ title, intro, items }: { title: string; intro: ReactNode; items: string[] }) {
  return (
    <section className="max-w-3xl space-y-4">
      <h1 className="font-serif text-3xl">{title}</h1>
      <p className="text-ink-soft">{intro}</p>
      <ul className="list-disc space-y-1 pl-6 text-ink-soft">
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </section>
  );
}
