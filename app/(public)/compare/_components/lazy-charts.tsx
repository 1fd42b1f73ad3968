"use client";

import dynamic from "next/dynamic";

// The charting library is most of a chart's weight: the overlay loads it in the browser only once rendered (the page
// renders it when scrolled near), after the figures and tables the server already sent, so the first load stays light.
// Single-tool drawings come from components/report-embeds/lazy-plots.tsx.
export const LazyHeatUpOverlay = dynamic(() => import("./heat-up-overlay").then((module) => module.HeatUpOverlay), {
  ssr: false,
  // Holds the drawing's height, so nothing below jumps when it arrives.
  loading: () => <div className="h-72 w-full rounded bg-paper-sunk/60 print:hidden" />,
});
