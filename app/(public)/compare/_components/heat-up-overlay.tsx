"use client";

import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export type HeatUpTrace = { key: string; name: string; color: string; timeS: number[]; temperatureC: number[] };

/** Both tools' heat-up curves on one time axis from switch-on, with each distinct setpoint as a dashed line. */
export function HeatUpOverlay({ traces, setpointsC }: { traces: HeatUpTrace[]; setpointsC: number[] }) {
  return (
    <div className="h-72 w-full">
      <ResponsiveContainer width="100%" height="100%">
        {/* Hidden from screen readers (the table beside it has the figures), so it must take no keyboard focus either. */}
        <LineChart accessibilityLayer={false} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="#d6cfbf" strokeDasharray="3 3" />
          <XAxis dataKey="t" type="number" domain={[0, "dataMax"]} allowDuplicatedCategory={false} tickFormatter={(value: number) => `${Math.round(value)} s`} fontSize={11} />
          <YAxis fontSize={11} width={56} domain={["auto", "auto"]} tickFormatter={(value: number) => `${value} °C`} />
          <Tooltip formatter={(value) => (typeof value === "number" ? `${value.toFixed(1)} °C` : String(value))} labelFormatter={(label) => `${Number(label).toFixed(1)} s`} />
          <Legend wrapperStyle={{ fontSize: 12 }} />
          {setpointsC.map((setpoint) => (
            <ReferenceLine key={setpoint} y={setpoint} stroke="#1f232b" strokeDasharray="4 2" />
          ))}
          {traces.map((trace) => (
            <Line
              key={trace.key}
              data={trace.timeS.map((t, index) => ({ t, temperature: trace.temperatureC[index] }))}
              dataKey="temperature"
              name={trace.name}
              stroke={trace.color}
              dot={false}
              strokeWidth={1.75}
              isAnimationActive={false}
            />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
