"use client";

import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

/** Current (and voltage, when captured) against time, from the analysis's downsampled min/max envelope. */
export function WaveformPlot({ timeS, current, voltage }: { timeS: number[]; current: number[]; voltage: number[] | null }) {
  const data = timeS.map((t, index) => ({ ms: t * 1000, current: current[index], voltage: voltage?.[index] }));
  return (
    <div className="h-64 w-full">
      {/* No keyboard layer: EmbedFigure hides the drawing from assistive technology and gives its figures in words, and a
          focusable chart inside that hidden part would take keyboard focus to something no screen reader announces. */}
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} accessibilityLayer={false} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="#d6cfbf" strokeDasharray="3 3" />
          <XAxis dataKey="ms" type="number" domain={["dataMin", "dataMax"]} tickFormatter={(value: number) => `${Math.round(value)} ms`} fontSize={11} />
          <YAxis yAxisId="current" fontSize={11} width={48} tickFormatter={(value: number) => `${value} A`} />
          {voltage ? <YAxis yAxisId="voltage" orientation="right" fontSize={11} width={52} tickFormatter={(value: number) => `${value} V`} /> : null}
          <Tooltip formatter={(value) => (typeof value === "number" ? value.toFixed(2) : String(value))} labelFormatter={(label) => `${Number(label).toFixed(1)} ms`} />
          <Line yAxisId="current" dataKey="current" name="Current (A)" stroke="#a5481f" dot={false} isAnimationActive={false} strokeWidth={1} />
          {voltage ? (
            <Line yAxisId="voltage" dataKey="voltage" name="Voltage (V)" stroke="#2c6e68" dot={false} isAnimationActive={false} strokeWidth={1} />
          ) : null}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
