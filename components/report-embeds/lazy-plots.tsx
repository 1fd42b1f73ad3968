"use client";

import dynamic from "next/dynamic";
import { useEffect, useRef, useState, type ComponentProps, type ReactNode } from "react";
import type { HarmonicPlot } from "./harmonic-chart";
import type { HeatUpPlot } from "./heat-up-curve";
import type { WaveformPlot } from "./waveform-chart";

// The charting library is most of a report page's JavaScript, and the figures it draws are already on the page in words
// and tables. So a drawing's code is fetched only when the drawing comes near the window, and never for a reader who
// does not scroll to it; the placeholder keeps the drawing's height so nothing jumps when it arrives.

function PlotPlaceholder({ height = "h-64" }: { height?: string }) {
  return <div className={`${height} w-full rounded bg-paper-sunk/60 print:hidden`} />;
}

/** Renders its children only once it comes within 200 px of the window; until then the placeholder holds their place. */
export function WhenNearView({ children, height }: { children: ReactNode; height?: string }) {
  const anchor = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const element = anchor.current;
    if (!element || near) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((entry) => entry.isIntersecting)) {
          setNear(true);
          observer.disconnect();
        }
      },
      { rootMargin: "200px 0px" },
    );
    observer.observe(element);
    return () => observer.disconnect();
  }, [near]);
  return <div ref={anchor}>{near ? children : <PlotPlaceholder height={height} />}</div>;
}

const WaveformDrawing = dynamic(() => import("./waveform-chart").then((module) => module.WaveformPlot), { ssr: false, loading: () => <PlotPlaceholder /> });
const HarmonicDrawing = dynamic(() => import("./harmonic-chart").then((module) => module.HarmonicPlot), { ssr: false, loading: () => <PlotPlaceholder /> });
const HeatUpDrawing = dynamic(() => import("./heat-up-curve").then((module) => module.HeatUpPlot), { ssr: false, loading: () => <PlotPlaceholder /> });

export function LazyWaveformPlot(props: ComponentProps<typeof WaveformPlot>) {
  return (
    <WhenNearView>
      <WaveformDrawing {...props} />
    </WhenNearView>
  );
}

export function LazyHarmonicPlot(props: ComponentProps<typeof HarmonicPlot>) {
  return (
    <WhenNearView>
      <HarmonicDrawing {...props} />
    </WhenNearView>
  );
}

export function LazyHeatUpPlot(props: ComponentProps<typeof HeatUpPlot>) {
  return (
    <WhenNearView>
      <HeatUpDrawing {...props} />
    </WhenNearView>
  );
}
