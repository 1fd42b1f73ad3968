"use client";

import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

/** Temperature against time, the setpoint as a line and the band around it shaded, band entry marked. */
export function HeatUpPlot({
  timeS,
  temperatureC,
  setpointC,
  band,
  bandEntryS,
}: {
  timeS: number[];
  temperatureC: number[];
  setpointC: number | null;
  band: { lowerC: number; upperC: number } | null;
  bandEntryS: number | null;
}) {
  const data = timeS.map((t, index) => ({ t, temperature: temperatureC[index] }));
  return (
    <div className="h-64 w-full">
      {/* No keyboard layer: EmbedFigure hides the drawing from assistive technology and gives its figures in words, and a
          focusable chart inside that hidden part would take keyboard focus to something no screen reader announces. */}
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} accessibilityLayer={false} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="#d6cfbf" strokeDasharray="3 3" />
          <XAxis dataKey="t" type="number" domain={["dataMin", "dataMax"]} tickFormatter={(value: number) => `${Math.round(value)} s`} fontSize={11} />
          <YAxis fontSize={11} width={52} tickFormatter={(value: number) => `${value} °C`} domain={["auto", "auto"]} />
          <Tooltip formatter={(value) => (typeof value === "number" ? `${value.toFixed(1)} °C` : String(value))} labelFormatter={(label) => `${Number(label).toFixed(1)} s`} />
          {band ? <ReferenceArea y1={band.lowerC} y2={band.upperC} fill="#dcebe7" fillOpacity={0.8} /> : null}
          {setpointC !== null ? <ReferenceLine y={setpointC} stroke="#2c6e68" strokeDasharray="4 2" /> : null}
          {bandEntryS !== null ? <ReferenceLine x={bandEntryS} stroke="#7a6420" strokeDasharray="2 2" /> : null}
          <Line dataKey="temperature" name="Temperature (°C)" stroke="#a5481f" dot={false} isAnimationActive={false} strokeWidth={1.5} />
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
