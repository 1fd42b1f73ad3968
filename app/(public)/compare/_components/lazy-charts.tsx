"use client";

import dynamic from "next/dynamic";

// The charting library is most of a chart's weight: it loads in the browser after the page, whose figures and tables
// are already server-rendered, so the first load stays light.

function ChartPlaceholder({ height }: { height: string }) {
  return <div className={`${height} w-full animate-pulse rounded bg-paper-sunk`} />;
}

export const LazyHeatUpOverlay = dynamic(() => import("./heat-up-overlay").then((module) => module.HeatUpOverlay), {
  ssr: false,
  loading: () => <ChartPlaceholder height="h-72" />,
});

export const LazyHarmonicPlot = dynamic(() => import("@/components/report-embeds/harmonic-chart").then((module) => module.HarmonicPlot), {
  ssr: false,
  loading: () => <ChartPlaceholder height="h-64" />,
});
