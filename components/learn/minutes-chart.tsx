"use client";
// Minutes practised per day over the last four weeks (issue 6 item 2), drawn with recharts. The
// same numbers are in a visually hidden table, so a screen reader gets them without the drawing.
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export type MinutesChartProps = { days: { day: string; minutes: number }[] };

const short = (day: string) => {
  const [, m, d] = day.split("-").map(Number);
  return `${d}/${m}`;
};

export function MinutesChart({ days }: MinutesChartProps) {
  const total = days.reduce((n, d) => n + d.minutes, 0);
  return (
    <figure className="flex flex-col gap-2">
      <div className="h-56 w-full" aria-hidden="true" data-testid="minutes-chart">
        <ResponsiveContainer width="100%" height="100%">
          {/* No keyboard layer: the drawing is hidden from assistive technology, the table below says it all. */}
          <BarChart accessibilityLayer={false} data={days} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
            <CartesianGrid vertical={false} stroke="#D9C8B0" />
            <XAxis dataKey="day" tickFormatter={short} interval={6} tick={{ fill: "#5E4B3C", fontSize: 12 }} />
            <YAxis allowDecimals={false} tick={{ fill: "#5E4B3C", fontSize: 12 }} />
            <Tooltip labelFormatter={(d) => String(d)} formatter={(v) => [`${String(v)} min`, "Practice"]} />
            <Bar dataKey="minutes" fill="#2F5D3A" radius={[3, 3, 0, 0]} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-small text-bark">{`${total} minutes over the last ${days.length} days`}</figcaption>
      <table className="sr-only">
        <caption>Minutes practised per day</caption>
        <thead>
          <tr>
            <th scope="col">Day</th>
            <th scope="col">Minutes</th>
          </tr>
        </thead>
        <tbody>
          {days.map((d) => (
            <tr key={d.day}>
              <td>{d.day}</td>
              <td>{d.minutes}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
