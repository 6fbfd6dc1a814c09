"use client";

import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from "recharts";
import type { AttemptDay } from "@/lib/gradebook";
import { plural } from "@/lib/gradebook/words";
import { chartColours } from "./chart-colours";

const shortDay = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", timeZone: "UTC" });
const formatDay = (day: string) => shortDay.format(new Date(`${day}T00:00:00Z`));

function summarise(days: AttemptDay[]): string {
  const passed = days.reduce((sum, d) => sum + d.passed, 0);
  const failed = days.reduce((sum, d) => sum + d.failed, 0);
  if (passed + failed === 0) return "No lab attempts yet.";
  const busiest = days.reduce((top, d) => (d.passed + d.failed > top.passed + top.failed ? d : top));
  return `${plural(passed + failed, "lab attempt")} over ${plural(days.length, "day")}: ${passed} passed, ${failed} failed. Busiest day ${formatDay(busiest.day)} with ${busiest.passed + busiest.failed}.`;
}

/** The cohort's lab attempts per day (UTC), passed and failed stacked. */
export function AttemptsPerDayChart({ days }: { days: AttemptDay[] }) {
  const summary = summarise(days);
  return (
    <figure>
      <figcaption className="text-base font-semibold">Lab attempts per day</figcaption>
      {days.length === 0 ? (
        <p className="mt-3 text-sm text-ink-soft">The cohort has not started yet.</p>
      ) : (
        <>
          <div className="mt-3" role="img" aria-label={summary}>
            <BarChart data={days} height={220} responsive style={{ width: "100%" }} margin={{ top: 8, right: 8, bottom: 4, left: 0 }}>
              <CartesianGrid stroke={chartColours.grid} vertical={false} />
              <XAxis dataKey="day" tickFormatter={formatDay} tick={{ fontSize: 11, fill: chartColours.axis }} minTickGap={24} height={28} />
              <YAxis allowDecimals={false} tick={{ fontSize: 12, fill: chartColours.axis }} width={32} />
              <Tooltip labelFormatter={(day) => formatDay(String(day))} />
              <Legend wrapperStyle={{ fontSize: 12 }} />
              <Bar dataKey="passed" name="Passed" stackId="day" fill={chartColours.ok} isAnimationActive={false} />
              <Bar dataKey="failed" name="Failed" stackId="day" fill={chartColours.copper} isAnimationActive={false} />
            </BarChart>
          </div>
          <p className="mt-2 text-sm text-ink-soft">{summary}</p>
        </>
      )}
    </figure>
  );
}
