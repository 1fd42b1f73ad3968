"use client";

import type { Root } from "hast";
import { useEffect, useMemo, useState } from "react";
import { embedComponents } from "@/components/report-embeds/embed-components";
import type { MdxProblem } from "@/lib/mdx/compile";
import { renderSafeTree } from "@/lib/mdx/render-tree";
import type { ReportEmbeds } from "@/lib/report-embeds";

type Preview = { tree: Root | null; problems: MdxProblem[]; embeds: ReportEmbeds };
type Compiled = Preview & { source: string };

const DEBOUNCE_MS = 400;

/**
 * Compiles the unsaved text on the server (the same sanitising pipeline the saved report goes through) a moment
 * after typing stops, and renders the returned tree here with the same components. A newer keystroke cancels
 * the request still in flight, so an older answer never overwrites a newer one.
 */
export function MdxPreview({ reportId, source }: { reportId: string; source: string }) {
  const [preview, setPreview] = useState<Compiled | null>(null);
  const [failedSource, setFailedSource] = useState<string | null>(null);

  useEffect(() => {
    const controller = new AbortController();
    const timer = setTimeout(async () => {
      try {
        const response = await fetch(`/api/reports/${reportId}/preview`, {
          method: "POST",
          headers: { "Content-Type": "application/json" },
          body: JSON.stringify({ source }),
          signal: controller.signal,
        });
        if (!response.ok) throw new Error(`preview answered ${response.status}`);
        setPreview({ ...((await response.json()) as Preview), source });
        setFailedSource(null);
      } catch (error) {
        if (!controller.signal.aborted) {
          console.error(error);
          setFailedSource(source);
        }
      }
    }, DEBOUNCE_MS);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [reportId, source]);

  const components = useMemo(() => (preview ? embedComponents(preview.embeds) : null), [preview]);
  // Derived rather than stored, so the label turns to "Updating…" on the keystroke itself, not when the request starts.
  const state = failedSource === source ? "failed" : preview?.source === source ? "ready" : "compiling";

  return (
    <section aria-labelledby="preview-heading" className="flex min-w-0 flex-col gap-2">
      <div className="flex items-baseline justify-between gap-2">
        <h2 id="preview-heading" className="text-sm font-semibold">
          Live preview
        </h2>
        <p role="status" aria-live="polite" className="text-xs text-ink-faint">
          {state === "compiling" ? "Updating…" : state === "failed" ? "The preview could not be updated; it retries as you type." : "Up to date"}
        </p>
      </div>
      {preview && preview.problems.length > 0 ? (
        <div role="alert" className="rounded border border-copper bg-copper-wash px-3 py-2 text-sm text-copper-deep">
          <p className="font-semibold">
            {preview.tree ? `${preview.problems.length} problem${preview.problems.length > 1 ? "s" : ""} in the body` : "The body does not compile"}
          </p>
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {preview.problems.map((problem, index) => (
              <li key={index}>
                {problem.line === null ? "" : `Line ${problem.line}, column ${problem.column}: `}
                {problem.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div data-testid="report-preview" className="prose prose-stone min-h-64 max-w-none rounded border border-rule bg-paper-raised p-4 font-serif prose-headings:font-serif">
        {preview?.tree && components ? renderSafeTree(preview.tree, components) : <p className="text-ink-faint">The preview appears here.</p>}
      </div>
    </section>
  );
}
