import { embedComponentSpecs } from "@/lib/mdx/policy";

export function EmbedGuide({ labels, imageNames, toolSlugs }: { labels: string[]; imageNames: string[]; toolSlugs: string[] }) {
  return (
    <details className="rounded border border-rule bg-paper-raised p-4 text-sm">
      <summary className="cursor-pointer font-semibold">Components you can use in the body</summary>
      <dl className="mt-3 grid gap-x-4 gap-y-2 sm:grid-cols-[max-content_1fr]">
        {Object.entries(embedComponentSpecs).map(([name, spec]) => (
          <div key={name} className="contents">
            <dt>
              <code className="figure">{spec.usage}</code>
            </dt>
            <dd className="text-ink-soft">{spec.purpose}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 text-ink-soft">
        Labels cited: <span className="figure">{labels.join(", ") || "none yet"}</span> · images: <span className="figure">{imageNames.join(", ") || "none yet"}</span>{" "}
        · tools: <span className="figure">{toolSlugs.join(", ")}</span>
      </p>
    </details>
  );
}
