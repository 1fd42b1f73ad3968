"use client";

import { Bar, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export type HarmonicBar = { order: number; amps: number; limitAmps: number | null };

/** Harmonic currents as bars with the IEC 61000-3-2 limit of each order drawn across them. */
export function HarmonicPlot({ orders }: { orders: HarmonicBar[] }) {
  return (
    <div className="h-64 w-full">
      {/* No keyboard layer: EmbedFigure hides the drawing from assistive technology and gives its figures in words, and a
          focusable chart inside that hidden part would take keyboard focus to something no screen reader announces. */}
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={orders} accessibilityLayer={false} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="#d6cfbf" strokeDasharray="3 3" />
          <XAxis dataKey="order" fontSize={11} />
          <YAxis fontSize={11} width={52} tickFormatter={(value: number) => `${value} A`} />
          <Tooltip formatter={(value) => (typeof value === "number" ? `${value.toFixed(3)} A` : String(value))} labelFormatter={(label) => `Order ${label}`} />
          <Legend wrapperStyle={{ fontSize: 12 }} />
          <Bar dataKey="amps" name="Measured" fill="#a5481f" isAnimationActive={false} />
          <Line dataKey="limitAmps" name="Limit" stroke="#1f232b" strokeDasharray="4 2" dot={false} type="step" isAnimationActive={false} connectNulls />
        </ComposedChart>
      </ResponsiveContainer>
    </div>
  );
}
